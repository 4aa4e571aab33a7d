/**
 * The app's state in one place: the working document with its undo history, the file it
 * came from, the newest engine results (and whether they are stale), and the UI selection.
 * Components read this and call its actions; they do no model math.
 */
import { tick } from 'svelte';
import { parseScenarioText, formatProblem, scenarioRevision, type OrderComparison, type Scenario, type ScenarioResults, type OrdersInfo, type UncertaintyResults } from '../../engine/index.ts';
import { EngineClient, type OrderSearchOutcome } from '../lib/engineClient.ts';
import { checkEdit, type EditResult } from '../lib/editCheck.ts';
import { problemInWords } from '../lib/problemWords.ts';
import { pushHistory, redoHistory, startHistory, undoHistory, type HistoryState } from '../lib/history.ts';
import { documentFor, replaceScenario, type WorkingDocument } from '../lib/scenarioEdits.ts';
import { clearAutosave, loadAutosave, storeAutosave, type AutosavedCopy } from '../lib/autosave.ts';
import { DEMO_FILE_NAME, demoScenario } from '../lib/demo.ts';
import { host } from '../lib/host.ts';
import type { RecentFile } from '../../shared/hostApi.ts';

export type ViewName = 'board' | 'curves' | 'by-age' | 'spread' | 'assumptions' | 'report';
export type Notice = { kind: 'info' | 'error'; text: string };

/** The draws of the scenario's uncertainty section: progress, and the newest summary (provisional until every draw is done). */
export interface DrawsState {
  scenario: Scenario;
  done: number;
  total: number;
  results: UncertaintyResults | null;
  /** Draws in `results` (all of them once `state` is 'done'). */
  summarised: number;
  state: 'running' | 'done' | 'cancelled' | 'failed';
  error: string | null;
}

/** Performance mark/measure names for the edit-to-redraw time (read by the e2e run). */
export const EDIT_MARK = 'mixwise-edit';
export const REDRAW_MEASURE = 'mixwise-edit-to-redraw';

const AUTOSAVE_DELAY_MS = 400;

class Workspace {
  history = $state.raw<HistoryState<WorkingDocument>>(startHistory(documentFor(demoScenario())));
  /** The document as last opened or saved; dirty when the present one differs. */
  savedDocument = $state.raw<WorkingDocument | null>(null);
  fileName = $state(DEMO_FILE_NAME);
  filePath = $state<string | null>(null);

  results = $state.raw<ScenarioResults | null>(null);
  /** The scenario `results` were computed from (its revision is `results.revision`). */
  resultsScenario = $state.raw<Scenario | null>(null);
  stale = $state(true);
  computeMs = $state<number | null>(null);
  redrawMs = $state<number | null>(null);
  engineError = $state<string | null>(null);
  /** Why the engine refused to compute the present scenario (a problem of its numbers, in the app's words), or null. */
  engineRefusal = $state<string | null>(null);

  view = $state<ViewName>('board');
  selectedOption = $state(0);
  selectedPhase = $state(0);
  notice = $state<Notice | null>(null);
  recent = $state.raw<RecentFile[]>([]);
  recovered = $state.raw<AutosavedCopy | null>(null);
  /** Vaccination order templates and coverage needed for R < 1, as the engine gave them for `scenario` and `optionIndex`. */
  orders = $state.raw<{ scenario: Scenario; optionIndex: number; info: OrdersInfo } | null>(null);
  ordersError = $state<string | null>(null);
  /** The last vaccination order search of the finder: the scenario and option it was found for, and what it found. */
  lastOrderSearch = $state.raw<{ scenario: Scenario; optionIndex: number; comparison: OrderComparison } | null>(null);
  /** Draws of the present scenario's uncertainty section; null when it has none (or before its options are computed). */
  draws = $state.raw<DrawsState | null>(null);
  /** The full summary of the present scenario's draws, once every draw is done (what the report prints). */
  readonly reportDraws = $derived(this.draws !== null && this.draws.state === 'done' && this.draws.scenario === this.history.present.scenario ? this.draws.results : null);

  readonly doc = $derived(this.history.present);
  readonly scenario = $derived(this.history.present.scenario);
  readonly dirty = $derived(this.savedDocument !== this.history.present);
  readonly canUndo = $derived(this.history.past.length > 0);
  readonly canRedo = $derived(this.history.future.length > 0);
  private readonly revision = $derived(scenarioRevision(this.history.present.scenario));
  /** The order comparison included in the report, while the scenario is still the one it was found for; else null. */
  readonly reportOrders = $derived(this.history.present.includedOrders?.revision === this.revision ? (this.history.present.includedOrders?.comparison ?? null) : null);
  /** True when an included order comparison was found for an earlier version of the scenario (the report leaves it out). */
  readonly reportOrdersOutdated = $derived(this.history.present.includedOrders !== undefined && this.reportOrders === null);
  /**
   * True when `results` has one result per option of the present scenario, in its order: the
   * results' scenario has the same options (by name, in the same order). Stale results of such a
   * scenario are still shown, faded, while new ones are computed.
   */
  readonly aligned = $derived(
    this.results !== null &&
      this.resultsScenario !== null &&
      this.resultsScenario.options.length === this.scenario.options.length &&
      this.resultsScenario.options.every((o, k) => o.name === this.scenario.options[k].name),
  );

