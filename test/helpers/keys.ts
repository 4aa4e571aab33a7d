/** A key press for the shortcut tests: no modifier held unless `mods` says so. */
import type { KeyPress } from '../../src/renderer/lib/shortcuts.ts';

export const key = (k: string, mods: Partial<Omit<KeyPress, 'key'>> = {}): KeyPress => ({
  key: k,
  ctrlKey: false,
  metaKey: false,
  shiftKey: false,
  altKey: false,
  ...mods,
});
