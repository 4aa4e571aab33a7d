/**
 * State of the "Fit from counts" panel, kept outside the component so the imported counts, the
 * window and the fit survive switching views. Fitting runs in a worker (fitClient.ts); the
 * newest request's answer is the one kept.
 */
import { dailyTotals, type CaseSeries, type CountModel, type DailyCounts } from '../../engine/fitting/index.ts';
import type { Scenario } from '../../engine/scenario.ts';
import { FitClient } from '../lib/fitClient.ts';
import type { FitOutcome } from '../lib/fitFromCounts.ts';

class FitPanelState {
  series = $state.raw<CaseSeries | null>(null);
  counts = $state.raw<DailyCounts | null>(null);
  fileName = $state('');
  fromDay = $state(0);
  toDay = $state(0);
  family = $state<CountModel>('poisson');
  dayOfWeek = $state(false);
  logScale = $state(true);
  /** Option whose measures were in force during the window; '' for none. */
  measuresOption = $state('');
  outcome = $state.raw<FitOutcome | null>(null);
  busy = $state(false);

  private client: FitClient | null = null;
  private lastKey = '';
  private lastScenario: Scenario | null = null;

  /** Takes a newly imported series; the window becomes the whole series. */
  load(series: CaseSeries, fileName: string): void {
    const counts = dailyTotals(series);
    this.series = series;
    this.counts = counts;
    this.fileName = fileName;
    this.outcome = null;
    this.lastKey = '';
    this.fromDay = Math.min(...counts.day);
    this.toDay = Math.max(...counts.day);
  }

  /**
   * Asks the worker for a fit of the present inputs against `scenario`; nothing when the inputs
   * are those of the fit already held (e.g. when the view is shown again).
   */
  refit(scenario: Scenario, optionNames: readonly string[]): void {
    const counts = this.counts;
    const measures = this.measuresOption !== '' && optionNames.includes(this.measuresOption) ? this.measuresOption : null;
    const key = JSON.stringify([this.fileName, this.fromDay, this.toDay, this.family, this.dayOfWeek, measures]);
    if (counts === null || (key === this.lastKey && scenario === this.lastScenario)) return;
    this.lastKey = key;
    this.lastScenario = scenario;
    this.client ??= new FitClient((outcome) => {
      this.outcome = outcome;
      this.busy = false;
    });
    this.busy = true;
    this.client.fit({ counts, fromDay: this.fromDay, toDay: this.toDay, family: this.family, dayOfWeek: this.dayOfWeek, measuresOption: measures, scenario });
  }
}

export const fitPanel = new FitPanelState();
