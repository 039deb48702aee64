/** The plans library through vue-query: one page of plans for the chosen tab, and the changes that refresh it. */
import { computed, type MaybeRefOrGetter, toValue } from 'vue';
import { keepPreviousData, useQuery, useQueryClient } from '@tanstack/vue-query';
import type { PlanListParams } from '@shared/schemas';
import { plansApi } from '@/api/plans';

export const PLANS_KEY = ['plans'] as const;

export function usePlanList(params: MaybeRefOrGetter<PlanListParams>) {
  return useQuery({
    queryKey: computed(() => [...PLANS_KEY, 'list', toValue(params)]),
    queryFn: () => plansApi.list(toValue(params)),
    placeholderData: keepPreviousData,
  });
}

/** Every plan of the user's own on one list (the pickers of the drill makers). */
export function useAllMyPlans() {
  return useQuery({
    queryKey: [...PLANS_KEY, 'mine', 'all'],
    queryFn: () => plansApi.list({ pageSize: 100 }),
  });
}

/** One saved plan, fetched once an id is chosen. */
export function usePlanRecord(id: MaybeRefOrGetter<string | null>) {
  return useQuery({
    queryKey: computed(() => [...PLANS_KEY, toValue(id), 'record']),
    queryFn: () => plansApi.get(toValue(id)!),
    enabled: computed(() => Boolean(toValue(id))),
  });
}

/** Every change to a plan makes every list page stale (counts, tabs and order may all move). */
export function useRefreshPlans(): () => Promise<void> {
  const client = useQueryClient();
  return () => client.invalidateQueries({ queryKey: PLANS_KEY });
}
