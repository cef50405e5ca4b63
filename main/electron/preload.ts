// Preload: exposes the host contract to the page as `window.tallyglyphHost`, and nothing else.
// Each call is checked before it is sent and each reply when it arrives (the main process checks
// again on its side), and only allowlisted channels are ever used.

import { contextBridge, ipcRenderer } from 'electron';
import {
  HOST_CHANNELS,
  HOST_EVENT_MENU_COMMAND,
  HOST_EVENT_OPEN_REQUEST,
  HOST_GLOBAL_NAME,
  failureFromError,
  parseHostRequest,
  parseHostResult,
  parseMenuCommand,
  type HostApi,
  type HostMethod,
  type HostResult,
  type HostValue,
  type MenuCommand,
  type OpenRequest,
} from '../../shared-core/host';

async function call<M extends HostMethod>(method: M, request: unknown): Promise<HostResult<HostValue<M>>> {
  let checked: unknown;
  try {
    checked = parseHostRequest(method, request);
  } catch (e) {
    return failureFromError(e);
  }
  try {
    return parseHostResult(method, await ipcRenderer.invoke(HOST_CHANNELS[method], checked));
  } catch (e) {
    return failureFromError(e);
  }
}

const host: HostApi = {
  getCapabilities: () => call('getCapabilities', {}),
  openChart: (request) => call('openChart', request),
  saveChart: (request) => call('saveChart', request),
  exportSvg: (request) => call('exportSvg', request),
  exportPng: (request) => call('exportPng', request),
  listRecent: () => call('listRecent', {}),
  exportPdf: (request) => call('exportPdf', request),
  saveRecovery: (request) => call('saveRecovery', request),
  loadRecovery: () => call('loadRecovery', {}),
  clearRecovery: () => call('clearRecovery', {}),
  openSupplied: (request) => call('openSupplied', request),
  exportSheet: (request) => call('exportSheet', request),
  onMenuCommand(listener: (command: MenuCommand) => void) {
    const wrapped = (_event: unknown, payload: unknown) => {
      const command = parseMenuCommand(payload);
      if (command) listener(command);
    };
    ipcRenderer.on(HOST_EVENT_MENU_COMMAND, wrapped);
    return () => {
      ipcRenderer.removeListener(HOST_EVENT_MENU_COMMAND, wrapped);
    };
  },
  onOpenRequest(listener: (requests: OpenRequest[]) => void) {
    // The event only says "documents are waiting"; they are taken through the checked channel, once on
    // subscribing too, so a document passed while the page was still loading is not missed.
    const drain = async () => {
      const taken = await call('takeOpenRequests', {});
      if (taken.ok && taken.value.length > 0) listener(taken.value);
    };
    const wrapped = () => void drain();
    ipcRenderer.on(HOST_EVENT_OPEN_REQUEST, wrapped);
    void drain();
    return () => {
      ipcRenderer.removeListener(HOST_EVENT_OPEN_REQUEST, wrapped);
    };
  },
};

contextBridge.exposeInMainWorld(HOST_GLOBAL_NAME, host);
