/**
 * Writes docs/scenario.schema.json from the zod scenario schema.
 * Run: `npm run schema` (node --import tsx scripts/export-schema.ts).
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { scenarioJsonSchemaText } from './scenario-json-schema.ts';

const target = fileURLToPath(new URL('../docs/scenario.schema.json', import.meta.url));
mkdirSync(fileURLToPath(new URL('../docs/', import.meta.url)), { recursive: true });
writeFileSync(target, scenarioJsonSchemaText());
console.log(`wrote ${target}`);
