/**
 * The work record on the page: loaded once with vue-query, saved entry by entry, handed to the sheet's cells
 * through provide/inject so the sheet's tables stay plain views. Without a provider the cells print blank.
 */
import { computed, inject, provide, type ComputedRef, type InjectionKey, type Ref } from 'vue';
import { useMutation, useQuery, useQueryClient } from '@tanstack/vue-query';
import type { WorkEntry, WorkEntryUpdate, WorkRecord } from '@shared/schemas/work-record.schema';
import { workRecordApi } from '@/api/work-record';

export interface WorkRecordContext {
  entry(key: string): WorkEntry | undefined;
  /** Only the owner writes; a viewer sees the record read-only. */
  canEdit: Ref<boolean>;
  save(key: string, update: WorkEntryUpdate): Promise<WorkEntry>;
  /** Key of the entry being saved, for a busy state. */
  saving: Ref<string | null>;
}

const KEY: InjectionKey<WorkRecordContext> = Symbol('work-record');

export const workRecordKey = (planId: string) => ['work-record', planId] as const;

/** Puts one saved entry into the cached record in place of its older copy. */
export function withEntry(record: WorkRecord, entry: WorkEntry): WorkRecord {
  return { ...record, entries: [...record.entries.filter((e) => e.key !== entry.key), entry] };
}

export function provideWorkRecord(planId: Ref<string>, canEdit: ComputedRef<boolean>) {
  const client = useQueryClient();
  const query = useQuery({
    queryKey: computed(() => workRecordKey(planId.value)),
    queryFn: () => workRecordApi.get(planId.value),
  });
  const mutation = useMutation({
    mutationFn: ({ key, update }: { key: string; update: WorkEntryUpdate }) =>
      workRecordApi.saveEntry(planId.value, key, update),
    onSuccess: (entry) => {
      const old = client.getQueryData<WorkRecord>(workRecordKey(planId.value));
      if (old) client.setQueryData(workRecordKey(planId.value), withEntry(old, entry));
      // The first tick keeps the as-found record on the server: fetch its date.
      if (old && !old.recordedAt) void client.invalidateQueries({ queryKey: workRecordKey(planId.value) });
    },
  });
  const entries = computed(() => new Map((query.data.value?.entries ?? []).map((e) => [e.key, e])));
  const saving = computed(() => (mutation.isPending.value ? (mutation.variables.value?.key ?? null) : null));
  const context: WorkRecordContext = {
    entry: (key) => entries.value.get(key),
    canEdit,
    save: (key, update) => mutation.mutateAsync({ key, update }),
    saving,
  };
  provide(KEY, context);
  return { query, context };
}

export const useWorkRecordContext = (): WorkRecordContext | null => inject(KEY, null);
