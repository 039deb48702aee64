/**
 * Leaving the Bench and coming back, through the real page and router with the plans API mocked: the last edits
 * are saved before the next page opens, and the open plan's undo history is still there on return.
 */
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { defineComponent, h } from 'vue';
import { flushPromises, mount } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import { createMemoryHistory, createRouter, RouterView } from 'vue-router';
import { QueryClient, VueQueryPlugin } from '@tanstack/vue-query';
import { NDialogProvider, NMessageProvider } from 'naive-ui';
import type { Plan } from '@shared/engine';
import type { PlanRecord } from '@shared/schemas';
import { useBenchStore } from '@/stores/bench.store';
import { useSessionStore } from '@/stores/session.store';
import { twoSetPlan } from './bench-fixture';

const api = vi.hoisted(() => ({
  get: vi.fn(),
  update: vi.fn(),
}));
vi.mock('@/api/plans', () => ({ plansApi: api }));

const Blank = { render: () => h('p', 'another page') };

function record(id: string, document: Plan, updatedAt: string): PlanRecord {
  return {
    id,
    name: document.name,
    description: '',
    setCount: document.sets.length,
    faultCount: 0,
    shared: false,
    access: 'owner',
    ownerName: 'Test restorer',
    deletedAt: null,
    revision: 1,
    updatedAt,
    createdAt: '2026-03-01T09:00:00.000Z',
    document,
  };
}

/** The server as the mock keeps it: one stored copy per plan, stamped anew on every save. */
function fakeServer() {
  const stored = new Map<string, PlanRecord>([
    ['p1', record('p1', twoSetPlan(), '2026-03-14T09:00:00.000Z')],
    ['p2', record('p2', { ...twoSetPlan(), name: 'Second board' }, '2026-03-14T09:00:00.000Z')],
  ]);
  let clock = 0;
  api.get.mockImplementation(async (id: string) => stored.get(id));
  api.update.mockImplementation(async (id: string, document: Plan) => {
    clock += 1;
    const next = record(id, document, `2026-03-14T10:00:0${clock}.000Z`);
    stored.set(id, next);
    return next;
  });
  return stored;
}

async function mountApp() {
  const pinia = createPinia();
  setActivePinia(pinia);
  const router = createRouter({
    history: createMemoryHistory(),
    routes: [
      { path: '/plans', component: Blank },
      {
        path: '/plans/:id',
        name: 'bench',
        component: () => import('@/pages/bench/index.vue'),
        props: true,
      },
      { path: '/plans/:id/sheet', component: Blank },
      { path: '/sign-up', name: 'sign-up', component: Blank },
    ],
  });
  const queryClient = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  const Shell = defineComponent({
    render: () =>
      h(NMessageProvider, null, () =>
        h(NDialogProvider, null, () =>
          h(RouterView, null, {
            default: ({ Component, route }: { Component: unknown; route: { fullPath: string } }) =>
              Component ? h(Component as never, { key: route.fullPath }) : null,
          }),
        ),
      ),
  });
  await router.push('/plans/p1');
  const wrapper = mount(Shell, {
    global: { plugins: [pinia, router, [VueQueryPlugin, { queryClient }]] },
    attachTo: document.body,
  });
  await settle();
  return { wrapper, router, store: useBenchStore(pinia), session: useSessionStore(pinia) };
}

async function settle() {
  for (let i = 0; i < 5; i += 1) await flushPromises();
}

beforeEach(() => {
  localStorage.clear();
  vi.clearAllMocks();
});
afterEach(() => {
  document.body.innerHTML = '';
});

describe('leaving the Bench', () => {
  it('waits for the waiting edit to be saved before the next page opens, without waiting for the pause', async () => {
    const stored = fakeServer();
    const { wrapper, router, store } = await mountApp();
    expect(store.plan?.name).toBe('Workshop test board');
    const save = api.update.getMockImplementation()!;
    let arrive = () => {};
    api.update.mockImplementationOnce(
      (id: string, document: Plan) => new Promise((resolve) => (arrive = () => resolve(save(id, document)))),
    );
    store.renamePart('front', 'Reception');
    expect(api.update).not.toHaveBeenCalled();

    // Long before the autosave pause (800 ms) would have run out.
    const leaving = router.push('/plans/p1/sheet');
    await settle();
    expect(api.update).toHaveBeenCalledTimes(1);
    expect(router.currentRoute.value.path).toBe('/plans/p1');
    arrive();
    await leaving;
    expect(router.currentRoute.value.path).toBe('/plans/p1/sheet');
    expect(stored.get('p1')!.document.sets.find((s) => s.id === 'front')?.name).toBe('Reception');
    expect(store.unsaved).toBe(false);
    wrapper.unmount();
  });

  it('saves the waiting edit when the tab is hidden or closed', async () => {
    fakeServer();
    const { wrapper, store } = await mountApp();
    store.renamePart('front', 'Reception');
    Object.defineProperty(document, 'visibilityState', { value: 'hidden', configurable: true });
    document.dispatchEvent(new Event('visibilitychange'));
    await settle();
    expect(api.update).toHaveBeenCalledTimes(1);
    Object.defineProperty(document, 'visibilityState', { value: 'visible', configurable: true });

    store.renamePart('back', 'Stock room');
    const closing = new Event('beforeunload', { cancelable: true });
    window.dispatchEvent(closing);
    // The browser is asked to confirm: the save just sent may still be on its way.
    expect(closing.defaultPrevented).toBe(true);
    await settle();
    expect(api.update).toHaveBeenCalledTimes(2);
    expect((api.update.mock.calls[1][1] as Plan).sets.find((s) => s.id === 'back')?.name).toBe('Stock room');
    wrapper.unmount();
  });
});

describe('undo history across pages', () => {
  it('is still there after the work sheet and back', async () => {
    fakeServer();
    const { wrapper, router, store } = await mountApp();
    store.renamePart('front', 'Reception');
    store.liftLead('back', 18);
    await router.push('/plans/p1/sheet');
    await settle();
    await router.push('/plans/p1');
    await settle();

    expect(store.past.map((e) => e.label)).toEqual([
      'Rename Front desk to Reception',
      'Lift pair 18 in Back room',
    ]);
    store.undo();
    expect(store.plan?.sets.find((s) => s.id === 'back')?.leadChanges ?? []).toEqual([]);
    wrapper.unmount();
  });

  it('is dropped when another plan opens, and on sign-out', async () => {
    fakeServer();
    const { wrapper, router, store, session } = await mountApp();
    store.renamePart('front', 'Reception');
    await router.push('/plans/p2');
    await settle();
    expect(store.plan?.name).toBe('Second board');
    expect(store.canUndo).toBe(false);

    store.renamePart('front', 'Counter');
    expect(store.canUndo).toBe(true);
    session.setUser({
      id: 'u1',
      email: 'wren@example.org',
      displayName: 'Wren',
      role: 'restorer',
    } as never);
    await settle();
    session.setUser(null);
    await settle();
    expect(store.plan).toBeNull();
    expect(store.canUndo).toBe(false);
    wrapper.unmount();
  });
});
