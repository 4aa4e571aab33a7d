/**
 * Rules of the `healthcare` section that tie fields together: one entry per age band, a delay given
 * either for every band or band by band (not both: the list would silently replace the common
 * delay), and surge capacity not below usual capacity. Called by `crossFieldProblems` in validation.ts.
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
  const pairs: [string, unknown, string, unknown][] = [
    ['admissionDelay', h.admissionDelay, 'admissionDelayByBand', h.admissionDelayByBand],
    ['wardStay', h.wardStay, 'wardStayByBand', h.wardStayByBand],
    ['icuStay', h.icuStay, 'icuStayByBand', h.icuStayByBand],
  ];
  for (const [common, commonValue, byBandField, byBandValue] of pairs) {
    if (commonValue !== undefined && byBandValue !== undefined) {
      problems.push({ path: `healthcare.${byBandField}`, rule: `must not be given together with healthcare.${common}: the list replaces the common delay for every band, so give one of them` });
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
