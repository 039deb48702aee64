/// <reference lib="webworker" />
/**
 * Runs the engine's sweep and cure off the main thread so the canvas stays responsive.
 * Cancelling is done by the page terminating this worker; progress is throttled to a few per second.
 */
import type { Highs } from 'highs';
import highsWasm from 'highs/runtime?url';
import { cureOptimal, sweep } from '@shared/engine';
import type { EngineReply, EngineRequest } from './engine-protocol';

const PROGRESS_EVERY_MS = 80;

const post = (reply: EngineReply) => (self as unknown as DedicatedWorkerGlobalScope).postMessage(reply);

/** The solver's WebAssembly is a bundled asset: tell the loader its URL instead of letting it guess. */
let solver: Promise<Highs> | null = null;
const loadSolver = () => (solver ??= import('highs').then((m) => m.default({ locateFile: () => highsWasm })));

self.addEventListener('message', async (event: MessageEvent<EngineRequest>) => {
  const request = event.data;
  let last = 0;
  const onProgress = (done: number, total: number) => {
    const now = Date.now();
    if (now - last < PROGRESS_EVERY_MS && done < total) return;
    last = now;
    post({ type: 'progress', id: request.id, done, total });
  };
  try {
    if (request.type === 'sweep') {
      const result = sweep(request.plan, { onProgress, limit: request.limit });
      post({ type: 'sweep-done', id: request.id, result });
    } else {
      const result = await cureOptimal(request.plan, { ...request.choices, loadSolver });
      post({ type: 'cure-done', id: request.id, result });
    }
  } catch (err) {
    solver = null;
    post({ type: 'failed', id: request.id, message: err instanceof Error ? err.message : String(err) });
  }
});
