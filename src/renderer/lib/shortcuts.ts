/**
 * Keyboard shortcuts: the bindings of the command table (src/shared/commands.ts), the same keys
 * in the desktop app (where the menu shows them) and in web mode. Ctrl on Windows/Linux, Cmd on
 * macOS; the modifiers must match exactly (Ctrl+Shift+S is not Ctrl+S).
 */
import { COMMANDS, type KeyBinding, type MenuCommand } from '../../shared/commands.ts';

export interface KeyPress {
  key: string;
  ctrlKey: boolean;
  metaKey: boolean;
  shiftKey: boolean;
  altKey: boolean;
}

function matches(k: KeyPress, binding: KeyBinding): boolean {
  return (
    k.key.toLowerCase() === binding.key &&
    (k.ctrlKey || k.metaKey) === (binding.mod === true) &&
    k.shiftKey === (binding.shift === true) &&
    k.altKey === (binding.alt === true)
  );
}

export function commandForKey(k: KeyPress): MenuCommand | null {
  for (const command of COMMANDS) if (command.keys.some((binding: KeyBinding) => matches(k, binding))) return command.id;
  return null;
}

/** Text fields keep the browser's own undo/redo while they have focus. */
export function keepsNativeUndo(target: unknown): boolean {
  const element = target as { tagName?: unknown; type?: unknown } | null;
  if (element === null || typeof element !== 'object') return false;
  if (element.tagName === 'TEXTAREA') return true;
  return element.tagName === 'INPUT' && (element.type === 'text' || element.type === 'search');
}
