/**
 * The JSON Schema of the scenario file, generated from the zod schema in
 * src/engine/scenario.ts with zod 4's `z.toJSONSchema` (draft 2020-12, input side, so fields
 * with defaults are optional). `scripts/export-schema.ts` writes it to docs/scenario.schema.json;
 * test/resources checks that the file is up to date.
 *
 * The JSON Schema covers structure, types, required fields, closed objects and the bounds zod can express;
 * rules written as zod refinements (e.g. ">= 0") and rules that tie fields together (matrix
 * sizes, one entry per band, phase order) are checked only by `validateScenario`.
 */
import { z } from 'zod';
import { SCENARIO_FORMAT, SCENARIO_VERSION, scenarioSchema } from '../src/engine/scenario.ts';

/**
 * Every object with listed properties is closed (`additionalProperties: false`), as
 * validateScenario refuses unknown fields (src/engine/strictInput.ts); name-keyed maps stay open.
 */
function closeObjects(root: unknown): void {
  const stack: unknown[] = [root];
  while (stack.length > 0) {
    const node = stack.pop();
    if (node === null || typeof node !== 'object') continue;
    if (Array.isArray(node)) {
      stack.push(...node);
      continue;
    }
    const schema = node as Record<string, unknown>;
    if (schema.type === 'object' && schema.properties !== undefined && schema.additionalProperties === undefined) schema.additionalProperties = false;
    stack.push(...Object.values(schema));
  }
}

export function scenarioJsonSchema(): Record<string, unknown> {
  const generated = z.toJSONSchema(scenarioSchema, { io: 'input' }) as Record<string, unknown>;
  closeObjects(generated);
  const { $schema, ...rest } = generated;
  return {
    $schema,
    title: `Mixwise scenario file (format "${SCENARIO_FORMAT}", version ${SCENARIO_VERSION})`,
    description:
      'Generated from src/engine/scenario.ts by `npm run schema`; do not edit by hand. Unknown fields are ' +
      'refused. The minimum and maximum of each number are the plausibility bounds of src/engine/limits.ts. ' +
      'Cross-field rules (matrix sizes, one entry per age band, phase order, names that must exist, no ' +
      'repeated bands, no setting named like a built-in object property) are checked by the program ' +
      '(`mixwise check FILE`), not by this schema.',
    ...rest,
  };
}

/** The text of docs/scenario.schema.json, with a final newline. */
export function scenarioJsonSchemaText(): string {
  return `${JSON.stringify(scenarioJsonSchema(), null, 2)}\n`;
}
