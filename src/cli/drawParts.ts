/**
 * Draws computed in slices: `mixwise run FILE --draw-range A:B --out part.json` writes the results
 * of draws A..B-1 with the scenario they belong to; `mixwise merge part-*.json` checks that the
 * parts belong to one scenario and cover every draw exactly once, and summarises them as a single
 * run would (the summary is a pure function of the ordered draws, so the output is byte-identical).
 *
 * Part file (JSON): { format: "mixwise-draws", version: 1, scenario, keys, from, to, draws: [
 *   { draw, outcomes: [[value or null per key] per option] } | { draw, failed: reason } ] }
 * Numbers are written in JavaScript's shortest round-trip form, so they read back bit for bit.
 */
import { z } from 'zod';
import { formatProblem, validateScenario, type Calibration, type DrawResult, type Scenario } from '../engine/index.ts';
import { canonicalJson } from '../report/fingerprint.ts';
import { CliError, EXIT_CODES } from './errors.ts';

export const PART_FORMAT = 'mixwise-draws';
export const PART_VERSION = 1;

const partSchema = z.object({
  format: z.literal(PART_FORMAT),
  version: z.literal(PART_VERSION),
  scenario: z.unknown(),
  keys: z.array(z.string()),
  from: z.number().int().min(0),
  to: z.number().int().min(1),
  draws: z.array(
    z.union([
      z.strictObject({ draw: z.number().int().min(0), outcomes: z.array(z.array(z.number().nullable())) }),
      z.strictObject({ draw: z.number().int().min(0), failed: z.string() }),
    ]),
  ),
});

/** The text of a part file for draws from..to-1 of `scenario` (its uncertainty section as run). */
export function partFileText(scenario: Scenario, keys: readonly string[], from: number, to: number, results: readonly DrawResult[]): string {
  const draws = results.map((r) => (r.ok ? { draw: r.draw, outcomes: r.outcomes.map((v) => Array.from(v, (x) => (Number.isNaN(x) ? null : x))) } : { draw: r.draw, failed: r.reason }));
  return `${JSON.stringify({ format: PART_FORMAT, version: PART_VERSION, scenario, keys, from, to, draws })}\n`;
}

function invalid(file: string, rule: string): CliError {
  return new CliError(`${file}: ${rule}`, EXIT_CODES.invalidScenario);
}

export interface MergedDraws {
  scenario: Scenario;
  calibration: Calibration;
  results: DrawResult[];
}

/** Parts (file name and text) -> the scenario and all its draws in order; a mismatch or gap is a one-line error. */
export function mergeParts(parts: readonly { file: string; text: string }[], keys: readonly string[]): MergedDraws {
  let scenarioText: string | null = null;
  let scenario: Scenario | null = null;
  let calibration: Calibration | null = null;
  const byDraw = new Map<number, DrawResult>();
  for (const { file, text } of parts) {
    let json: unknown;
    try {
      json = JSON.parse(text);
    } catch (err) {
      throw invalid(file, `must be valid JSON (${(err as Error).message})`);
    }
    const parsed = partSchema.safeParse(json);
    if (!parsed.success) throw invalid(file, `is not a part file written by 'mixwise run --draw-range' (${parsed.error.issues[0]?.path.join('.') ?? ''} ${parsed.error.issues[0]?.message ?? ''})`);
    const part = parsed.data;
    const text2 = canonicalJson(part.scenario);
    if (scenarioText === null) {
      const checked = validateScenario(part.scenario);
      if (!checked.ok) throw invalid(file, `scenario: ${formatProblem(checked.problems[0])}`);
      if (checked.scenario.uncertainty === undefined) throw invalid(file, 'scenario has no uncertainty section');
      scenario = checked.scenario;
      calibration = checked.calibration;
      scenarioText = text2;
    } else if (text2 !== scenarioText) {
      throw invalid(file, `belongs to another scenario, or to other draws or seed, than ${parts[0].file}`);
    }
    if (part.keys.join('\n') !== keys.join('\n')) throw invalid(file, 'was written by another version of mixwise (its outcomes differ)');
    if (part.draws.length !== part.to - part.from || part.draws.some((d, k) => d.draw !== part.from + k)) throw invalid(file, `must hold draws ${part.from} to ${part.to - 1} in order`);
    for (const d of part.draws) {
      if (byDraw.has(d.draw)) throw invalid(file, `repeats draw ${d.draw}, already in another part`);
      byDraw.set(d.draw, 'failed' in d ? { draw: d.draw, ok: false, reason: d.failed } : { draw: d.draw, ok: true, outcomes: d.outcomes.map((v) => Float64Array.from(v, (x) => x ?? Number.NaN)) });
    }
  }
  if (scenario === null || calibration === null || scenario.uncertainty === undefined) throw new CliError('merge needs at least one part file', EXIT_CODES.usage);
  const total = scenario.uncertainty.draws;
  const missing = Array.from({ length: total }, (_, i) => i).filter((i) => !byDraw.has(i));
  if (missing.length > 0) throw new CliError(`the parts do not cover every draw: ${missing.length} of ${total} missing, first ${missing[0]}`, EXIT_CODES.invalidScenario);
  if (byDraw.size !== total) throw new CliError(`the parts hold draws beyond the scenario's ${total}`, EXIT_CODES.invalidScenario);
  return { scenario, calibration, results: Array.from({ length: total }, (_, i) => byDraw.get(i)!) };
}
