/**
 * `npm run bench`: what one option run costs, against a peer measured in the same run.
 * 1. The demo scenario (16 bands, 365 days), one core: median per option, as CPU time of this
 *    thread (what the engine costs, unaffected by other processes taking the core) and wall time.
 *    Also a triggered option (measures switched by ICU occupancy) against the same measures on
 *    fixed days.
 * 2. The peer: the same model in scipy (bench/scipy_peer.py: solve_ivp RK45, rtol 1e-6, atol
 *    scaled to the population), on the demo's options without vaccination; the ratio per option.
 *    Skipped, with a note, where python3 with scipy is missing (Debian: apt-get install python3-scipy).
 * 3. A batch of 1000 options (the demo's options with varied multipliers) on this thread, on a pool
 *    of 1 worker and on one worker per core, each warmed up by one batch and timed as the median of
 *    three (a fresh pool's first batch, start-up and JIT warm-up included, beside it): wall time,
 *    and CPU time over all threads, split (Linux) into this thread, the workers and V8's helper
 *    threads (compiler, GC): the pool's own cost, which other processes on the machine do not
 *    change. Then `mixwise run` of the same 1000 options in its own process, from start, on one
 *    thread and on one per core, with its peak resident memory (this process keeps several
 *    batches, so its own peak would overstate it), read by bench/peakMemory.mjs in the child.
 * 4. Uncertainty draws (bench/drawsBench.ts): 1,000 draws of the demo's options on one worker per
 *    core, wall and CPU time against the goal of at most 5 s on two cores.
 * Timings on a shared machine are noisy: compare the ratios, and rerun.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { availableParallelism, cpus, tmpdir } from 'node:os';
import { join } from 'node:path';
import { poolWorkerScript } from '../src/cli/poolWorkerScript.ts';
import { nodeWorkerPool } from '../src/cli/workerThreads.ts';
import { cpuSplit, threadCpu } from './threadCpu.ts';
import { benchDraws } from './drawsBench.ts';
import { prepareScenario } from '../src/engine/prepare.ts';
import { runScenarioSummary, runScenarioSummaryOnPool } from '../src/engine/run.ts';
import type { PolicyOption, Scenario } from '../src/engine/scenario.ts';
import { segmentsOf } from '../src/engine/segments.ts';
import { simulateOption } from '../src/engine/simulate.ts';
import { parseScenarioText } from '../src/engine/validation.ts';

const parsed = parseScenarioText(readFileSync(new URL('../resources/demo-scenario.json', import.meta.url), 'utf8'));
if (!parsed.ok) throw new Error('demo scenario is invalid');
const demo = parsed.scenario;
const prepared = prepareScenario(demo);

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)];
}

/** Median milliseconds of `run` per call: CPU time of this thread (batches of `batch` calls) and wall time. */
function measure(run: () => void, repeats: number, batch: number): { cpu: number; wall: number } {
  const cpu: number[] = [];
  const wall: number[] = [];
  for (let r = 0; r < repeats; r++) {
    const c0 = process.cpuUsage();
    const t0 = performance.now();
    for (let k = 0; k < batch; k++) run();
    wall.push((performance.now() - t0) / batch);
    const c = process.cpuUsage(c0);
    cpu.push((c.user + c.system) / 1000 / batch);
  }
  return { cpu: median(cpu), wall: median(wall) };
}

for (let k = 0; k < 20; k++) for (const o of demo.options) simulateOption(prepared, o); // warm up the JIT

