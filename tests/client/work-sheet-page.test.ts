import { afterEach, describe, expect, it, vi } from 'vitest';
import { defineComponent } from 'vue';
import { flushPromises, mount } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import { createMemoryHistory, createRouter } from 'vue-router';
import type { Plan } from '@shared/engine';
import WorkSheetPage from '@/pages/work-sheet/index.vue';
import { QueryClient, VueQueryPlugin } from '@tanstack/vue-query';
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

type Answer = (init: RequestInit) => Response;

/** The work record as the server answers before anything is kept: the as-found list from the plan itself. */
const emptyRecord = () => ({
  planId: 'p1',
  recordedAt: null,
  asFound: [
    {
      partId: 'a',
      kind: 'set',
      name: 'Desk A',
      templateTitle: 'Six-key set',
      // Pair 18 is yellow-green; tip on pin 43, ring on pin 18 (ICEA S-80-576, USOC RJ21X).
      leads: [
        {
          pair: 18,
          colour: 'yellow-green',
          tip: 'BZ',
          ring: 'BR',
          pins: { tip: 43, ring: 18 },
          purpose: 'Buzzer',
        },
      ],
    },
  ],
  entries: [],
});

async function mountPage(
  answers: Record<string, Answer>,
  access: 'owner' | 'viewer' = 'owner',
  waitFor = 'sheet-plan-name',
) {
  const plan = withLift(twoSetPlan());
  const routes: Record<string, Answer> = {
    'GET /api/plans/p1': () => Response.json({ ...record(plan), access }),
    'GET /api/plans/p1/work-record': () => Response.json(emptyRecord()),
    ...answers,
  };
  const fetchMock = vi.fn(async (url: string, init: RequestInit = {}) => {
    const answer = routes[`${init.method ?? 'GET'} ${url}`];
    return answer
      ? answer(init)
      : Response.json({ error: { code: 'INTERNAL', message: 'unexpected' } }, { status: 500 });
  });
  vi.stubGlobal('fetch', fetchMock);
  const pinia = createPinia();
  setActivePinia(pinia);
  const router = createRouter({
    history: createMemoryHistory(),
    routes: [
      { path: '/plans', component: Blank },
      { path: '/plans/:id', component: Blank },
      { path: '/plans/:id/sheet', component: Blank },
    ],
  });
  await router.push('/plans/p1/sheet');
  const queries = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  const wrapper = mount(WorkSheetPage, {
    props: { id: 'p1' },
    global: { plugins: [pinia, router, [VueQueryPlugin, { queryClient: queries }]] },
  });
  await flushPromises();
  await vi.waitFor(() => expect(wrapper.find(`[data-testid="${waitFor}"]`).exists()).toBe(true));
  await flushPromises();
  return { wrapper, fetchMock };
}

afterEach(() => {
  vi.unstubAllGlobals();
  localStorage.clear();
  document.documentElement.classList.remove('lb-print-sheet');
});

const calls = (fetchMock: ReturnType<typeof vi.fn>, what: string) =>
  fetchMock.mock.calls.filter(
    ([url, init]) => `${(init as RequestInit | undefined)?.method ?? 'GET'} ${url}` === what,
  ).length;

