import { afterEach, describe, expect, it, vi } from 'vitest';
import { defineComponent } from 'vue';
import { flushPromises, mount } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import { createMemoryHistory, createRouter } from 'vue-router';
import type { Plan } from '@shared/engine';
import WorkSheetPage from '@/pages/work-sheet/index.vue';
import { useBenchStore } from '@/stores/bench.store';
import { twoSetPlan } from './bench/bench-fixture';

const Blank = defineComponent({ render: () => null });

function record(document: Plan) {
  return {
    id: 'p1',
    name: document.name,
    description: '',
    setCount: document.sets.length,
    faultCount: 0,
    shared: false,
    access: 'owner',
    ownerName: 'Test restorer',
    deletedAt: null,
    revision: 1,
    updatedAt: '2026-03-14T09:00:00.000Z',
    createdAt: '2026-03-01T09:00:00.000Z',
    document,
  };
}

function withLift(plan: Plan): Plan {
  return {
    ...plan,
    sets: plan.sets.map((s, i) =>
      i === 0 ? { ...s, leadChanges: [{ kind: 'lift' as const, pair: 18, conductor: 'both' as const }] } : s,
    ),
  };
}

async function mountPage(answers: Response[], benchPlan?: Plan) {
  const fetchMock = vi.fn(async () => answers.shift() ?? Response.json({}, { status: 500 }));
  vi.stubGlobal('fetch', fetchMock);
  const pinia = createPinia();
  setActivePinia(pinia);
  if (benchPlan) useBenchStore(pinia).load('p1', benchPlan, '2026-03-14T08:00:00.000Z');
  const router = createRouter({
    history: createMemoryHistory(),
    routes: [
      { path: '/plans', component: Blank },
      { path: '/plans/:id', component: Blank },
      { path: '/plans/:id/sheet', component: Blank },
    ],
  });
  await router.push('/plans/p1/sheet');
  const wrapper = mount(WorkSheetPage, { props: { id: 'p1' }, global: { plugins: [pinia, router] } });
  await flushPromises();
  return { wrapper, fetchMock };
}

afterEach(() => {
  vi.unstubAllGlobals();
  document.documentElement.classList.remove('lb-print-sheet');
});

describe('work sheet page', () => {
  it('loads the plan, shows its sheet and marks the page for the print rules until it closes', async () => {
    const { wrapper, fetchMock } = await mountPage([Response.json(record(withLift(twoSetPlan())))]);

    expect(fetchMock).toHaveBeenCalledWith('/api/plans/p1', expect.objectContaining({ method: 'GET' }));
    expect(wrapper.get('[data-testid="sheet-plan-name"]').text()).toBe('Workshop test board');
    // Pair 18 is yellow-green (ICEA S-80-576).
    expect(wrapper.get('[data-testid="sheet-step-1"]').text()).toContain('yellow-green');
    expect(document.documentElement.classList.contains('lb-print-sheet')).toBe(true);

    wrapper.unmount();
    expect(document.documentElement.classList.contains('lb-print-sheet')).toBe(false);
  });

  it('calls the browser print dialog from the Print button', async () => {
    const print = vi.fn();
    vi.stubGlobal('print', print);
    const { wrapper } = await mountPage([Response.json(record(withLift(twoSetPlan())))]);

    await wrapper.get('[data-testid="sheet-print"]').trigger('click');

    expect(print).toHaveBeenCalledTimes(1);
    wrapper.unmount();
  });

  it('waits for the Bench’s last save when the server copy is older than the Bench’s', async () => {
    const fresh = withLift(twoSetPlan());
    const { wrapper, fetchMock } = await mountPage(
      [Response.json(record(twoSetPlan())), Response.json(record(fresh))],
      fresh,
    );

    await vi.waitFor(() => expect(wrapper.find('[data-testid="sheet-step-1"]').exists()).toBe(true), {
      timeout: 3000,
    });
    expect(fetchMock).toHaveBeenCalledTimes(2);
    expect(wrapper.find('[role="status"]').exists()).toBe(false);
    wrapper.unmount();
  });

  it('says so when the plan does not exist, without a Print button', async () => {
    const missing = Response.json(
      { error: { code: 'NOT_FOUND', message: 'No such plan.' } },
      { status: 404 },
    );
    const { wrapper } = await mountPage([missing]);

    expect(wrapper.text()).toContain('Plan not found');
    expect(wrapper.find('[data-testid="sheet-print"]').exists()).toBe(false);
    wrapper.unmount();
  });
});