console.log(`machine: ${availableParallelism()} cores (${cpus()[0]?.model ?? 'unknown'}), Node ${process.version}`);
console.log(`\n1. demo: ${demo.ageBands.length} bands, ${demo.horizonDays} days; per option on one core, median ms (CPU time / wall time)`);
console.log('   full run (every outcome and the daily series, as the app draws them) | summary run (every outcome, no daily series: draws, order searches, mixwise run)');
console.log('   targets: <= 0.5 ms without vaccination, <= 1 ms with it');
const engineMs = new Map<string, { full: number; summary: number }>();
for (const option of demo.options) {
  const full = measure(() => simulateOption(prepared, option), 25, 4);
  const summary = measure(() => simulateOption(prepared, option, { series: 'summary' }), 25, 4);
  engineMs.set(option.name, { full: full.cpu, summary: summary.cpu });
  const kind = option.vaccinationCampaign === undefined ? '' : ' (vaccination)';
  console.log(`   ${(option.name + kind).padEnd(40)} full ${full.cpu.toFixed(3)} / ${full.wall.toFixed(3)} | summary ${summary.cpu.toFixed(3)} / ${summary.wall.toFixed(3)}`);
}

// Triggered measures (issue 14): the same measures switched by ICU occupancy, against fixed days.
{
  const fixed = demo.options.find((o) => o.phases.length === 1 && o.phases[0].fromDay > 0) ?? demo.options[1];
  const phase = fixed.phases[0];
  const triggered: PolicyOption = {
    ...fixed,
    name: `${fixed.name}, when ICU fills`,
    phases: [{ ...phase, fromDay: 0, toDay: demo.horizonDays, trigger: { quantity: 'icuOccupancy', onAbove: 80, offBelow: 40, minimumDaysOn: 14, lagDays: 3 } }],
  };
  // Warmed as the fixed option was (20 warm-up runs, 200 measured above): otherwise the JIT
  // compiling the triggered code (on compiler threads, which the process CPU time counts) lands
  // in the first of its measured runs, and their median follows how busy the machine is.
  for (let k = 0; k < 220; k++) simulateOption(prepared, triggered, { series: k % 2 === 0 ? 'full' : 'summary' });
  const a = measure(() => simulateOption(prepared, fixed), 25, 4).cpu;
  const b = measure(() => simulateOption(prepared, triggered), 25, 4).cpu;
  console.log(`   ${triggered.name.padEnd(40)} ${b.toFixed(3)} ms: ${(b / a).toFixed(2)}x the same measures on fixed days (goal <= 2x)`);
}

console.log('\n2. peer: the same model in scipy solve_ivp (RK45, rtol 1e-6), options without vaccination');
const peerOptions = demo.options.filter((o) => o.vaccinationCampaign === undefined);
const python = spawnSync('python3', ['-c', 'import scipy, numpy'], { encoding: 'utf8' });
if (python.status !== 0) {
  console.log('   skipped: python3 with scipy and numpy is not installed (Debian: apt-get install python3-scipy)');
} else {
  const L = prepared.layout;
  const n = L.bands;
  const y0 = prepared.initialState;
  const input = {
    bands: n,
    latentStages: L.latentStages,
    infectiousStages: L.infectiousStages,
    latentPeriodDays: prepared.periods.latentPeriodDays,
    infectiousPeriodDays: prepared.periods.infectiousPeriodDays,
    horizonDays: demo.horizonDays,
    population: Array.from(prepared.bands.population),
    susceptible0: Array.from(y0.subarray(L.susceptible, L.susceptible + n)),
    latent0: Array.from(y0.subarray(L.latent, L.latent + n)),
    infectious0: Array.from(y0.subarray(L.infectious, L.infectious + n)),
    recovered0: Array.from(y0.subarray(L.recovered, L.recovered + n)),
    ifr: Array.from(prepared.infectionFatalityRatio),
    repeats: 7,
    options: peerOptions.map((o) => ({
      name: o.name,
      segments: segmentsOf(prepared, o, []).map((seg) => ({ fromDay: seg.fromDay, toDay: seg.toDay, transmission: Array.from(seg.transmission) })),
    })),
  };
  const peer = spawnSync('python3', [new URL('./scipy_peer.py', import.meta.url).pathname], { input: JSON.stringify(input), encoding: 'utf8', maxBuffer: 1 << 26 });
  if (peer.status !== 0) throw new Error(`scipy peer failed: ${peer.stderr}`);
  const answers = JSON.parse(peer.stdout) as { options: { name: string; secondsPerRun: number; attackRate: number; deaths: number; peakDay: number }[] };
  const ratios: number[] = [];
  const fullRatios: number[] = [];
  for (const a of answers.options) {
    const ours = engineMs.get(a.name) as { full: number; summary: number };
    const engine = simulateOption(prepared, demo.options.find((o) => o.name === a.name) as PolicyOption);
    const peerMs = 1000 * a.secondsPerRun;
    ratios.push(peerMs / ours.summary);
    fullRatios.push(peerMs / ours.full);
    const agree = Math.abs(engine.attackRate - a.attackRate) / engine.attackRate;
    console.log(
      `   ${a.name.padEnd(40)} scipy ${peerMs.toFixed(2)} ms; engine summary ${ours.summary.toFixed(3)} ms: ${(peerMs / ours.summary).toFixed(0)}x, ` +
        `full ${ours.full.toFixed(3)} ms: ${(peerMs / ours.full).toFixed(0)}x (attack rates agree to ${agree.toExponential(1)})`,
    );
  }
  console.log(`   median ratio ${median(ratios).toFixed(0)}x for a summary run (the peer computes no more), ${median(fullRatios).toFixed(0)}x for a full run (target >= 30x)`);
}

