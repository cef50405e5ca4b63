import { describe, expect, it } from 'vitest';
import { shortcutCommand, shortcutLabel } from '../../renderer/src/shortcuts';

const key = (k: string, mods: Partial<{ ctrl: boolean; meta: boolean; shift: boolean; alt: boolean }> = {}) => ({
  key: k,
  ctrlKey: mods.ctrl ?? false,
  metaKey: mods.meta ?? false,
  shiftKey: mods.shift ?? false,
  altKey: mods.alt ?? false,
});

describe('shortcutCommand', () => {
  it('maps Ctrl on Windows and Linux and Cmd on macOS to the same commands as the desktop menu', () => {
    expect(shortcutCommand(key('z', { ctrl: true }), false)).toBe('undo');
    expect(shortcutCommand(key('Z', { ctrl: true, shift: true }), false)).toBe('redo');
    expect(shortcutCommand(key('y', { ctrl: true }), false)).toBe('redo');
    expect(shortcutCommand(key('s', { ctrl: true }), false)).toBe('save');
    expect(shortcutCommand(key('S', { ctrl: true, shift: true }), false)).toBe('save-as');
    expect(shortcutCommand(key('e', { ctrl: true }), false)).toBe('export-svg');
    expect(shortcutCommand(key('E', { ctrl: true, shift: true }), false)).toBe('export-png');
    expect(shortcutCommand(key('o', { ctrl: true }), false)).toBe('open');
    expect(shortcutCommand(key('z', { meta: true }), true)).toBe('undo');
    expect(shortcutCommand(key('z', { meta: true, shift: true }), true)).toBe('redo');
  });

  it('ignores the other platform’s modifier, Alt combinations and plain keys', () => {
    expect(shortcutCommand(key('z', { meta: true }), false)).toBeNull();
    expect(shortcutCommand(key('z', { ctrl: true }), true)).toBeNull();
    expect(shortcutCommand(key('z', { ctrl: true, alt: true }), false)).toBeNull();
    expect(shortcutCommand(key('z'), false)).toBeNull();
    expect(shortcutCommand(key('y', { meta: true }), true)).toBeNull();
  });

  it('labels shortcuts the way each platform writes them', () => {
    expect(shortcutLabel('redo', false)).toBe('Ctrl+Shift+Z');
    expect(shortcutLabel('export-svg', true)).toBe('⌘E');
  });
});
