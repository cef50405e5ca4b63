// Keyboard shortcuts when no menu delivers them (the browser host): Cmd on macOS, Ctrl elsewhere,
// matching the accelerators of the Electron menu.
import type { MenuCommand } from '../../shared-core/host';

export interface KeyLike {
  key: string;
  ctrlKey: boolean;
  metaKey: boolean;
  shiftKey: boolean;
  altKey: boolean;
  /** The physical key ("KeyE"); with Option held, macOS changes `key` but not `code`. */
  code?: string;
}

export function shortcutCommand(e: KeyLike, isMac: boolean): MenuCommand | null {
  const primary = isMac ? e.metaKey && !e.ctrlKey : e.ctrlKey && !e.metaKey;
  if (!primary) return null;
  const key = e.key.length === 1 ? e.key.toLowerCase() : e.key;
  if (e.altKey) {
    const physical = e.code ? e.code.replace(/^Key/, '').toLowerCase() : key;
    if (e.shiftKey) return null;
    return physical === 'e' ? 'export-pdf' : physical === 'c' ? 'copy-svg' : null;
  }
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
    case 'n':
      // Chromium keeps Ctrl+N for a new window; the desktop menu's accelerator delivers it there.
      return e.shiftKey ? null : 'new';
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
    new: [false, 'N'],
    'export-pdf': [false, 'E'],
    'copy-svg': [false, 'C'],
  };
  const [shift, key] = parts[command];
  const alt = command === 'export-pdf' || command === 'copy-svg';
  return isMac ? `${alt ? '⌥' : ''}${shift ? '⇧' : ''}⌘${key}` : `Ctrl+${alt ? 'Alt+' : ''}${shift ? 'Shift+' : ''}${key}`;
}

export function isMacPlatform(): boolean {
  const nav = typeof navigator === 'undefined' ? null : navigator;
  const platform = (nav as (Navigator & { userAgentData?: { platform?: string } }) | null)?.userAgentData?.platform ?? nav?.platform ?? '';
  return /mac/i.test(platform);
}
