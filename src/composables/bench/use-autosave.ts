/**
 * Debounced autosave of the open plan. Edits are never dropped: the newest document is always the one
 * sent, a dropped network is retried with backoff (and at once when the browser comes back online),
 * and a newer copy saved elsewhere stops saving until the user decides (409 → 'conflict'). Leaving the page,
 * closing the tab or hiding it sends what waits at once.
 */
import { computed, onBeforeUnmount, onMounted, ref, watch, type Ref } from 'vue';
import { useEventListener, useLocalStorage, type Serializer } from '@vueuse/core';
import { PlanSchema, type Plan } from '@shared/engine';
import { ApiError } from '@/api/client';

export type SaveState = 'saved' | 'pending' | 'saving' | 'offline' | 'conflict' | 'error';

export interface AutosaveOptions {
  /** Bumped on every document change. */
  revision: Ref<number>;
  /** False while nothing may be saved (a plan opened to view, the guest bench); true when absent. */
  enabled?: () => boolean;
  /** The newest revision the server already has when the page opens (edits left unsaved last time). */
  savedRevision?: number;
  document: () => Plan | null;
  baseUpdatedAt: () => string | undefined;
  save: (document: Plan, baseUpdatedAt?: string) => Promise<{ updatedAt: string }>;
  /** `revision` is the one that was sent, so edits made while it was on its way still count as unsaved. */
  onSaved: (updatedAt: string, revision: number) => void;
  delayMs?: number;
  maxBackoffMs?: number;
  /** Browser storage key for a copy of unsaved edits, so a closed tab or a crash does not lose them. */
  backupKey?: string;
}

export interface EditsBackup {
  document: Plan;
  baseUpdatedAt?: string;
  at: string;
}

/** A kept copy reads back only while it is still a valid plan document; anything else counts as none. */
const backupSerializer: Serializer<EditsBackup | null> = {
  read(raw) {
    try {
      const value = JSON.parse(raw) as Partial<EditsBackup>;
      const document = PlanSchema.safeParse(value.document);
      if (!document.success) return null;
      return { document: document.data, baseUpdatedAt: value.baseUpdatedAt, at: String(value.at ?? '') };
    } catch {
      return null;
    }
  },
  write: (value) => JSON.stringify(value),
};

/**
 * The unsaved edits this browser keeps for one plan (VueUse storage: a refused or full storage leaves the
 * server copy and the edits in memory, and null removes the entry).
 */
export function useEditsBackup(key: string): Ref<EditsBackup | null> {
  return useLocalStorage<EditsBackup | null>(key, null, {
    serializer: backupSerializer,
    shallow: true,
    writeDefaults: false,
    // Written on every edit while saving waits; synchronous so a tab closed right after still has it.
    flush: 'sync',
  });
}

const RETRYABLE = new Set(['NETWORK', 'RATE_LIMITED', 'INTERNAL', 'BAD_RESPONSE']);
/** Answers that mean "the server is not there" rather than "the server said no". */
const UNREACHABLE = new Set([0, 502, 503, 504]);

