/**
 * Keyboard shortcuts: the same keys in the desktop app (where the menu shows them) and in
 * web mode. Ctrl on Windows/Linux, Cmd on macOS.
 */
import type { MenuCommand } from '../../shared/hostApi.ts';

export interface KeyPress {
  key: string;
  ctrlKey: boolean;
  metaKey: boolean;
  shiftKey: boolean;
  altKey: boolean;
}

export function commandForKey(k: KeyPress): MenuCommand | null {
  const mod = k.ctrlKey || k.metaKey;
  const key = k.key.toLowerCase();
  if (mod && !k.altKey) {
    if (key === 'n' && !k.shiftKey) return 'new-from-demo';
    if (key === 'o' && !k.shiftKey) return 'open';
    if (key === 's') return k.shiftKey ? 'save-as' : 'save';
    if (key === 'p' && !k.shiftKey) return 'print-report';
    if (key === 'e') return k.shiftKey ? 'export-report-pdf' : 'export-table-csv';
    if (key === 'z') return k.shiftKey ? 'redo' : 'undo';
    if (key === 'y' && !k.shiftKey) return 'redo';
  }
  if (k.altKey && !mod && !k.shiftKey) {
    const views: Record<string, MenuCommand> = { '1': 'view-board', '2': 'view-curves', '3': 'view-by-age', '4': 'view-assumptions', '5': 'view-report' };
    if (views[key]) return views[key];
  }
  if (key === 'f1' && !mod && !k.altKey) return 'show-model-notes';
  return null;
}

/** Text fields keep the browser's own undo/redo while they have focus. */
export function keepsNativeUndo(target: unknown): boolean {
  const element = target as { tagName?: unknown; type?: unknown } | null;
  if (element === null || typeof element !== 'object') return false;
  if (element.tagName === 'TEXTAREA') return true;
  return element.tagName === 'INPUT' && (element.type === 'text' || element.type === 'search');
}
