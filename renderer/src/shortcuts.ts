// Keyboard shortcuts when no menu delivers them (the browser host): Cmd on macOS, Ctrl elsewhere,
// matching the accelerators of the Electron menu.
import type { MenuCommand } from '../../shared-core/host';

export interface KeyLike {
  key: string;
  ctrlKey: boolean;
  metaKey: boolean;
  shiftKey: boolean;
  altKey: boolean;
}

export function shortcutCommand(e: KeyLike, isMac: boolean): MenuCommand | null {
  const primary = isMac ? e.metaKey && !e.ctrlKey : e.ctrlKey && !e.metaKey;
  if (!primary || e.altKey) return null;
  const key = e.key.length === 1 ? e.key.toLowerCase() : e.key;
  switch (key) {
    case 'z':
      return e.shiftKey ? 'redo' : 'undo';
    case 'y':
      // Ctrl+Y is redo on Windows and Linux; on macOS Cmd+Y means something else.
      return !isMac && !e.shiftKey ? 'redo' : null;
    case 's':
      return e.shiftKey ? 'save-as' : 'save';
    case 'e':
      return e.shiftKey ? 'export-png' : 'export-svg';
    case 'o':
      return e.shiftKey ? null : 'open';
    default:
      return null;
  }
}

/** The shortcut as shown in tooltips: "Ctrl+Shift+Z" or "⇧⌘Z". */
export function shortcutLabel(command: MenuCommand, isMac: boolean): string {
  const parts: Record<MenuCommand, [boolean, string]> = {
    open: [false, 'O'],
    save: [false, 'S'],
    'save-as': [true, 'S'],
    'export-svg': [false, 'E'],
    'export-png': [true, 'E'],
    undo: [false, 'Z'],
    redo: [true, 'Z'],
  };
  const [shift, key] = parts[command];
  return isMac ? `${shift ? '⇧' : ''}⌘${key}` : `Ctrl+${shift ? 'Shift+' : ''}${key}`;
}

export function isMacPlatform(): boolean {
  const nav = typeof navigator === 'undefined' ? null : navigator;
  const platform = (nav as (Navigator & { userAgentData?: { platform?: string } }) | null)?.userAgentData?.platform ?? nav?.platform ?? '';
  return /mac/i.test(platform);
}
