/**
 * The engine worker: runs every option of a scenario off the main thread.
 * A newer `run` cancels an older one at the next option boundary (see engineProtocol.ts).
 * `orders` answers with the vaccination order templates and the coverage needed for R < 1; it
 * waits until no run is going, so it never delays the redraw after an edit (newest request only).
 */
import { compareWithReference, coverageNeededForRBelowOne, ORDER_TEMPLATES, prepareScenario, priorityFromTemplate, reciprocityBySetting, referenceIndexOf, simulateOption, type OptionResults, type Scenario } from '../../engine/index.ts';
import { transferablesOf, type EngineReply, type EngineRequest, type OrdersInfo } from './engineProtocol.ts';

let newestRunId = -1;
/** Runs started and not yet finished or cancelled. */
let activeRuns = 0;
let pendingOrders: { requestId: number; scenario: Scenario; optionIndex: number } | null = null;

/** Lets queued messages (a newer run) arrive before the next option starts. */
function yieldToMessages(): Promise<void> {
  return new Promise((resolve) => setTimeout(resolve, 0));
}

function reply(message: EngineReply, transfer: ArrayBuffer[] = []): void {
  (self as unknown as Worker).postMessage(message, transfer);
}

async function run({ runId, scenario }: { runId: number; scenario: Scenario }): Promise<void> {
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
    const referenceIndex = referenceIndexOf(scenario);
    for (const o of options) o.comparison = compareWithReference(o, options[referenceIndex]);
    const results = {
      title: scenario.title,
      ageBands: scenario.ageBands.map((b) => b.label),
      r0: prepared.r0,
      beta: prepared.beta,
      referenceIndex,
      options,
      reciprocity: reciprocityBySetting(scenario),
    };
    reply({ type: 'results', runId, results, computeMs: performance.now() - started }, transferablesOf(results));
  } catch (err) {
    reply({ type: 'failed', runId, message: err instanceof Error ? err.message : String(err) });
  }
}

function answerOrdersWhenIdle(): void {
  if (activeRuns > 0 || pendingOrders === null) return;
  const { requestId, scenario, optionIndex } = pendingOrders;
  pendingOrders = null;
  try {
    const prepared = prepareScenario(scenario);
    const option = scenario.options[optionIndex];
    const campaign = scenario.vaccinationCampaigns.find((c) => c.name === option?.vaccinationCampaign);
    const info: OrdersInfo = {
      templates: ORDER_TEMPLATES.map((t) => ({ ...t, priority: priorityFromTemplate(t.id, prepared) })),
      coverage: option !== undefined && campaign !== undefined ? coverageNeededForRBelowOne(prepared, option, campaign) : null,
    };
    reply({ type: 'orders', requestId, orders: info });
  } catch (err) {
    reply({ type: 'orders-failed', requestId, message: err instanceof Error ? err.message : String(err) });
  }
}

self.addEventListener('message', (event: MessageEvent<EngineRequest>) => {
  const request = event.data;
  if (request?.type === 'run') {
    newestRunId = Math.max(newestRunId, request.runId);
    activeRuns++;
    void run(request).finally(() => {
      activeRuns--;
      answerOrdersWhenIdle();
    });
  } else if (request?.type === 'orders') {
    pendingOrders = request;
    setTimeout(answerOrdersWhenIdle, 0);
  }
});
