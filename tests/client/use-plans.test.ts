import { afterEach, describe, expect, it, vi } from 'vitest';
import type { PlanRecord } from '@shared/schemas';
import { usePlans } from '@/composables/usePlans';
import { blankPlan } from '@/plans/plan-starters';

function record(id: string, name: string, updatedAt: string): PlanRecord {
  return {
    id,
    name,
    description: '',
    setCount: 0,
    faultCount: 0,
    shared: false,
    access: 'owner',
    ownerName: 'Test restorer',
    deletedAt: null,
    createdAt: '2026-03-01T09:00:00.000Z',
    updatedAt,
    revision: 1,
    document: blankPlan(name),
  };
}

const summary = ({ document: _d, revision: _r, ...rest }: PlanRecord) => rest;
const USAGE = { plans: 2, maxPlans: 200, bytes: 100, maxBytes: 1000, maxSets: 60 };

afterEach(() => vi.unstubAllGlobals());

describe('usePlans', () => {
  it('lists plans newest first and reports loading', async () => {
    const older = record('p-1', 'Print shop', '2026-03-02T09:00:00.000Z');
    const newer = record('p-2', 'Bakery', '2026-03-05T09:00:00.000Z');
    vi.stubGlobal(
      'fetch',
      vi.fn(async () =>
        Response.json({
          items: [summary(older), summary(newer)],
          page: 1,
          pageSize: 100,
          total: 2,
          usage: USAGE,
        }),
      ),
    );
    const plans = usePlans();

    const pending = plans.refresh();
    expect(plans.loading.value).toBe(true);
    await pending;

    expect(plans.loading.value).toBe(false);
    expect(plans.plans.value.map((p) => p.name)).toEqual(['Bakery', 'Print shop']);
  });

  it('keeps the error for the page to show when the list cannot load', async () => {
    vi.stubGlobal('fetch', vi.fn().mockRejectedValue(new TypeError('Failed to fetch')));
    const plans = usePlans();
    await plans.refresh();
    expect(plans.error.value).toMatchObject({ code: 'NETWORK' });
    expect(plans.loaded.value).toBe(false);
  });

  it('renames by saving the document with the timestamp it read', async () => {
    const current = record('p-1', 'Print shop', '2026-03-02T09:00:00.000Z');
    const saved = { ...record('p-1', 'Print shop, back room', '2026-03-02T10:00:00.000Z') };
    const fetchMock = vi.fn(async (_url: string, init?: RequestInit) =>
      init?.method === 'PATCH' ? Response.json(saved) : Response.json(current),
    );
    vi.stubGlobal('fetch', fetchMock);
    const plans = usePlans();
    plans.plans.value = [summary(current)];

    await plans.rename('p-1', 'Print shop, back room');

    const [url, init] = fetchMock.mock.calls[1] as [string, RequestInit];
    expect(url).toBe('/api/plans/p-1');
    const body = JSON.parse(String(init.body));
    expect(body.name).toBe('Print shop, back room');
    // The stale-write guard: PlanRenameSchema.baseUpdatedAt in shared/schemas/plans.schema.ts.
    expect(body.baseUpdatedAt).toBe('2026-03-02T09:00:00.000Z');
    expect(plans.plans.value[0]?.name).toBe('Print shop, back room');
  });

  it('drops a deleted plan from the list', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => new Response(null, { status: 204 })),
    );
    const plans = usePlans();
    plans.plans.value = [
      summary(record('p-1', 'Print shop', '2026-03-02T09:00:00.000Z')),
      summary(record('p-2', 'Bakery', '2026-03-05T09:00:00.000Z')),
    ];

    await plans.remove('p-1');

    expect(plans.plans.value.map((p) => p.id)).toEqual(['p-2']);
  });
});
