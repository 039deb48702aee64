/** The signed-in user's plans with loading and error state for one page. */
import { ref, shallowRef } from 'vue';
import type { Plan } from '@shared/engine/documents';
import type { PlanRecord, PlanSummary } from '@shared/schemas';
import { plansApi } from '@/api/plans';

function toSummary(record: PlanRecord): PlanSummary {
  const { document: _document, revision: _revision, ...summary } = record;
  return summary;
}

export function usePlans() {
  const plans = shallowRef<PlanSummary[]>([]);
  const loading = ref(false);
  const loaded = ref(false);
  const error = shallowRef<unknown>(null);

  async function refresh(): Promise<void> {
    loading.value = true;
    error.value = null;
    try {
      plans.value = [...(await plansApi.list({ pageSize: 100 })).items].sort((a, b) =>
        b.updatedAt.localeCompare(a.updatedAt),
      );
      loaded.value = true;
    } catch (caught) {
      error.value = caught;
    } finally {
      loading.value = false;
    }
  }

  async function create(document: Plan): Promise<PlanRecord> {
    const record = await plansApi.create(document);
    plans.value = [toSummary(record), ...plans.value];
    return record;
  }

  /** The name lives in the document, so renaming saves the document with the new name. */
  async function rename(id: string, name: string): Promise<PlanSummary> {
    const current = await plansApi.get(id);
    const saved = await plansApi.rename(id, name, current.updatedAt);
    const summary = toSummary(saved);
    plans.value = plans.value.map((p) => (p.id === id ? summary : p));
    return summary;
  }

  async function remove(id: string): Promise<void> {
    await plansApi.remove(id);
    plans.value = plans.value.filter((p) => p.id !== id);
  }

  return { plans, loading, loaded, error, refresh, create, rename, remove };
}
