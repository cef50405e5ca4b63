// Chooses the host: the Electron preload's when it exposed one, otherwise the browser's.
import { HOST_GLOBAL_NAME, type HostApi } from '../../../shared-core/host';
import { createBrowserHost } from './browserHost';

function looksLikeHost(value: unknown): value is HostApi {
  if (typeof value !== 'object' || value === null) return false;
  const v = value as Record<string, unknown>;
  return ['getCapabilities', 'openChart', 'saveChart', 'exportSvg', 'exportPng', 'listRecent', 'openSupplied', 'exportSheet', 'onMenuCommand'].every((k) => typeof v[k] === 'function');
}

export function pickHost(): HostApi {
  const exposed = (globalThis as Record<string, unknown>)[HOST_GLOBAL_NAME];
  return looksLikeHost(exposed) ? exposed : createBrowserHost();
}
