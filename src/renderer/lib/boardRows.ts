/**
 * The options board's cells, rendered from the catalogue of outcomes (src/report/outcomes.ts) in
 * the screen style. Only formats and compares engine results: averted counts, "per 1,000 doses"
 * and the reference option come from the engine (`comparison`, `referenceIndex`).
 */
import type { OptionResults, ScenarioResults } from '../../engine/index.ts';
import { OUTCOMES, isReferenceCell, outcomeText, outcomesFor, overCapacity, shadeValue, type Outcome } from '../../report/outcomes.ts';
import { relativeChange } from '../../report/numberFormat.ts';
import { changeDirection, changeShade } from './optionLines.ts';

export { OUTCOME_GROUP_TITLES as ROW_GROUP_TITLES } from '../../report/outcomes.ts';

/**
 * The rows of the board: outcomes shown on the board that apply to some option of the results;
 * before results arrive, those that apply to every option (shown pending).
 */
export function boardRowsFor(results: ScenarioResults | null): Outcome[] {
  return results === null ? OUTCOMES.filter((e) => e.shownOn.includes('board') && e.requires.length === 0) : outcomesFor(results, 'board');
}

export interface BoardCell {
  /** The number shown (data-value for tests); null when the option has no such outcome. */
  value: number | null;
  /** True in the reference option's column of a comparison row (shown as "reference"). */
  reference: boolean;
  text: string;
  detail: string;
  /** Background: better blue / worse orange by change against the reference, or transparent. */
  shade: string;
  /** The same change as a word, for marks that do not rely on colour; null when unshaded. */
  direction: 'better' | 'worse' | null;
  /** Bed rows: the peak exceeds the beds available (marked rather than shaded). */
  over: boolean;
  /** Whether the row has a capacity to be over at all. */
  hasCapacity: boolean;
}

/** One cell of the board: option `o` on row `entry`. */
export function boardCell(entry: Outcome, o: OptionResults, results: ScenarioResults): BoardCell {
  const reference = results.options[results.referenceIndex];
  const mine = shadeValue(entry, o, results);
  const theirs = shadeValue(entry, reference, results);
  const change =
    o === reference || mine.lowerIsBetter === null || mine.value === null || theirs.value === null
      ? null
      : { relative: relativeChange(mine.value, theirs.value), lowerIsBetter: mine.lowerIsBetter };
  const shade = change === null ? 'transparent' : changeShade(change.relative, change.lowerIsBetter);
  const direction = change === null ? null : changeDirection(change.relative, change.lowerIsBetter);
  return {
    value: entry.read(o, results),
    reference: isReferenceCell(entry, o, results),
    text: outcomeText(entry, o, results, 'screen'),
    detail: entry.detail?.(o, results) ?? '',
    shade,
    direction,
    over: overCapacity(entry, o, results),
    hasCapacity: entry.capacity !== undefined,
  };
}
