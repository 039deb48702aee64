/** Mounts a Bench panel over the engine worker composable, with the real engine standing in for the Web Worker. */
import { defineComponent, h, type Component } from 'vue';
import { mount } from '@vue/test-utils';
import { NMessageProvider } from 'naive-ui';
import { cureOptimal, sweep } from '@shared/engine';
import { useEngineWorker } from '@/composables/bench/use-engine-worker';
import type { EngineReply, EngineRequest } from '@/workers/engine-protocol';

/** Same messages as the worker, the real engine, answered on a later tick; `limit` caps a sweep's states. */
export class InlineWorker extends EventTarget {
  terminated = false;
  requests: EngineRequest[] = [];
  constructor(private readonly limit?: number) {
    super();
  }
  postMessage(request: EngineRequest) {
    this.requests.push(request);
    setTimeout(async () => {
      if (this.terminated) return;
      const reply: EngineReply =
        request.type === 'sweep'
          ? { type: 'sweep-done', id: request.id, result: sweep(request.plan, { limit: this.limit }) }
          : { type: 'cure-done', id: request.id, result: await cureOptimal(request.plan, request.choices) };
      if (!this.terminated) this.dispatchEvent(new MessageEvent('message', { data: reply }));
    }, 0);
  }
  terminate() {
    this.terminated = true;
  }
}

export function workerHost(panel: Component, opts: { limit?: number } = {}) {
  let worker!: ReturnType<typeof useEngineWorker>;
  const made: InlineWorker[] = [];
  const Host = defineComponent({
    setup() {
      worker = useEngineWorker(() => {
        const w = new InlineWorker(opts.limit);
        made.push(w);
        return w as unknown as Worker;
      });
      return () => h(NMessageProvider, null, { default: () => h(panel, { worker }) });
    },
  });
  return {
    wrapper: mount(Host),
    made,
    get worker() {
      return worker;
    },
  };
}

/** Polls until the worker has answered (the cure loads its solver and sweeps several times). */
export async function untilIdle(worker: ReturnType<typeof useEngineWorker>, ms = 25_000): Promise<void> {
  const end = Date.now() + ms;
  while (worker.running.value && Date.now() < end) await new Promise((r) => setTimeout(r, 10));
}
