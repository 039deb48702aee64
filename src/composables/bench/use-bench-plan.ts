/**
 * What the Bench opens, loaded with vue-query and handed to the Bench store: a saved plan (the owner's to change,
 * or shared with the user to view), an old revision of one (to view), or the demo installation for a guest (kept
 * in this tab, never saved). Coming back to the same plan keeps the store's drawing and undo history.
 */
import { momentText } from '@/formats/dates';
import { computed, watch } from 'vue';
import { useQuery, useQueryClient } from '@tanstack/vue-query';
import type { Plan } from '@shared/engine/documents';
import type { PlanRecord } from '@shared/schemas';
import { plansApi } from '@/api/plans';
import { useBenchStore } from '@/stores/bench.store';
import { PLANS_KEY } from '@/composables/use-plan-library';
import { useGuestPlan } from './use-guest-plan';

export type BenchSource =
  { kind: 'plan'; id: string } | { kind: 'revision'; id: string; revision: number } | { kind: 'guest' };

export interface OpenedPlan {
  document: Plan;
  /** The server's timestamp of this version (saved plans only). */
  updatedAt?: string;
  /** Why it may not be changed here; null when it may. */
  readOnly: string | null;
  /** A plan the user may only look at can still be copied into their own plans. */
  canDuplicate: boolean;
}

export const GUEST_OPEN_KEY = 'guest';

export function benchQueryKey(source: BenchSource): readonly unknown[] {
  if (source.kind === 'guest') return ['guest-plan'];
  if (source.kind === 'revision') return [...PLANS_KEY, source.id, 'revisions', source.revision, 'bench'];
  return [...PLANS_KEY, source.id, 'bench'];
}

export function openKeyOf(source: BenchSource): string {
  if (source.kind === 'guest') return GUEST_OPEN_KEY;
  if (source.kind === 'revision') return `${source.id}@${source.revision}`;
  return source.id;
}

export function viewerReason(ownerName: string): string {
  return `${ownerName || 'Its owner'} shared this plan with you to view. You can operate the sets, run the sweep and look for a cure, but not change it; duplicate it into your plans to work on it.`;
}

export function revisionReason(revision: number, savedAt: string): string {
  return `This is revision ${revision}, saved ${momentText(savedAt)}, opened to look at. You can operate it, sweep it and look for a cure; duplicate it into your plans to work on it.`;
}

export const fromRecord = (record: PlanRecord): OpenedPlan => ({
  document: record.document,
  updatedAt: record.updatedAt,
  readOnly: record.access === 'viewer' ? viewerReason(record.ownerName) : null,
  canDuplicate: record.access === 'viewer',
});

async function fetchOpened(source: BenchSource, guestPlan: Plan | null): Promise<OpenedPlan> {
  if (source.kind === 'guest') {
    // The plan starters come with the guest bench only; a saved plan opens without them.
    const document = guestPlan ?? (await import('@/plans/plan-starters').then((m) => m.demoPlan()));
    if (!document) throw new Error('The demo installation is not part of this build.');
    return { document, readOnly: null, canDuplicate: false };
  }
  if (source.kind === 'revision') {
    const revision = await plansApi.revision(source.id, source.revision);
    return {
      document: revision.document,
      readOnly: revisionReason(revision.number, revision.createdAt),
      canDuplicate: true,
    };
  }
  return fromRecord(await plansApi.get(source.id));
}

/** Answers that another try cannot change (not found, not allowed, bad request). */

export function useBenchPlan(source: BenchSource) {
  const store = useBenchStore();
  const client = useQueryClient();
  const guestPlan = useGuestPlan();
  const key = openKeyOf(source);
  const queryKey = benchQueryKey(source);

  // Never show (or autosave) another plan's drawing under this address while this one loads.
  if (store.openKey !== key) store.unload();

  const query = useQuery({
    queryKey,
    queryFn: () => fetchOpened(source, guestPlan.value),
    // A refetch while the user draws must not pull the drawing from under them; saves update the cache instead.
    refetchOnWindowFocus: false,
  });

  /**
   * Hand every answer to the store from now on (called once the page's autosave exists); `onFreshOpen` hears
   * when the store started afresh rather than keeping its drawing and history.
   */
  function follow(onFreshOpen: (opened: OpenedPlan) => void) {
    watch(
      () => query.data.value,
      (opened) => {
        if (!opened) return;
        const fresh = store.open(key, opened.document, {
          updatedAt: opened.updatedAt,
          readOnly: opened.readOnly,
          detached: source.kind !== 'plan',
        });
        if (fresh) onFreshOpen(opened);
      },
      { immediate: true },
    );
  }

  // The guest's drawing follows every edit into this tab's storage, ready to be kept after sign-up.
  if (source.kind === 'guest')
    watch(
      () => store.revision,
      () => {
        if (store.openKey === GUEST_OPEN_KEY && store.plan) guestPlan.value = store.plan;
      },
    );

  /** A save reached the server: the cached copy follows, so coming back opens this version with its history. */
  function saved(record: PlanRecord) {
    client.setQueryData<OpenedPlan>(queryKey, fromRecord(record));
  }

  return {
    query,
    opened: computed(() => query.data.value ?? null),
    follow,
    saved,
    /** Fetch the server's copy again and start afresh on it (after choosing it over a conflict). */
    async reload() {
      const result = await query.refetch();
      const opened = result.data;
      if (opened)
        store.load(key, opened.document, { updatedAt: opened.updatedAt, readOnly: opened.readOnly });
    },
  };
}
