/**
 * The unsaved-changes prompt when the window closes. The renderer keeps its working copy
 * in local storage as well, so even "Close without saving" loses nothing until the next
 * start offers it back.
 */
import type { MessageBoxSyncOptions } from 'electron';

export const UNSAVED_PROMPT: MessageBoxSyncOptions = {
  type: 'warning',
  buttons: ['Keep working', 'Close without saving'],
  defaultId: 0,
  cancelId: 0,
  title: 'Unsaved changes',
  message: 'This scenario has changes that are not saved to a file.',
  detail: 'Choose "Keep working" and then File > Save to keep them in a file.',
};

/** 'close' when nothing is unsaved or the user chose to discard; otherwise 'stay'. */
export function closeDecision(dirty: boolean, ask: (options: MessageBoxSyncOptions) => number): 'close' | 'stay' {
  if (!dirty) return 'close';
  return ask(UNSAVED_PROMPT) === 1 ? 'close' : 'stay';
}
