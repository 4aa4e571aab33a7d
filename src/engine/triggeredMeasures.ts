/**
 * Runs an option's triggers during integration: reads the monitored quantities from the state on
 * each whole day, keeps the hospital model up to date day by day (when a trigger reads it),
 * applies the trigger rule (triggers.ts) and gives the transmission matrix for the measures then
 * in force.
 */
import { type HospitalQuantity, OnlineHospitalDemand } from './healthcare/online.ts';
import { phaseTransmission } from './phaseTransmission.ts';
import type { PreparedScenario } from './prepare.ts';
import { HOSPITAL_TRIGGER_QUANTITIES, type Phase, type PolicyOption, type TriggerQuantity } from './scenario.ts';
import { type BandParameters, transmissionMatrixOfPhasesInto } from './transmission.ts';
import { TriggerController } from './triggers.ts';

/** Cumulative infections by band at day d (persons), as recorded by the integration. */
export interface CumulativeRecord {
  cumulative: Float64Array;
  protectedCumulative: Float64Array;
}

function isHospitalQuantity(q: TriggerQuantity): q is HospitalQuantity {
  return HOSPITAL_TRIGGER_QUANTITIES.includes(q);
}

/**
 * M under several phases at once, per prepared scenario (keyed like phaseTransmission.ts, by its
 * band parameters), then by the option's phase list and the indices of the phases in force: the
 * few combinations a trigger produces are built once, not on every switch of every run.
 */
const combinationsOf = new WeakMap<BandParameters, WeakMap<readonly Phase[], Map<string, Float64Array>>>();

function combinedTransmission(p: PreparedScenario, phases: readonly Phase[], inForce: readonly number[]): Float64Array {
  let byOption = combinationsOf.get(p.bands);
  if (byOption === undefined) {
    byOption = new WeakMap();
    combinationsOf.set(p.bands, byOption);
  }
  let byKey = byOption.get(phases);
  if (byKey === undefined) {
    byKey = new Map();
    byOption.set(phases, byKey);
  }
  const key = inForce.join(',');
  let m = byKey.get(key);
  if (m === undefined) {
    const n = p.bands.bands;
    m = transmissionMatrixOfPhasesInto(new Float64Array(n * n), p.scenario, p.bands, p.beta, inForce.map((k) => phases[k]));
    byKey.set(key, m);
  }
  return m;
}

export class TriggeredMeasures {
  readonly controller: TriggerController;
  /** The hospital model, when a trigger reads it. */
  private readonly hospital: OnlineHospitalDemand | null;
  /** Day's infections weighted by protected people's relative risk of admission. */
  private readonly weighted: Float64Array;
  private readonly per100k: number;
  private readonly phases: readonly Phase[];
  private state: Float64Array | null = null;
  private record: CumulativeRecord | null = null;
  private day = 0;

  constructor(
    private readonly p: PreparedScenario,
    option: PolicyOption,
    private readonly admissionRiskFactor: number,
  ) {
    this.controller = new TriggerController(option);
    this.phases = option.phases;
    const hospitalReads = option.phases.flatMap((phase) => (phase.trigger !== undefined && isHospitalQuantity(phase.trigger.quantity) ? [phase.trigger.quantity] : []));
    this.hospital = p.healthcare === null || hospitalReads.length === 0 ? null : new OnlineHospitalDemand(p.healthcare, hospitalReads);
    this.weighted = new Float64Array(p.bands.bands);
    let total = 0;
    for (const x of p.bands.population) total += x;
    this.per100k = 1e5 / total;
  }

  /**
   * M (per day) under the fixed phase `fixed` and the triggered phases in force now; shared by
   * every run (phaseTransmission.ts for a single phase), do not write to it.
   */
  transmissionWith(fixed: Phase | null): Float64Array {
    const triggered = this.controller.indicesInForce();
    if (triggered.length === 0) return phaseTransmission(this.p, fixed);
    if (fixed === null && triggered.length === 1) return phaseTransmission(this.p, this.phases[triggered[0]]);
    return combinedTransmission(this.p, this.phases, fixed === null ? triggered : [this.phases.indexOf(fixed), ...triggered]);
  }

  /**
   * At whole day d, once day d is recorded: completes day d-1 (hospital demand, when a trigger
   * reads it), then applies the trigger rule. True when the triggered measures change at time d.
   */
  atDay(d: number, y: Float64Array, record: CumulativeRecord): boolean {
    if (d > 0 && this.hospital !== null) this.completeDay(d - 1, record);
    this.state = y;
    this.record = record;
    this.day = d;
    return this.controller.decide(d, this.read);
  }

  /** New infections of day a (a = d-1) by band, weighted by the risk of admission, into the hospital model. */
  private completeDay(a: number, record: CumulativeRecord): void {
    const n = this.p.bands.bands;
    const { cumulative, protectedCumulative } = record;
    const seeds = this.p.seeds;
    const cut = 1 - this.admissionRiskFactor;
    const x = this.weighted;
    const now = (a + 1) * n;
    const before = a * n;
    for (let i = 0; i < n; i++) x[i] = Math.max(0, cumulative[now + i] - cumulative[before + i]);
    if (a === 0) for (let i = 0; i < n; i++) x[i] += seeds[i];
    // inc - 0 x prot is inc (>= 0): nothing to weigh without a protection that cuts admissions.
    if (cut !== 0) for (let i = 0; i < n; i++) x[i] = Math.max(0, x[i] - cut * Math.max(0, protectedCumulative[now + i] - protectedCumulative[before + i]));
    (this.hospital as OnlineHospitalDemand).addDay(this.weighted);
  }

  private readonly read = (quantity: TriggerQuantity): number => {
    const d = this.day;
    switch (quantity) {
      case 'infectiousPer100k': {
        // The infectious stages sit at the same offsets with or without vaccination blocks (seir.ts).
        const L = this.p.layout;
        const y = this.state as Float64Array;
        let infectious = 0;
        for (let k = L.infectious; k < L.infectious + L.infectiousStages * L.bands; k++) infectious += Math.max(0, y[k]);
        return infectious * this.per100k;
      }
      case 'dailyInfectionsPer100k': {
        // New infections of day d-1 (the reported daily series, seeds on day 0).
        if (d === 0) return 0;
        const n = this.p.bands.bands;
        const cumulative = (this.record as CumulativeRecord).cumulative;
        let total = 0;
        for (let i = 0; i < n; i++) total += Math.max(0, cumulative[d * n + i] - cumulative[(d - 1) * n + i]) + (d === 1 ? this.p.seeds[i] : 0);
        return total * this.per100k;
      }
      default:
        return d === 0 || this.hospital === null ? 0 : this.hospital.valueOn(quantity, d - 1);
    }
  };
}