export function useAutosave(options: AutosaveOptions) {
  const delay = options.delayMs ?? 800;
  const maxBackoff = options.maxBackoffMs ?? 30_000;

  const state = ref<SaveState>('saved');
  const errorMessage = ref<string | null>(null);
  const savedRevision = ref(options.savedRevision ?? options.revision.value);
  const backup = options.backupKey ? useEditsBackup(options.backupKey) : ref<EditsBackup | null>(null);
  const attempts = ref(0);
  const enabled = options.enabled ?? (() => true);
  const dirty = computed(() => enabled() && options.revision.value > savedRevision.value);

  let timer: ReturnType<typeof setTimeout> | null = null;
  /** The save on its way, so a second call waits for it instead of sending the same edits twice. */
  let sending: Promise<void> | null = null;
  let disposed = false;

  function schedule(ms: number) {
    if (timer) clearTimeout(timer);
    if (disposed) return;
    timer = setTimeout(() => {
      timer = null;
      void flush();
    }, ms);
  }

  function flush(): Promise<void> {
    if (state.value === 'conflict') return Promise.resolve();
    sending ??= send().finally(() => (sending = null));
    return sending;
  }

  async function send(): Promise<void> {
    const document = options.document();
    if (!document || !dirty.value) {
      if (state.value !== 'error') state.value = 'saved';
      return;
    }
    const revision = options.revision.value;
    if (state.value !== 'offline') state.value = 'saving';
    try {
      const record = await options.save(document, options.baseUpdatedAt());
      savedRevision.value = Math.max(savedRevision.value, revision);
      options.onSaved(record.updatedAt, revision);
      attempts.value = 0;
      errorMessage.value = null;
      state.value = dirty.value ? 'pending' : 'saved';
      if (dirty.value) schedule(delay);
      else backup.value = null;
    } catch (err) {
      const apiError = err instanceof ApiError ? err : null;
      errorMessage.value = err instanceof Error ? err.message : String(err);
      if (apiError?.status === 409 || apiError?.code === 'CONFLICT') {
        state.value = 'conflict';
      } else if (!apiError || RETRYABLE.has(apiError.code) || apiError.status >= 500) {
        state.value =
          !apiError || apiError.code === 'NETWORK' || UNREACHABLE.has(apiError.status) ? 'offline' : 'error';
        attempts.value += 1;
        schedule(Math.min(maxBackoff, 1000 * 2 ** (attempts.value - 1)));
      } else {
        // The server refused this document (validation, rights): retrying the same one would fail again.
        state.value = 'error';
      }
    }
  }

  watch(options.revision, (rev) => {
    if (!enabled() || rev <= savedRevision.value) return;
    const document = options.document();
    if (options.backupKey && document) {
      backup.value = { document, baseUpdatedAt: options.baseUpdatedAt(), at: new Date().toISOString() };
    }
    if (state.value === 'conflict') return;
    if (state.value === 'saved' || state.value === 'error') state.value = 'pending';
    if (state.value !== 'offline') schedule(delay);
  });

  /** Forget unsaved work counting, e.g. after reloading the server's copy. */
  function reset() {
    backup.value = null;
    if (timer) clearTimeout(timer);
    timer = null;
    savedRevision.value = options.revision.value;
    attempts.value = 0;
    errorMessage.value = null;
    state.value = 'saved';
  }

  function saveNow() {
    if (timer) clearTimeout(timer);
    timer = null;
    return flush();
  }

  /** Leaving (another page, closing the tab, the tab hidden on a phone): send what waits now, once. */
  async function flushOnLeave(): Promise<void> {
    if (sending) await sending;
    if (dirty.value && state.value !== 'conflict') await saveNow();
  }

  useEventListener(window, 'online', () => {
    if (dirty.value && state.value === 'offline') void saveNow();
  });
  useEventListener(window, 'beforeunload', (event: BeforeUnloadEvent) => {
    if (!dirty.value) return;
    void flushOnLeave();
    // Ask the browser to confirm: the save just sent may not arrive before the page goes.
    event.preventDefault();
  });
  // A hidden tab may be discarded without a beforeunload (mobile browsers): save while it still can.
  useEventListener(document, 'visibilitychange', () => {
    if (document.visibilityState === 'hidden') void flushOnLeave();
  });

  onMounted(() => {
    // Edits left unsaved when the page was last left (offline then): they go out as soon as it is back.
    if (dirty.value && state.value === 'saved') {
      state.value = 'pending';
      schedule(delay);
    }
  });
  onBeforeUnmount(() => {
    // Leaving the page with edits waiting: send them now rather than lose them; no retries after that
    // (the next visit picks the edits up again from the store).
    void flushOnLeave();
    disposed = true;
    if (timer) clearTimeout(timer);
    timer = null;
  });

  return { state, errorMessage, dirty, attempts, backup, saveNow, flushOnLeave, reset };
}
