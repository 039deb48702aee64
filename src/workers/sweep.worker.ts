/// <reference lib="webworker" />
/**
 * Runs the engine's sweep and cure off the main thread so the canvas stays responsive.
 * Cancelling is done by the page terminating this worker; progress is throttled to a few per second.
 */
import { cureOptimal, sweep } from '@shared/engine';
import highsWasmUrl from 'highs/runtime?url';
import type { SweepReply, SweepRequest } from './sweep-protocol';

/** The solver's WebAssembly file is a build asset with a hashed name: tell the loader where it is. */
const loadSolver = () =>
  import('highs').then((m) => m.default({ locateFile: (file: string) => (file.endsWith('.wasm') ? highsWasmUrl : file) }));

const PROGRESS_EVERY_MS = 80;

const post = (reply: SweepReply) => (self as unknown as DedicatedWorkerGlobalScope).postMessage(reply);

self.addEventListener('message', async (event: MessageEvent<SweepRequest>) => {
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
      const result = await cureOptimal(request.plan, { loadSolver });
      post({ type: 'cure-done', id: request.id, result });
    }
  } catch (err) {
    post({ type: 'failed', id: request.id, message: err instanceof Error ? err.message : String(err) });
  }
});