/** 1000 options: the demo's options with their setting multipliers scaled. */
function batchScenario(count: number): Scenario {
  const options: PolicyOption[] = Array.from({ length: count }, (_, k) => {
    const base = demo.options[k % demo.options.length];
    const scale = 0.5 + (k % 50) / 50;
    const phases = base.phases.map((p) => ({ ...p, settingMultipliers: Object.fromEntries(Object.entries(p.settingMultipliers ?? {}).map(([s, m]) => [s, m * scale])) }));
    return { ...base, name: `batch ${k}`, phases };
  });
  return { ...demo, referenceOption: undefined, options };
}

const batch = batchScenario(1000);
/** Timed batches per configuration, after one batch that warms the thread(s) up; the median is printed. */
const ROUNDS = 3;
console.log(`\n3. batch: ${batch.options.length} options, summary runs (as mixwise run); per configuration one batch to warm up, then the median of ${ROUNDS}`);
console.log('   (each batch a new revision of the scenario, so the pool sends and prepares it anew as after an edit)');
/** CPU milliseconds of the whole process, all threads. */
function processCpuMs(): number {
  const c = process.cpuUsage();
  return (c.user + c.system) / 1000;
}
/** Round r's batch: the same options under another title, so another revision. */
const roundOf = (r: number): Scenario => ({ ...batch, title: `${batch.title} (batch ${r})` });
interface BatchTiming {
  wall: number;
  cpu: number;
  /** CPU on this thread, the pool's worker threads and V8's helper threads (compiler, GC); null off Linux. */
  split: { main: number; workers: number; helpers: number } | null;
}
/** Wall and CPU milliseconds per option of `run` over a warm-up batch and ROUNDS timed ones (medians). */
async function timeBatches(run: (s: Scenario) => unknown, workers: ReadonlySet<number>): Promise<BatchTiming> {
  await run(roundOf(0));
  const rounds: BatchTiming[] = [];
  for (let r = 1; r <= ROUNDS; r++) {
    const s = roundOf(r);
    const threads0 = threadCpu();
    const cpu0 = processCpuMs();
    const t0 = performance.now();
    await run(s);
    const wall = performance.now() - t0;
    const cpu = processCpuMs() - cpu0;
    const threads1 = threadCpu();
    rounds.push({ wall, cpu, split: threads0 === null || threads1 === null ? null : cpuSplit(threads0, threads1, workers) });
  }
  const n = batch.options.length;
  const mid = (f: (t: BatchTiming) => number) => median(rounds.map(f)) / n;
  const split = rounds.every((t) => t.split !== null) ? { main: mid((t) => t.split?.main ?? 0), workers: mid((t) => t.split?.workers ?? 0), helpers: mid((t) => t.split?.helpers ?? 0) } : null;
  return { wall: mid((t) => t.wall), cpu: mid((t) => t.cpu), split };
}
const ms2 = (x: number) => x.toFixed(2);
{
  const t0 = performance.now();
  poolWorkerScript();
  console.log(`   the pool threads' script, bundled once per process (src/cli/poolWorkerScript.ts): ${(performance.now() - t0).toFixed(0)} ms`);
}
const inline = await timeBatches((s) => runScenarioSummary(s), new Set());
console.log(
  `   this thread:         ${ms2(inline.wall)} ms per option; CPU ${ms2(inline.cpu)} ms per option` +
    (inline.split === null ? '' : ` (this thread ${ms2(inline.split.main)}, V8 helper threads ${ms2(inline.split.helpers)})`),
);
for (const size of [1, availableParallelism()]) {
  const before = threadCpu();
  const t0 = performance.now();
  const pool = nodeWorkerPool(size);
  try {
    // A fresh pool: threads started, the script loaded, the JIT cold; then warm batches.
    await runScenarioSummaryOnPool(pool, roundOf(-1));
    const fresh = performance.now() - t0;
    const after = threadCpu();
    const workers = new Set(before === null || after === null ? [] : [...after.keys()].filter((tid) => !before.has(tid)));
    const warm = await timeBatches((s) => runScenarioSummaryOnPool(pool, s), workers);
    const label = `pool of ${size} worker${size === 1 ? ': ' : 's:'}`.padEnd(21);
    console.log(`   ${label}${ms2(warm.wall)} ms per option, ${(inline.wall / warm.wall).toFixed(2)}x this thread (a fresh pool's first batch, start-up and JIT warm-up included: ${ms2(fresh / batch.options.length)} ms per option)`);
    // CPU time does not depend on what else the machine runs: what the pool costs beyond the runs themselves.
    console.log(
      `      CPU per option: ${ms2(warm.cpu)} ms all threads, ${(warm.cpu / inline.cpu).toFixed(2)}x this thread's batch alone` +
        (warm.split === null ? '' : ` (worker threads ${ms2(warm.split.workers)}, V8 helper threads ${ms2(warm.split.helpers)}, this thread ${(warm.split.main).toFixed(3)})`),
    );
  } finally {
    pool.close();
  }
}