  private engine: EngineClient | null = null;
  /** The scenario of the newest run sent to the engine. */
  private running: Scenario | null = null;
  private ordersRequest: { scenario: Scenario; optionIndex: number } | null = null;
  private editPending = false;
  private autosaveTimer: ReturnType<typeof setTimeout> | undefined;

  /** Starts the engine, computes the demo, offers back an autosaved copy if one exists. */
  start(): void {
    this.savedDocument = this.history.present;
    this.engine = new EngineClient({
      onResults: (results, _runId, computeMs) => void this.receive(results, computeMs),
      onFailure: (message, _runId, problem) => {
        if (problem === undefined) this.engineError = message;
        else this.refuse(problemInWords(problem, this.running ?? this.scenario));
      },
      onOrders: (info) => {
        if (this.ordersRequest !== null) this.orders = { ...this.ordersRequest, info };
        this.ordersError = null;
      },
      onOrdersFailure: (message) => {
        this.ordersError = message;
      },
    });
    if (this.ordersRequest !== null) this.engine.orders(this.ordersRequest.scenario, this.ordersRequest.optionIndex);
    this.recovered = loadAutosave();
    this.host();
    void this.refreshRecent();
    this.recompute();
  }

  /** Searches vaccination orders on the engine's pool (EngineClient.findOrders). */
  findOrders(...args: Parameters<EngineClient['findOrders']>): Promise<OrderSearchOutcome> {
    if (this.engine === null) return Promise.resolve({ kind: 'refused', problems: ['The engine has not started yet.'] });
    return this.engine.findOrders(...args);
  }

  /** Asks the engine for order templates and option `optionIndex`'s coverage needed (unless already asked for this scenario). */
  requestOrders(optionIndex: number): void {
    const scenario = this.history.present.scenario;
    const asked = this.ordersRequest;
    if (asked !== null && asked.scenario === scenario && asked.optionIndex === optionIndex) return;
    this.ordersRequest = { scenario, optionIndex };
    this.engine?.orders(scenario, optionIndex);
  }

  private recompute(): void {
    this.stale = true;
    this.refuse(null);
    this.running = this.history.present.scenario;
    this.engine?.run(this.running);
  }

  private async receive(results: ScenarioResults, computeMs: number): Promise<void> {
    // Only the newest run reports, so its scenario is the one last sent; the revision confirms it.
    if (this.running === null || results.revision !== scenarioRevision(this.running)) return;
    this.results = results;
    this.resultsScenario = this.running;
    this.stale = false;
    this.engineError = null;
    this.refuse(null);
    this.computeMs = computeMs;
    // The deterministic board first, then the draws on the same pool.
    this.startDraws();
    if (this.editPending) {
      this.editPending = false;
      await tick();
      requestAnimationFrame(() => {
        const measure = performance.measure(REDRAW_MEASURE, EDIT_MARK);
        this.redrawMs = measure.duration;
      });
    }
  }

  /** Shows why the present scenario cannot be computed in the problems area (the notice), or takes that message away (null). */
  private refuse(words: string | null): void {
    const shown = this.engineRefusal;
    this.engineRefusal = words;
    if (words !== null) this.notice = { kind: 'error', text: `This scenario cannot be computed: ${words}` };
    else if (shown !== null && this.notice?.text.endsWith(shown)) this.notice = null;
  }

  /** Starts the draws of the computed scenario when it has an uncertainty section (older draws are cancelled). */
  startDraws(): void {
    this.engine?.cancelDraws();
    const scenario = this.resultsScenario;
    if (scenario === null || scenario !== this.scenario || scenario.uncertainty === undefined || this.engine === null) {
      this.draws = null;
      return;
    }
    this.draws = { scenario, done: 0, total: scenario.uncertainty.draws, results: null, summarised: 0, state: 'running', error: null };
    const mine = (): DrawsState | null => (this.draws?.scenario === scenario ? this.draws : null);
    this.engine.draws(scenario, {
      onProgress: (done, total) => {
        const d = mine();
        if (d !== null) this.draws = { ...d, done, total };
      },
      onSummary: (results, done, final) => {
        const d = mine();
        if (d !== null) this.draws = { ...d, results, summarised: done, done: Math.max(d.done, done), state: final ? 'done' : d.state };
      },
      onFailure: (message) => {
        const d = mine();
        if (d !== null) this.draws = { ...d, state: 'failed', error: message };
      },
    });
  }

