/**
 * State of the "Fit from counts" panel, kept outside the component so the imported counts, the
 * window and the fit survive switching views. The counts are shown and fitted on the fit's days:
 * the scenario's when it has a start date and the file has dates (placeOnScenarioDays), and the
 * window moves with them when the start date changes. Fitting runs in a worker (fitClient.ts);
 * the newest request's answer is the one kept.
 */
import { dailyTotals, formatCsvProblem, placeOnScenarioDays, type CaseSeries, type CountModel, type DailyCounts, type Scenario } from '../../engine/index.ts';
import { FitClient } from '../lib/fitClient.ts';
import type { FitOutcome } from '../lib/fitFromCounts.ts';

class FitPanelState {
  /** The counts as read from the file. */
  private fileSeries: CaseSeries | null = null;
  /** The counts on the fit's days (null when they cannot be placed on them). */
  series = $state.raw<CaseSeries | null>(null);
  counts = $state.raw<DailyCounts | null>(null);
  /** Why the counts cannot be placed on the scenario's days (one line naming the CSV line), or null. */
  placementProblem = $state<string | null>(null);
  fileName = $state('');
  fromDay = $state(0);
  toDay = $state(0);
  /** The analyst's count model; 'auto' (negative binomial when Poisson is overdispersed) until one is picked. */
  family = $state<CountModel | 'auto'>('auto');
  /** "R0 set to ..." after Use this R0, shown beside the button; cleared by a new file. */
  applied = $state<string | null>(null);
  dayOfWeek = $state(false);
  logScale = $state(true);
  /** Option whose measures were in force during the window; '' for none. */
  measuresOption = $state('');
  outcome = $state.raw<FitOutcome | null>(null);
  busy = $state(false);

  private client: FitClient | null = null;
  private lastKey = '';
  private lastScenario: Scenario | null = null;
  /** Fit day − file day of the window held, or null before the first placement of this file. */
  private shift: number | null = null;

  /** Takes a newly imported series; the window becomes the whole series once placed. */
  load(series: CaseSeries, fileName: string): void {
    this.fileSeries = series;
    this.series = null;
    this.counts = null;
    this.fileName = fileName;
    this.outcome = null;
    this.family = 'auto';
    this.applied = null;
    this.lastKey = '';
    this.shift = null;
  }

  /** Places the file's counts on the fit's days for this start date; the window keeps its dates. */
  private place(startDate: string | null): void {
    if (this.fileSeries === null) return;
    const placed = placeOnScenarioDays(this.fileSeries, startDate);
    if (!placed.ok) {
      this.placementProblem = placed.problems.map(formatCsvProblem).join('; ');
      this.series = null;
      this.counts = null;
      this.outcome = null;
      return;
    }
    this.placementProblem = null;
    const shift = placed.placement.shiftDays;
    if (this.shift === shift && this.series !== null) return;
    const counts = dailyTotals(placed.series);
    if (this.shift === null) {
      this.fromDay = Math.min(...counts.day);
      this.toDay = Math.max(...counts.day);
    } else {
      this.fromDay += shift - this.shift;
      this.toDay += shift - this.shift;
    }
    this.shift = shift;
    this.series = placed.series;
    this.counts = counts;
  }

  /**
   * Asks the worker for a fit of the present inputs against `scenario`; nothing when the inputs
   * are those of the fit already held (e.g. when the view is shown again).
   */
  refit(scenario: Scenario, optionNames: readonly string[]): void {
    this.place(scenario.startDate ?? null);
    const series = this.fileSeries;
    const measures = this.measuresOption !== '' && optionNames.includes(this.measuresOption) ? this.measuresOption : null;
    const key = JSON.stringify([this.fileName, this.fromDay, this.toDay, this.family, this.dayOfWeek, measures]);
    if (series === null || this.counts === null || (key === this.lastKey && scenario === this.lastScenario)) return;
    this.lastKey = key;
    this.lastScenario = scenario;
    this.client ??= new FitClient((outcome) => {
      this.outcome = outcome;
      this.busy = false;
    });
    this.busy = true;
    this.client.fit({ series, fileName: this.fileName, fromDay: this.fromDay, toDay: this.toDay, family: this.family, dayOfWeek: this.dayOfWeek, measuresOption: measures, scenario });
  }
}

/** The count model picked by the analyst (no automatic change after this). */
export function chooseFamily(state: FitPanelState, family: CountModel): void {
  state.family = family;
}

export const fitPanel = new FitPanelState();
