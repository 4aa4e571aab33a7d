/**
 * Writes resources/demo-scenario.json from scripts/demo-scenario.ts.
 * Run: `node --import tsx scripts/make-demo.ts` (or `npm run demo-scenario`).
 */
import { writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { demoScenarioText } from './demo-scenario.ts';

const target = fileURLToPath(new URL('../resources/demo-scenario.json', import.meta.url));
writeFileSync(target, demoScenarioText());
console.log(`wrote ${target}`);
