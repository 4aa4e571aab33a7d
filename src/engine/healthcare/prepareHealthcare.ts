/**
 * What hospital demand needs per scenario, computed once and shared by every option: the ratios
 * by band (defaults filled in) and the daily kernels.
 *
 * Bands whose admission delay and stays are the same share one group; each group's infections
 * are summed over its bands before any convolution, so the usual case (one delay for everybody)
 * costs one set of convolutions, whatever the number of bands.
 */
import type { Delay, Scenario } from '../scenario.ts';
import { commonDelays, defaultIcuShareOfAdmissions, defaultInfectionHospitalisationRatio } from './defaults.ts';
import { delayKernel, bedDayKernel } from './kernels.ts';

/** Bands with the same delays, and their kernels. */
export interface DelayGroup {
  bands: number[];
  /** Infection -> admission weights by day. */
  admission: Float64Array;
  /** Cumulative admission weights: share of a day-0 infection's admissions by day k. */
  admittedBy: Float64Array;
  /** Ward beds per non-ICU admission, by day since admission. */
  wardBedDays: Float64Array;
  /** ICU beds per ICU admission, by day since admission. */
  icuBedDays: Float64Array;
  /** Ward beds (outside ICU) per ICU admission, by day since admission. */
  icuPatientWardBedDays: Float64Array;
}

export interface PreparedHealthcare {
  days: number;
  bands: number;
  /** IHR by band, fraction of infections admitted to hospital. */
  infectionHospitalisationRatio: Float64Array;
  /** Share of admissions needing ICU, by band, fraction. */
  icuShareOfAdmissions: Float64Array;
  /** IHR_i (1 - ICU share_i): infections admitted and never needing ICU, by band. */
  wardOnlyRatio: Float64Array;
  /** IHR_i x ICU share_i: infections admitted that need ICU, by band. */
  icuRatio: Float64Array;
  groups: DelayGroup[];
  wardBeds: number;
  icuBeds: number;
  wardSurgeBeds: number | null;
  icuSurgeBeds: number | null;
}

const keyOf = (d: Delay): string => `${d.meanDays}/${d.shape}`;

/** Scenario-wide hospital parameters, or null when the scenario has no `healthcare` section. */
export function prepareHealthcare(s: Scenario): PreparedHealthcare | null {
  const h = s.healthcare;
  if (h === undefined) return null;
  const n = s.ageBands.length;
  const days = s.horizonDays;
  const ihr = Float64Array.from(h.infectionHospitalisationRatio ?? defaultInfectionHospitalisationRatio(s));
  const icuShare = Float64Array.from(h.icuShareOfAdmissions ?? defaultIcuShareOfAdmissions(s));

  const common = commonDelays(h);
  const byKey = new Map<string, DelayGroup>();
  for (let i = 0; i < n; i++) {
    const admission = h.admissionDelayByBand?.[i] ?? common.admissionDelay;
    const ward = h.wardStayByBand?.[i] ?? common.wardStay;
    const icu = h.icuStayByBand?.[i] ?? common.icuStay;
    const key = `${keyOf(admission)}|${keyOf(ward)}|${keyOf(icu)}`;
    let group = byKey.get(key);
    if (group === undefined) {
      const w = delayKernel(admission, days);
      const admittedBy = new Float64Array(w.length);
      let acc = 0;
      w.forEach((x, k) => (admittedBy[k] = acc += x));
      group = {
        bands: [],
        admission: w,
        admittedBy,
        wardBedDays: bedDayKernel(ward, days),
        icuBedDays: bedDayKernel(icu, days),
        icuPatientWardBedDays: bedDayKernel(h.icuPatientWardStay, days),
      };
      byKey.set(key, group);
    }
    group.bands.push(i);
  }

  return {
    days,
    bands: n,
    infectionHospitalisationRatio: ihr,
    icuShareOfAdmissions: icuShare,
    wardOnlyRatio: ihr.map((x, i) => x * (1 - icuShare[i])),
    icuRatio: ihr.map((x, i) => x * icuShare[i]),
    groups: [...byKey.values()],
    wardBeds: h.capacity.wardBeds,
    icuBeds: h.capacity.icuBeds,
    wardSurgeBeds: h.capacity.wardSurgeBeds ?? null,
    icuSurgeBeds: h.capacity.icuSurgeBeds ?? null,
  };
}