// `mixwise run` of the 1000 options in its own process, as an analyst runs it: on one thread and
// on one thread per core, from process start (tsx, threads, JIT warm-up and all), and its memory.
{
  const dir = mkdtempSync(join(tmpdir(), 'mixwise-bench-'));
  try {
    const file = join(dir, 'batch.json');
    writeFileSync(file, JSON.stringify(batch));
    const bin = new URL('../bin/mixwise.mjs', import.meta.url).pathname;
    const peak = new URL('./peakMemory.mjs', import.meta.url).pathname;
    const runChild = (workers: number) => {
      const t0 = performance.now();
      const child = spawnSync(process.execPath, ['--import', peak, bin, 'run', file, '--workers', String(workers), '--format', 'json', '--out', join(dir, 'out.json')], { encoding: 'utf8' });
      const wall = performance.now() - t0;
      const kb = /peak-rss-kb (\d+)/.exec(child.stderr ?? '');
      const cpu = /cpu-ms (\d+)/.exec(child.stderr ?? '');
      if (child.status !== 0 || kb === null || cpu === null) throw new Error(`mixwise run failed: ${child.stderr}`);
      return { wall, cpu: Number(cpu[1]), mb: Number(kb[1]) / 1024 };
    };
    const one = runChild(1);
    const cores = availableParallelism();
    const all = runChild(cores);
    console.log(
      `   mixwise run of the ${batch.options.length} options (own process, from start): 1 thread ${(one.wall / 1000).toFixed(2)} s (CPU ${(one.cpu / 1000).toFixed(2)} s), ` +
        `${cores} threads ${(all.wall / 1000).toFixed(2)} s (CPU ${(all.cpu / 1000).toFixed(2)} s): ${(one.wall / all.wall).toFixed(2)}x`,
    );
    console.log(`      peak resident memory on ${cores} threads ${all.mb.toFixed(0)} MB (target < 500 MB)`);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

await benchDraws(demo);
