/**
 * Crash safety: the working scenario is copied to local storage shortly after each edit
 * while it has unsaved changes; on the next start it is offered back. Saving or
 * discarding clears the copy.
 */
import type { WorkingDocument } from './scenarioEdits.ts';
import { validateScenario } from '../../engine/index.ts';

const KEY = 'mixwise.autosave';

export interface AutosavedCopy {
  savedAt: string;
  fileName: string;
  filePath: string | null;
  document: WorkingDocument;
}

export function storeAutosave(copy: AutosavedCopy): void {
  try {
    localStorage.setItem(KEY, JSON.stringify(copy));
  } catch {
    // Storage full or disabled: nothing else to do; the document itself is unaffected.
  }
}

export function clearAutosave(): void {
  localStorage.removeItem(KEY);
}

/** The stored copy, if there is one and its scenario is still valid. */
export function loadAutosave(): AutosavedCopy | null {
  try {
    const raw = localStorage.getItem(KEY);
    if (raw === null) return null;
    const copy = JSON.parse(raw) as AutosavedCopy;
    const check = validateScenario(copy.document?.scenario);
    if (!check.ok) return null;
    const slots = copy.document.colourSlots;
    const colourSlots = Array.isArray(slots) && slots.length === check.scenario.options.length ? slots : check.scenario.options.map((_, k) => k);
    return { ...copy, document: { scenario: check.scenario, colourSlots } };
  } catch {
    return null;
  }
}
