/** The text of `mixwise --help`. */
import { OUTPUT_FORMATS } from './args.ts';
import { CAUTION } from '../report/index.ts';
import { POOL_THRESHOLD } from './runOnPool.ts';
import { DRAW_POOL_THRESHOLD } from './uncertainty.ts';

export const HELP_TEXT = `mixwise - compare public-health policy options with an age-structured SEIR model

Usage:
  mixwise run FILE [--format ${OUTPUT_FORMATS.join('|')}] [--out PATH] [--workers N]
      Run every policy option of the scenario FILE and print the policy options table
      (default format: table). --out writes to PATH instead of the screen; an existing
      file is replaced only once the new one is complete. --workers N spreads the options
      over N threads (default: one per core from ${POOL_THRESHOLD} options up, else 1); the
      numbers are the same, digit for digit, whatever N.
  mixwise run FILE [--draws N] [--seed S] [--draw-range A:B --out PART]
      With an "uncertainty" section in FILE: also N Latin hypercube draws of the uncertain
      parameters (--draws and --seed override the file), giving intervals of every outcome,
      the chance each option does better than the reference or best, and the PRCC of each
      parameter. --draw-range A:B computes draws A to B-1 only and writes a part file.
      The draws use --workers N threads (default: one per core from ${DRAW_POOL_THRESHOLD} draws up).
  mixwise merge PART... [--out PATH] [--format json|table|md|csv]
      Combine the part files of one scenario into exactly the output of a single run
      (default format: json). The parts may come from other processes or machines.
  mixwise check FILE
      Check the scenario FILE against the format's rules; list every problem with its
      place in the file.
  mixwise fit CASES.csv --scenario FILE [--from D] [--to D] [--day-of-week]
          [--family poisson|negative-binomial] [--measures-ratio X | --measures-option NAME]
          [--format table|json]
      Fit the growth rate r to daily case counts (columns date or day, count, optional band)
      over days D (a date YYYY-MM-DD or a day number) and print r, doubling time and R0 for
      the scenario's periods, with 95% intervals. Without --family the counts are fitted
      negative-binomially when they vary more than Poisson allows (a note says so).
      When the scenario has a startDate, dated counts are placed on its days (day 0 = the
      start date; counts dated before it are refused, naming their line).
      --measures-ratio: dominant NGM eigenvalue with the measures in force during the
      window / without; R0 = R in window / X. --measures-option: take X from the phase
      option NAME has in force on the window's first day.
      A cases file that breaks a rule also exits with code 2.
  mixwise report FILE [--out PATH] [--format html|csv|pdf] [--series]
          [--paper A4|Letter] [--landscape] [--orders OPTION [--minimise OUTCOME]
          [--groups SPEC] [--top K] [--workers N]]
      The printable policy options report: summary of each option's measures, the options
      table, curves and by-age charts, assumptions with sources, cautions; every page shows
      the scenario fingerprint. Self-contained HTML by default; --out report.pdf prints it
      to PDF with a local Chromium (/usr/bin/chromium or $CHROMIUM_PATH; exit code 3 when
      none is found). --format csv gives the options table (one row per option), with
      --series the daily series (option, day, band, quantity, value). With an "uncertainty"
      section in FILE the draws run first and the table gives each interval beside its value,
      the chances against the reference and the uncertain inputs with their sources.
      --orders OPTION adds the comparison of vaccination orders for OPTION's campaign (the
      search of 'mixwise orders', with its --minimise, --groups, --top and --workers).
  mixwise orders FILE --option NAME [--minimise deaths|infections|admissions|
          peakIcuOccupancy|yearsOfLifeLost] [--groups SPEC] [--top K] [--format table|json]
          [--method auto|exhaustive|heuristic] [--budget N] [--seed N] [--workers N]
          [--draws N]
      Search the priority orders of the groups of option NAME's vaccination campaign (its
      supply, uptake ceilings, efficacy and delay unchanged) and print the K best (default 5)
      for the outcome (default deaths), with the other outcomes and the gap to the best,
      beside the built-in orders. --groups joins bands into priority groups by band index,
      e.g. 0-3,4-9,10-12,13-15, or ten-year (bands joined by decade of age) or bands (each band
      alone); default: the campaign's own groups. Every band the campaign
      can vaccinate must be in exactly one group. Up to 8 groups the search is exhaustive and
      proves the best orders; above, a heuristic local search from the built-in orders and
      four random orders (seeded by --seed), within --budget simulated orders (default 1500),
      which proves nothing. --workers N spreads the simulations over N threads (default: one
      per core from 6 groups up, else 1); the result is the same whatever N. Progress goes to
      stderr; Ctrl-C stops the search and exits with code 130, writing nothing.
      With an uncertainty section, the top orders then run under its draws (its seed;
      --draws N to take N draws) and each gets the share of draws in which it is best.
      An unknown option or outcome, an option without a campaign, or groups that miss or
      repeat a band exit with code 2.
  mixwise --help       Show this text.
  mixwise --version    Show the version.

Exit codes: 0 done, 1 wrong command line, 2 scenario not valid (or not JSON),
3 a file cannot be read or written, 4 internal fault, 130 stopped by Ctrl-C.

The scenario format is described in docs/scenario.schema.json.
${CAUTION}
`;
