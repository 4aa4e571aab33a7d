/**
 * Rules of the `healthcare` section that tie fields together: one entry per age band, and surge
 * capacity not below usual capacity. Called by `crossFieldProblems` in validation.ts.
 */
import type { Scenario } from '../scenario.ts';
import type { Problem } from '../problems.ts';

export function healthcareProblems(s: Scenario): Problem[] {
  const h = s.healthcare;
  if (h === undefined) return [];
  const n = s.ageBands.length;
  const problems: Problem[] = [];
  const byBand: [string, readonly unknown[] | undefined][] = [
    ['infectionHospitalisationRatio', h.infectionHospitalisationRatio],
    ['icuShareOfAdmissions', h.icuShareOfAdmissions],
    ['admissionDelayByBand', h.admissionDelayByBand],
    ['wardStayByBand', h.wardStayByBand],
    ['icuStayByBand', h.icuStayByBand],
  ];
  for (const [field, values] of byBand) {
    if (values !== undefined && values.length !== n) {
      problems.push({ path: `healthcare.${field}`, rule: `must have one entry per age band (${n})`, value: `${values.length} entries` });
    }
  }
  const c = h.capacity;
  const surge: [string, number | undefined, string, number][] = [
    ['wardSurgeBeds', c.wardSurgeBeds, 'wardBeds', c.wardBeds],
    ['icuSurgeBeds', c.icuSurgeBeds, 'icuBeds', c.icuBeds],
  ];
  for (const [field, value, usualField, usual] of surge) {
    if (value !== undefined && value < usual) {
      problems.push({ path: `healthcare.capacity.${field}`, rule: `must be at least ${usualField} (${usual}); it counts all beds at full surge`, value: String(value) });
    }
  }
  return problems;
}
