/**
 * Sweep and cure in a Web Worker, with progress and cancel. Cancel terminates the worker (a running
 * sweep never yields to read a message); the next run starts a fresh one.
 */
import { onBeforeUnmount, ref, shallowRef } from 'vue';
import type { OptimalCureResult, Plan, SweepResult } from '@shared/engine';
import type { CureChoices, EngineReply, EngineRequest } from '@/workers/engine-protocol';

export type EngineJob = 'sweep' | 'cure';

export function useEngineWorker(createWorker: () => Worker = defaultWorker) {
  const running = ref<EngineJob | null>(null);
  const progress = ref<{ done: number; total: number } | null>(null);
  const sweepResult = shallowRef<SweepResult | null>(null);
  const cureResult = shallowRef<OptimalCureResult | null>(null);
  /** The document the last result was computed for, so the panel can tell when it is out of date. */
  const resultPlan = shallowRef<Plan | null>(null);
  const cureBase = shallowRef<Plan | null>(null);
  const error = ref<string | null>(null);

  let worker: Worker | null = null;
  let nextId = 1;
  let currentId = 0;

  function ensureWorker(): Worker {
    if (worker) return worker;
    worker = createWorker();
    worker.addEventListener('message', (event: MessageEvent<EngineReply>) => onReply(event.data));
    worker.addEventListener('error', (event) => {
      error.value = event.message || 'The engine worker stopped unexpectedly.';
      stop();
    });
    return worker;
  }

  function onReply(reply: EngineReply) {
    if (reply.id !== currentId) return;
    if (reply.type === 'progress') {
      progress.value = { done: reply.done, total: reply.total };
      return;
    }
    if (reply.type === 'sweep-done') sweepResult.value = reply.result;
    else if (reply.type === 'cure-done') cureResult.value = reply.result;
    else error.value = reply.message;
    running.value = null;
  }

  function start(job: EngineJob, plan: Plan, choices: CureChoices = { keepAddOn: [], untouched: [] }) {
    if (running.value) cancel();
    error.value = null;
    progress.value = null;
    currentId = nextId++;
    running.value = job;
    if (job === 'sweep') resultPlan.value = plan;
    else cureBase.value = plan;
    // A plain copy: the document is a shallowRef of frozen-ish objects and must cross the worker boundary.
    const payload = JSON.parse(JSON.stringify(plan)) as Plan;
    const request: EngineRequest =
      job === 'sweep'
        ? { type: 'sweep', id: currentId, plan: payload }
        : { type: 'cure', id: currentId, plan: payload, choices: { ...choices } };
    try {
      ensureWorker().postMessage(request);
    } catch (err) {
      error.value = err instanceof Error ? err.message : String(err);
      running.value = null;
    }
  }

  function stop() {
    worker?.terminate();
    worker = null;
    running.value = null;
  }

  function cancel() {
    currentId = 0;
    stop();
    progress.value = null;
  }

  function clearCure() {
    cureResult.value = null;
    cureBase.value = null;
  }

  onBeforeUnmount(stop);

  return {
    running,
    progress,
    sweepResult,
    cureResult,
    resultPlan,
    cureBase,
    error,
    sweep: (plan: Plan) => start('sweep', plan),
    cure: (plan: Plan, choices?: CureChoices) => start('cure', plan, choices),
    cancel,
    clearCure,
  };
}

function defaultWorker(): Worker {
  return new Worker(new URL('../../workers/engine.worker.ts', import.meta.url), {
    type: 'module',
    name: 'engine',
  });
}
