/** Types the report's modules share: page settings, report metadata and table rows. */
import type { OrderComparison, UncertaintyResults } from '../engine/index.ts';

/** One row of the assumptions table: an input parameter with its value, unit and source. */
export interface ParameterRow {
  parameter: string;
  value: string;
  unit: string;
  source: string;
  /** A note printed in small type under the value (e.g. a fit's dispersion). */
  smallPrint?: string;
}

/** The by-band inputs as one table of text cells. */
export interface BandTable {
  header: string[];
  rows: string[][];
}

/** Paper and page settings of a printed report. */
export const PAPERS = ['A4', 'Letter'] as const;
export type Paper = (typeof PAPERS)[number];
export type Orientation = 'portrait' | 'landscape';

export interface ReportMeta {
  /** Version of Mixwise that computed the results (printed, and part of the fingerprint). */
  appVersion: string;
  /** When the report was made; printed in local time with its UTC offset. */
  generatedAt: Date;
  /** Full SHA-256 fingerprint from `scenarioFingerprint` (hex). */
  fingerprint: string;
  paper: Paper;
  orientation: Orientation;
  /**
   * Optional colour slot of each option (palette.ts), so the printout draws every option as the
   * app does, where an option keeps its colour for life. Absent: options are styled by position.
   */
  colourSlots?: readonly number[];
  /**
   * Optional vaccination order comparison to print with the options table. It must have been
   * found for this very scenario (the caller checks), since the fingerprint printed covers the
   * scenario only.
   */
  orderComparison?: OrderComparison;
  /**
   * Optional summary of this scenario's uncertainty draws (the engine's `uncertaintyOnPool`, or
   * the CLI's draws): the options table then gives each value's interval and the chances, and the
   * report lists the uncertain inputs. It must come from this very scenario's `uncertainty`
   * section, which the fingerprint covers (draws, seed, level and every distribution).
   */
  draws?: UncertaintyResults;
}

/**
 * Most option columns printed side by side, by orientation; more options print as several
 * tables of this many columns each (a 45 mm outcome column plus 25-27 mm per option fits the
 * printable width of A4 and Letter: about 180 mm portrait, 265 mm landscape).
 */
export const OPTION_COLUMNS_PER_TABLE: Record<Orientation, number> = { portrait: 5, landscape: 8 };
