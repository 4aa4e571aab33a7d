/**
 * A run that cannot be finished because of the scenario's numbers, not a fault of the program:
 * today only a dominant eigenvalue of the next-generation matrix that the bounded Perron root
 * (perronRoot.ts) cannot pin down under some option's measures or susceptibles (contacts,
 * multipliers or age factors spanning hundreds of orders of magnitude). `validateScenario`
 * refuses what it can foresee (each phase's R under its measures alone, validation.ts); what
 * depends on the run's own course (R at a phase's start, R(t) day by day) is refused here, as one
 * line naming the option, the phase or day, and the cause, which the command line reports as an
 * invalid scenario and the app as a problem of the scenario.
 */
import { PerronRootNotSettled } from './perronRoot.ts';
import { formatProblem, type Problem } from './problems.ts';

/** What to change to avoid the refusal, after the cause (common practice: the inputs that reach the matrix). */
export const UNSETTLED_ROOT_HINT = 'look for contacts, setting multipliers or age factors many orders of magnitude from the rest (such as 1e-300)';

export class RunRefused extends Error {
  constructor(readonly problem: Problem) {
    super(formatProblem(problem));
    this.name = 'RunRefused';
  }
}

/** `options[k]` of the scenario (by name, unique in a valid scenario), with the name for the reader. */
export function optionPath(options: readonly { name: string }[], name: string): string {
  let k = optionIndexOf(options).get(name);
  // A list changed in place since it was indexed: index it again.
  if (k === undefined ? options.some((o) => o.name === name) : options[k]?.name !== name) k = optionIndexOf(options, true).get(name);
  return k === undefined ? `option ${JSON.stringify(name)}` : `options[${k}]`;
}

/**
 * Index of each option name (the first, should a name repeat), made once per options list: every
 * option run looks its path up, and a search per run would cost O(N^2) over a batch of N options
 * (about 2 % of a worker's time at 2,000 options a worker).
 */
const indexByList = new WeakMap<readonly { name: string }[], Map<string, number>>();
function optionIndexOf(options: readonly { name: string }[], fresh = false): Map<string, number> {
  let index = fresh ? undefined : indexByList.get(options);
  if (index === undefined) {
    index = new Map();
    for (let k = 0; k < options.length; k++) if (!index.has(options[k].name)) index.set(options[k].name, k);
    indexByList.set(options, index);
  }
  return index;
}

/** The rule a refused Perron root breaks: `when` says under what (e.g. `on day 12`), `cause` is PerronRootNotSettled's message. */
export function unsettledRootRule(optionName: string, when: string, cause: PerronRootNotSettled): string {
  return `(option ${JSON.stringify(optionName)}) must give measures R can be computed under: ${when} ${cause.message}; ${UNSETTLED_ROOT_HINT}`;
}

/**
 * `compute()`, with a PerronRootNotSettled it throws turned into a RunRefused at `path`
 * (`when`: see `unsettledRootRule`). Any other error passes through unchanged.
 */
export function rootOrRefusal<T>(compute: () => T, path: string, optionName: string, when: string): T {
  try {
    return compute();
  } catch (err) {
    if (err instanceof PerronRootNotSettled) throw new RunRefused({ path, rule: unsettledRootRule(optionName, when, err) });
    throw err;
  }
}