describe('work sheet page', () => {
  it('loads the plan and its work record once each, shows the sheet and the parts as found', async () => {
    const { wrapper, fetchMock } = await mountPage({});

    expect(calls(fetchMock, 'GET /api/plans/p1')).toBe(1);
    expect(calls(fetchMock, 'GET /api/plans/p1/work-record')).toBe(1);
    expect(wrapper.get('[data-testid="sheet-plan-name"]').text()).toBe('Workshop test board');
    // Pair 18 is yellow-green (ICEA S-80-576).
    expect(wrapper.get('[data-testid="sheet-step-1"]').text()).toContain('yellow-green');
    expect(wrapper.get('[data-testid="as-found-a"]').text()).toContain('43, 18');
    expect(wrapper.get('[data-testid="sheet-as-found-status"]').text()).toContain('Not recorded yet');
    expect(wrapper.get('[data-testid="sheet-pdf"]').attributes('href')).toBe('/api/plans/p1/work-sheet.pdf');
    expect(document.documentElement.classList.contains('lb-print-sheet')).toBe(true);

    wrapper.unmount();
    expect(document.documentElement.classList.contains('lb-print-sheet')).toBe(false);
  });

  it('calls the browser print dialog from the Print button', async () => {
    const print = vi.fn();
    vi.stubGlobal('print', print);
    const { wrapper } = await mountPage({});

    await wrapper.get('[data-testid="sheet-print"]').trigger('click');

    expect(print).toHaveBeenCalledTimes(1);
    wrapper.unmount();
  });

  it('asks for initials before a tick, then saves the tick and shows the date the server stamped', async () => {
    const sent: unknown[] = [];
    const kept = {
      key: 'step:front:1',
      done: true,
      doneAt: '2026-03-14T10:00:00.000Z',
      initials: 'JMK',
      note: '',
      updatedAt: '2026-03-14T10:00:00.000Z',
    };
    const { wrapper, fetchMock } = await mountPage({
      'PUT /api/plans/p1/work-record/entries/step%3Afront%3A1': (init) => {
        sent.push(JSON.parse(String(init.body)));
        return Response.json(kept);
      },
      // After the first tick the server has kept the as-found record and the entry.
      'GET /api/plans/p1/work-record': () =>
        Response.json(
          sent.length ? { ...emptyRecord(), recordedAt: kept.doneAt, entries: [kept] } : emptyRecord(),
        ),
    });
    const tick = wrapper.get('[data-testid="tick-step:front:1"]');
    await tick.setValue(true);
    await flushPromises();
    expect(wrapper.text()).toContain('Write your initials first.');
    expect(sent).toEqual([]);
    expect((tick.element as HTMLInputElement).checked).toBe(false);

    await wrapper.get('[data-testid="initials-step:front:1"]').setValue('JMK');
    await tick.setValue(true);
    await flushPromises();
    expect(sent).toEqual([{ done: true, initials: 'JMK', note: '' }]);
    await vi.waitFor(() => expect(wrapper.find('[data-testid="done-at-step:front:1"]').exists()).toBe(true));
    expect((wrapper.get('[data-testid="tick-step:front:1"]').element as HTMLInputElement).checked).toBe(true);
    // The first tick keeps the as-found record on the server, so the record is read again for its date.
    await vi.waitFor(() => expect(calls(fetchMock, 'GET /api/plans/p1/work-record')).toBe(2));
    await vi.waitFor(() =>
      expect(wrapper.get('[data-testid="sheet-as-found-status"]').text()).toContain('Recorded'),
    );
    expect((wrapper.get('[data-testid="tick-step:front:1"]').element as HTMLInputElement).checked).toBe(true);
    wrapper.unmount();
  });

  it('shows a viewer the record read-only', async () => {
    const { wrapper } = await mountPage({}, 'viewer');
    expect(wrapper.get('[data-testid="tick-step:front:1"]').attributes('disabled')).toBeDefined();
    expect(wrapper.find('[data-testid="note-part:a"]').exists()).toBe(false);
    wrapper.unmount();
  });

  it('says so when the plan does not exist, without a Print button', async () => {
    const { wrapper } = await mountPage(
      {
        'GET /api/plans/p1': () =>
          Response.json({ error: { code: 'NOT_FOUND', message: 'No such plan.' } }, { status: 404 }),
      },
      'owner',
      'sheet-not-found',
    );
    expect(wrapper.text()).toContain('Plan not found');
    expect(wrapper.find('[data-testid="sheet-print"]').exists()).toBe(false);
    wrapper.unmount();
  });
});
