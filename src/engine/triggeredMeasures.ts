/**
 * Runs an option's triggers during integration: reads the monitored quantities from the state on
 * each whole day, keeps the hospital model up to date day by day, applies the trigger rule
 * (triggers.ts) and gives the transmission matrix for the measures then in force.
 */
import { OnlineHospitalDemand } from './healthcare/online.ts';
import type { PreparedScenario } from './prepare.ts';
import type { Phase, PolicyOption, TriggerQuantity } from './scenario.ts';
import { TriggerController } from './triggers.ts';
import { transmissionMatrixOfPhasesInto } from './transmission.ts';

/** Cumulative infections by band at day d (persons), as recorded by the integration. */
export interface CumulativeRecord {
  cumulative: Float64Array;
  protectedCumulative: Float64Array;
}

export class TriggeredMeasures {
  readonly controller: TriggerController;
  private readonly hospital: OnlineHospitalDemand | null;
  private readonly dayInfections: Float64Array;
  /** Day's infections weighted by protected people's relative risk of admission. */
  private readonly weighted: Float64Array;
  private readonly totalPopulation: number;
  private state: Float64Array | null = null;
  private day = 0;

  constructor(
    private readonly p: PreparedScenario,
    option: PolicyOption,
    private readonly admissionRiskFactor: number,
  ) {
    this.controller = new TriggerController(option);
    this.hospital = p.healthcare === null ? null : new OnlineHospitalDemand(p.healthcare);
    this.dayInfections = new Float64Array(p.bands.bands);
    this.weighted = new Float64Array(p.bands.bands);
    let total = 0;
    for (const x of p.bands.population) total += x;
    this.totalPopulation = total;
  }

  /** M (per day) under the fixed phase `fixed` and the triggered phases in force now. */
  transmissionWith(fixed: Phase | null): Float64Array {
    const n = this.p.bands.bands;
    const phases = fixed === null ? this.controller.phasesInForce() : [fixed, ...this.controller.phasesInForce()];
    return transmissionMatrixOfPhasesInto(new Float64Array(n * n), this.p.scenario, this.p.bands, this.p.beta, phases);
  }

  /**
   * At whole day d, once day d is recorded: completes day d-1 (infections, hospital demand), then
   * applies the trigger rule. True when the triggered measures change at time d.
   */
  atDay(d: number, y: Float64Array, record: CumulativeRecord): boolean {
    if (d > 0) this.completeDay(d - 1, record);
    this.state = y;
    this.day = d;
    return this.controller.decide(d, this.read);
  }

  /** New infections of day a (a = d-1) by band: the reported daily series (seeds on day 0). */
  private completeDay(a: number, record: CumulativeRecord): void {
    const n = this.p.bands.bands;
    const x = this.dayInfections;
    for (let i = 0; i < n; i++) {
      const inc = Math.max(0, record.cumulative[(a + 1) * n + i] - record.cumulative[a * n + i]) + (a === 0 ? this.p.seeds[i] : 0);
      const prot = Math.max(0, record.protectedCumulative[(a + 1) * n + i] - record.protectedCumulative[a * n + i]);
      x[i] = inc;
      this.weighted[i] = Math.max(0, inc - (1 - this.admissionRiskFactor) * prot);
    }
    this.hospital?.addDay(this.weighted);
  }

  private readonly read = (quantity: TriggerQuantity): number => {
    const d = this.day;
    const per100k = 1e5 / this.totalPopulation;
    switch (quantity) {
      case 'infectiousPer100k': {
        // The infectious stages sit at the same offsets with or without vaccination blocks (seir.ts).
        const L = this.p.layout;
        const y = this.state as Float64Array;
        let infectious = 0;
        for (let k = L.infectious; k < L.infectious + L.infectiousStages * L.bands; k++) infectious += Math.max(0, y[k]);
        return infectious * per100k;
      }
      case 'dailyInfectionsPer100k': {
        if (d === 0) return 0;
        let total = 0;
        for (const x of this.dayInfections) total += x;
        return total * per100k;
      }
      case 'dailyAdmissions':
        return d === 0 || this.hospital === null ? 0 : this.hospital.admissions[d - 1];
      case 'wardOccupancy':
        return d === 0 || this.hospital === null ? 0 : this.hospital.wardOccupancy[d - 1];
      case 'icuOccupancy':
        return d === 0 || this.hospital === null ? 0 : this.hospital.icuOccupancy[d - 1];
    }
  };
}
