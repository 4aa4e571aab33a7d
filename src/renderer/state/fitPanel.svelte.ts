/**
 * State of the "Fit from counts" panel, kept outside the component so the imported counts, the
 * window and the fit survive switching views. Fitting runs in a worker (fitClient.ts); the
 * newest request's answer is the one kept.
 */
import { dailyTotals, OVERDISPERSION_THRESHOLD, type CaseSeries, type CountModel, type DailyCounts, type Scenario } from '../../engine/index.ts';
import { FitClient } from '../lib/fitClient.ts';
import type { FitOutcome } from '../lib/fitFromCounts.ts';

class FitPanelState {
  series = $state.raw<CaseSeries | null>(null);
  counts = $state.raw<DailyCounts | null>(null);
  fileName = $state('');
  fromDay = $state(0);
  toDay = $state(0);
  family = $state<CountModel>('poisson');
  /** True once the analyst picks the count model; until then an overdispersed Poisson fit moves to negative binomial. */
  familyChosen = $state(false);
  /** Why the count model was changed for the analyst, or null. */
  familyNote = $state<string | null>(null);
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

  /** Takes a newly imported series; the window becomes the whole series. */
  load(series: CaseSeries, fileName: string): void {
    const counts = dailyTotals(series);
    this.series = series;
    this.counts = counts;
    this.fileName = fileName;
    this.outcome = null;
    this.family = 'poisson';
    this.familyChosen = false;
    this.familyNote = null;
    this.applied = null;
    this.lastKey = '';
    this.fromDay = Math.min(...counts.day);
    this.toDay = Math.max(...counts.day);
  }

  /**
   * Counts that vary more than Poisson allows (Pearson ratio above the threshold) get the
   * negative-binomial model, whose interval accounts for it, unless the analyst chose the model.
   */
  private preferNegativeBinomial(): void {
    const outcome = this.outcome;
    if (this.familyChosen || this.family !== 'poisson' || outcome === null || !outcome.ok) return;
    const ratio = outcome.value.fit.dispersion.pearsonRatio;
    if (ratio === null || !(ratio > OVERDISPERSION_THRESHOLD)) return;
    this.family = 'negativeBinomial';
    this.familyNote = `The counts vary more than Poisson allows (dispersion ${ratio.toFixed(2)}, above ${OVERDISPERSION_THRESHOLD}), so the negative-binomial model is used; its interval is wider. Pick Poisson to compare.`;
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
      this.preferNegativeBinomial();
    });
    this.busy = true;
    this.client.fit({ counts, fromDay: this.fromDay, toDay: this.toDay, family: this.family, dayOfWeek: this.dayOfWeek, measuresOption: measures, scenario });
  }
}

/** The count model picked by the analyst (no automatic change after this). */
export function chooseFamily(state: FitPanelState, family: CountModel): void {
  state.family = family;
  state.familyChosen = true;
  state.familyNote = null;
}

export const fitPanel = new FitPanelState();
