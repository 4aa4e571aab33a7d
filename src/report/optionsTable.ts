/**
 * The policy options table as printed (the report, and the CLI's table and Markdown): one row per
 * outcome of the catalogue shown on the `table` surface (src/report/outcomes.ts) that applies to
 * some option, one column per option, every cell a number the engine returned in the print style.
 * Comparisons (deaths averted) are the engine's; the reference option's own cell reads "reference".
 * With the summary of uncertainty draws, each cell also gives its interval ("8,298 (6,900 to
 * 9,700)") and rows of chances (lower than under the reference, lowest of all) follow the outcomes.
 */
import type { ScenarioSummary, UncertaintyResults } from '../engine/index.ts';
import { chanceRows } from './drawSummary.ts';
import { print } from './numberFormat.ts';
import { outcomesFor, outcomeTextWithInterval, REFERENCE_CELL } from './outcomes.ts';

export interface OutcomeRow {
  /** The outcome's key (the JSON key of `mixwise run`), used by tests. */
  key: string;
  /** What the row shows, in plain words with its unit. */
  label: string;
  /** One formatted cell per option, in the results' order. */
  cells: string[];
}

export interface OptionsTable {
  optionNames: string[];
  referenceIndex: number;
  rows: OutcomeRow[];
  /** Notes printed under the table (capacities, conventions). */
  notes: string[];
}

function capacityNote(results: ScenarioSummary): string | null {
  const h = results.options.find((o) => o.healthcare !== null)?.healthcare ?? null;
  if (h === null) return null;
  const surge = (n: number | null) => (n === null ? '' : `, ${print.persons(n)} at full surge`);
  return (
    `Bed capacity: ward ${print.persons(h.ward.capacityBeds)}${surge(h.ward.surgeCapacityBeds)}; ` +
    `ICU ${print.persons(h.icu.capacityBeds)}${surge(h.icu.surgeCapacityBeds)}. Beds in use: mean over the day. Admissions: those within the horizon.`
  );
}

export function optionsTable(results: ScenarioSummary, draws?: UncertaintyResults): OptionsTable {
  const reference = results.options[results.referenceIndex];
  const outcomes = outcomesFor(results, 'table');
  const shown = (key: string) => outcomes.some((e) => e.key === key);
  const notes = [
    `Reference option: ${reference.name}. R0 without measures: ${print.r(results.r0)}. Day 0 is the scenario's first day.`,
    'R, growth rate and doubling time are those of day 0, with the measures in force on day 0. Peak prevalence: share of the population infected (latent or infectious) on the peak day. Infections and attack rate: by the end of the horizon.',
    'Deaths count every death eventually caused by the infections within the horizon; deaths averted = deaths under the reference minus deaths under the option (negative: more deaths than under the reference).',
  ];
  if (shown('doses')) {
    notes.push("Vaccine doses: doses given within the horizon (one dose per person). Deaths averted per 1,000 doses: deaths averted against the reference for every 1,000 doses of the option's campaign (n/a without doses).");
  }
  if (shown('finalSizeAttackRate')) {
    notes.push('Final-size attack rate: the multi-group final-size relation (Ma & Earn 2006) solved as a cross-check of the simulated attack rate, for options whose measures never change (n/a for the others).');
  }
  const capacity = capacityNote(results);
  if (capacity !== null) notes.push(capacity);
  if (draws !== undefined) {
    const u = draws.uncertainty;
    notes.push(
      `In brackets: the central ${print.percent(u.intervalLevel, 0)} of ${u.draws - u.failedDraws} uncertainty draws of the inputs listed as uncertain (the value before the bracket is the run at their stated values). ` +
        'Chances: the share of draws in which the option has fewer than the reference, or the fewest of all options, the same draws for every option.',
    );
  }
  const rows = outcomes.map((e) => ({
    key: e.key,
    label: e.printLabel,
    cells: results.options.map((o, k) => outcomeTextWithInterval(e, o, results, 'print', draws?.options[k]?.intervals[e.key])),
  }));
  return {
    optionNames: results.options.map((o) => o.name),
    referenceIndex: results.referenceIndex,
    rows: draws === undefined ? rows : [...rows, ...chanceRows(draws, results.referenceIndex, 'print', REFERENCE_CELL)],
    notes,
  };
}

/** Splits option indices into groups of at most `perGroup` columns (a wide table prints as several). */
export function columnGroups(optionCount: number, perGroup: number): number[][] {
  const size = Math.max(1, Math.floor(perGroup));
  const groups: number[][] = [];
  for (let start = 0; start < optionCount; start += size) {
    groups.push(Array.from({ length: Math.min(size, optionCount - start) }, (_, k) => start + k));
  }
  return groups;
}
