/**
 * The engine worker: runs every option of a scenario off the main thread.
 * A newer `run` cancels an older one at the next option boundary (see engineProtocol.ts).
 */
import { prepareScenario, reciprocityBySetting, referenceIndexOf, simulateOption } from '../../engine/index.ts';
import type { OptionResults } from '../../engine/results.ts';
import { transferablesOf, type EngineReply, type EngineRequest } from './engineProtocol.ts';

let newestRunId = -1;

/** Lets queued messages (a newer run) arrive before the next option starts. */
function yieldToMessages(): Promise<void> {
  return new Promise((resolve) => setTimeout(resolve, 0));
}

function reply(message: EngineReply, transfer: ArrayBuffer[] = []): void {
  (self as unknown as Worker).postMessage(message, transfer);
}

async function run({ runId, scenario }: EngineRequest): Promise<void> {
  await yieldToMessages();
  if (runId !== newestRunId) return reply({ type: 'cancelled', runId });
  const started = performance.now();
  try {
    const prepared = prepareScenario(scenario);
    const options: OptionResults[] = [];
    for (const option of scenario.options) {
      options.push(simulateOption(prepared, option));
      await yieldToMessages();
      if (runId !== newestRunId) return reply({ type: 'cancelled', runId });
    }
    const results = {
      title: scenario.title,
      ageBands: scenario.ageBands.map((b) => b.label),
      r0: prepared.r0,
      beta: prepared.beta,
      referenceIndex: referenceIndexOf(scenario),
      options,
      reciprocity: reciprocityBySetting(scenario),
    };
    reply({ type: 'results', runId, results, computeMs: performance.now() - started }, transferablesOf(results));
  } catch (err) {
    reply({ type: 'failed', runId, message: err instanceof Error ? err.message : String(err) });
  }
}

self.addEventListener('message', (event: MessageEvent<EngineRequest>) => {
  if (event.data?.type !== 'run') return;
  newestRunId = Math.max(newestRunId, event.data.runId);
  void run(event.data);
});
