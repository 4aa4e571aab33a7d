/**
 * The JSON Schema of the scenario file, generated from the zod schema in
 * src/engine/scenario.ts with zod 4's `z.toJSONSchema` (draft 2020-12, input side, so fields
 * with defaults are optional). `scripts/export-schema.ts` writes it to docs/scenario.schema.json;
 * test/resources checks that the file is up to date.
 *
 * The JSON Schema covers structure, types, required fields and the bounds zod can express;
 * rules written as zod refinements (e.g. ">= 0") and rules that tie fields together (matrix
 * sizes, one entry per band, phase order) are checked only by `validateScenario`.
 */
import { z } from 'zod';
import { SCENARIO_FORMAT, SCENARIO_VERSION, scenarioSchema } from '../src/engine/scenario.ts';

export function scenarioJsonSchema(): Record<string, unknown> {
  const generated = z.toJSONSchema(scenarioSchema, { io: 'input' }) as Record<string, unknown>;
  const { $schema, ...rest } = generated;
  return {
    $schema,
    title: `Mixwise scenario file (format "${SCENARIO_FORMAT}", version ${SCENARIO_VERSION})`,
    description:
      'Generated from src/engine/scenario.ts by `npm run schema`; do not edit by hand. Cross-field rules ' +
      '(matrix sizes, one entry per age band, phase order, names that must exist) and some value bounds ' +
      'are checked by the program (`mixwise check FILE`), not by this schema.',
    ...rest,
  };
}

/** The text of docs/scenario.schema.json, with a final newline. */
export function scenarioJsonSchemaText(): string {
  return `${JSON.stringify(scenarioJsonSchema(), null, 2)}\n`;
}
