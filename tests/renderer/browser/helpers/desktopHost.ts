// The desktop app's host in a browser test: the page gets `window.tallyglyphHost` forwarding every call
// to the real main-process handlers (main/electron/ipcHandlers.ts) running in this Node process, as the
// Electron preload forwards them over IPC. Native dialogs are answered by the test: it chooses the
// file names, as a designer would in the save dialog.
import path from 'node:path';
import type { BrowserContext } from 'playwright-core';
import { createHostHandlers, type FileKind } from '../../../../main/electron/ipcHandlers';
import { createOpenRequestQueue, type OpenRequestQueue } from '../../../../main/electron/openRequests';
import { HOST_CHANNELS, HOST_GLOBAL_NAME, type HostMethod } from '../../../../shared-core/host';

export interface DesktopHost {
  /** Every save dialog shown: what the app suggested and what the "designer" chose. */
  saves: { suggestedName: string; kind: FileKind; chosen: string | null }[];
  /** The next save dialog's answer: a file name in `folder`, or null to cancel; default: accept the suggestion. */
  nextSaveName: string | null | undefined;
  nextOpenPath: string | null;
  folder: string;
  /** Documents "the operating system" passed: add paths before a page loads and the app opens the first. */
  openRequests: OpenRequestQueue;
}

/** Installs the desktop host in every page of `context`; files go to `folder`. */
export async function installDesktopHost(context: BrowserContext, folder: string): Promise<DesktopHost> {
  const state: DesktopHost = { saves: [], nextSaveName: undefined, nextOpenPath: null, folder, openRequests: createOpenRequestQueue(() => undefined) };
  const handlers = createHostHandlers({
    openRequests: state.openRequests,
    recentFile: path.join(folder, 'recent.json'),
    dialogs: {
      async chooseOpenPath() {
        return state.nextOpenPath;
      },
      async chooseSavePath({ suggestedName, kind }) {
        const name = state.nextSaveName === undefined ? suggestedName : state.nextSaveName;
        state.nextSaveName = undefined;
        const chosen = name === null ? null : path.join(folder, name);
        state.saves.push({ suggestedName, kind, chosen });
        return chosen;
      },
    },
  });
  await context.exposeBinding('__tallyglyphInvoke', async (_source, method: string, payload: unknown) => {
    if (!(method in HOST_CHANNELS)) return { ok: false, error: { code: 'host-refused', message: `No such channel: ${method}` } };
    return handlers[method as HostMethod](payload);
  });
  await context.addInitScript(
    ({ globalName, methods }) => {
      const invoke = (window as unknown as { __tallyglyphInvoke: (m: string, p: unknown) => Promise<unknown> }).__tallyglyphInvoke;
      const host: Record<string, unknown> = { onMenuCommand: () => () => undefined };
      // As the preload does: documents waiting when the app subscribes are taken through the checked channel.
      host.onOpenRequest = (listener: (requests: unknown[]) => void) => {
        void invoke('takeOpenRequests', {}).then((r) => {
          const result = r as { ok: boolean; value?: unknown[] };
          if (result.ok && result.value && result.value.length > 0) listener(result.value);
        });
        return () => undefined;
      };
      for (const m of methods) host[m] = (request?: unknown) => invoke(m, request ?? {});
      Object.defineProperty(window, globalName, { value: Object.freeze(host), configurable: false, writable: false });
    },
    { globalName: HOST_GLOBAL_NAME, methods: Object.keys(HOST_CHANNELS) },
  );
  return state;
}
