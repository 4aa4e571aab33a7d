/**
 * `npm run bench`: how long the engine takes per policy option.
 * 1. The demo scenario (16 bands, 365 days): median over repeated runs of each option.
 * 2. A batch of 1000 options (the demo's options repeated with varied multipliers): total and per option.
 * Prints the machine's core count; the engine runs on one core.
 */
import { availableParallelism, cpus } from 'node:os';
import { readFileSync } from 'node:fs';
import { prepareScenario } from '../src/engine/prepare.ts';
import { runScenario } from '../src/engine/run.ts';
import { simulateOption } from '../src/engine/simulate.ts';
import type { PolicyOption } from '../src/engine/scenario.ts';
import { parseScenarioText } from '../src/engine/validation.ts';

const parsed = parseScenarioText(readFileSync(new URL('../resources/demo-scenario.json', import.meta.url), 'utf8'));
if (!parsed.ok) throw new Error('demo scenario is invalid');
const demo = parsed.scenario;

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)];
}

const prepared = prepareScenario(demo);
for (let k = 0; k < 20; k++) for (const o of demo.options) simulateOption(prepared, o); // warm up the JIT

console.log(`machine: ${availableParallelism()} cores (${cpus()[0]?.model ?? 'unknown'}), Node ${process.version}`);
console.log(`demo: ${demo.ageBands.length} bands, ${demo.horizonDays} days, ${demo.options.length} options`);
for (const option of demo.options) {
  const times: number[] = [];
  for (let k = 0; k < 30; k++) {
    const t0 = performance.now();
    simulateOption(prepared, option);
    times.push(performance.now() - t0);
  }
  console.log(`  ${option.name.padEnd(28)} median ${median(times).toFixed(2)} ms`);
}
const whole: number[] = [];
for (let k = 0; k < 20; k++) {
  const t0 = performance.now();
  runScenario(demo);
  whole.push(performance.now() - t0);
}
console.log(`  whole scenario (prepare + all options): median ${median(whole).toFixed(2)} ms`);

const batch: PolicyOption[] = Array.from({ length: 1000 }, (_, k) => {
  const base = demo.options[k % demo.options.length];
  const scale = 0.5 + (k % 50) / 50;
  return { ...base, name: `batch ${k}`, phases: base.phases.map((p) => ({ ...p, settingMultipliers: Object.fromEntries(Object.entries(p.settingMultipliers).map(([s, m]) => [s, m * scale])) })) };
});
const t0 = performance.now();
runScenario({ ...demo, referenceOption: undefined, options: batch });
const total = performance.now() - t0;
console.log(`batch: 1000 options in ${total.toFixed(0)} ms = ${(total / 1000).toFixed(2)} ms per option`);