  /** Stops the draws in progress; the summary so far stays, marked as such. */
  cancelDraws(): void {
    this.engine?.cancelDraws();
    if (this.draws?.state === 'running') this.draws = { ...this.draws, state: 'cancelled' };
  }

  private afterChange(): void {
    // An edit cancels the draws of the scenario it replaces; they start again once the options are computed.
    this.engine?.cancelDraws();
    this.draws = null;
    const max = this.scenario.options.length - 1;
    if (this.selectedOption > max) this.selectedOption = max;
    const phases = this.scenario.options[this.selectedOption].phases.length;
    if (this.selectedPhase >= phases) this.selectedPhase = Math.max(0, phases - 1);
    this.host();
    this.scheduleAutosave();
    performance.mark(EDIT_MARK);
    this.editPending = true;
    this.recompute();
  }

  /**
   * Commits an edited document after validating its scenario with the engine's rules.
   * When the edit would make the scenario invalid, nothing changes and the result lists the
   * problems (path and message in the app's words; see editCheck.ts).
   */
  commit(next: WorkingDocument, mergeKey: string | null = null): EditResult {
    if (next === this.history.present) return { ok: true };
    const check = checkEdit(next.scenario);
    if (!check.ok) return check;
    this.history = pushHistory(this.history, { ...next, scenario: check.scenario }, mergeKey, performance.now());
    this.afterChange();
    return { ok: true };
  }

  /** Commits a whole new scenario (assumptions edits, CSV import). */
  commitScenario(scenario: Scenario, mergeKey: string | null = null): EditResult {
    return this.commit(replaceScenario(this.history.present, scenario), mergeKey);
  }

  undo(): void {
    if (!this.canUndo) return;
    this.history = undoHistory(this.history);
    this.afterChange();
  }

  redo(): void {
    if (!this.canRedo) return;
    this.history = redoHistory(this.history);
    this.afterChange();
  }

  /** Replaces the document (open, new from demo, restore); history starts afresh. */
  load(doc: WorkingDocument, fileName: string, filePath: string | null, dirty = false): void {
    this.history = startHistory(doc);
    this.savedDocument = dirty ? null : doc;
    this.fileName = fileName;
    this.filePath = filePath;
    this.selectedOption = 0;
    this.selectedPhase = 0;
    this.afterChange();
  }

  newFromDemo(): void {
    this.load(documentFor(demoScenario()), DEMO_FILE_NAME, null);
  }

  /** Opens scenario text; on problems shows them and keeps the current document. */
  openText(name: string, path: string | null, text: string): boolean {
    const result = parseScenarioText(text);
    if (!result.ok) {
      const lines = result.problems.slice(0, 6).map(formatProblem);
      const more = result.problems.length > 6 ? `\n… and ${result.problems.length - 6} more` : '';
      this.notice = { kind: 'error', text: `${name} was not opened: it is not a valid scenario.\n${lines.join('\n')}${more}` };
      return false;
    }
    this.load(documentFor(result.scenario), name, path);
    this.notice = { kind: 'info', text: `Opened ${name}.` };
    return true;
  }

  /** The scenario as file text (what Save writes). */
  fileText(): string {
    return `${JSON.stringify(this.scenario, null, 2)}\n`;
  }

  async save(saveAs: boolean): Promise<boolean> {
    const doc = this.history.present;
    const outcome = await host.saveScenario({ path: saveAs ? null : this.filePath, suggestedName: this.fileName, text: this.fileText() });
    if (!outcome.ok) {
      if (!outcome.cancelled) this.notice = { kind: 'error', text: outcome.message };
      return false;
    }
    this.savedDocument = doc;
    this.fileName = outcome.file.name;
    this.filePath = outcome.file.path;
    this.notice = { kind: 'info', text: `Saved ${outcome.file.name}.` };
    clearAutosave();
    this.host();
    void this.refreshRecent();
    return true;
  }

  restoreRecovered(): void {
    const copy = this.recovered;
    if (copy === null) return;
    this.recovered = null;
    this.load(copy.document, copy.fileName, copy.filePath, true);
    this.notice = { kind: 'info', text: `Restored the unsaved working copy from ${new Date(copy.savedAt).toLocaleString()}.` };
  }

  discardRecovered(): void {
    this.recovered = null;
    clearAutosave();
  }

  async refreshRecent(): Promise<void> {
    this.recent = await host.listRecent();
  }

  private host(): void {
    host.setDocumentState({ title: this.scenario.title, dirty: this.dirty });
  }

  private scheduleAutosave(): void {
    clearTimeout(this.autosaveTimer);
    this.autosaveTimer = setTimeout(() => {
      if (!this.dirty) return clearAutosave();
      // Keep an older unsaved copy until the user has answered the restore offer.
      if (this.recovered !== null) return;
      storeAutosave({ savedAt: new Date().toISOString(), fileName: this.fileName, filePath: this.filePath, document: this.history.present });
    }, AUTOSAVE_DELAY_MS);
  }
}

export const workspace = new Workspace();
