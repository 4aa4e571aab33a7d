/** Cross-field rules of vaccination campaigns (band counts, orders, names, efficacies). */
import type { Scenario } from '../scenario.ts';
import type { Problem } from '../problems.ts';

export function vaccinationProblems(s: Scenario): Problem[] {
  const problems: Problem[] = [];
  const n = s.ageBands.length;
  const names = new Set<string>();
  s.vaccinationCampaigns.forEach((c, k) => {
    const at = `vaccinationCampaigns[${k}]`;
    if (names.has(c.name)) problems.push({ path: `${at}.name`, rule: 'must be unique', value: JSON.stringify(c.name) });
    names.add(c.name);
    if (c.uptakeCeiling.length !== n) {
      problems.push({ path: `${at}.uptakeCeiling`, rule: `must have one entry per age band (${n})`, value: `${c.uptakeCeiling.length} entries` });
    }
    if (c.efficacyAgainstDeath < c.efficacyAgainstInfection) {
      problems.push({ path: `${at}.efficacyAgainstDeath`, rule: `must be at least efficacyAgainstInfection (${c.efficacyAgainstInfection})`, value: String(c.efficacyAgainstDeath) });
    }
    if (c.efficacyAgainstAdmission !== undefined && c.efficacyAgainstAdmission < c.efficacyAgainstInfection) {
      problems.push({ path: `${at}.efficacyAgainstAdmission`, rule: `must be at least efficacyAgainstInfection (${c.efficacyAgainstInfection})`, value: String(c.efficacyAgainstAdmission) });
    }
    const seen = new Map<number, number>();
    c.priority.forEach((group, g) => {
      group.forEach((band, b) => {
        const path = `${at}.priority[${g}][${b}]`;
        if (band >= n) problems.push({ path, rule: `must be a band index below ${n}`, value: String(band) });
        else if (seen.has(band)) problems.push({ path, rule: `must not repeat a band already in group ${seen.get(band)}`, value: String(band) });
        seen.set(band, g);
      });
    });
    const days = c.schedule.map((step) => step.fromDay);
    days.forEach((d, i) => {
      if (i > 0 && d <= days[i - 1]) problems.push({ path: `${at}.schedule[${i}].fromDay`, rule: `must be after the step before (day ${days[i - 1]})`, value: String(d) });
    });
  });
  s.options.forEach((o, k) => {
    if (o.vaccinationCampaign !== undefined && !names.has(o.vaccinationCampaign)) {
      problems.push({ path: `options[${k}].vaccinationCampaign`, rule: names.size > 0 ? `must name a campaign of the scenario (${[...names].join(', ')})` : 'must name a campaign of the scenario (there are none)', value: JSON.stringify(o.vaccinationCampaign) });
    }
  });
  return problems;
}
