/**
 * Debounced autosave of the open plan. Edits are never dropped: the newest document is always the one
 * sent, a dropped network is retried with backoff (and at once when the browser comes back online),
 * and a newer copy saved elsewhere stops saving until the user decides (409 → 'conflict').
 */
import { computed, onBeforeUnmount, onMounted, ref, watch, type Ref } from 'vue';
import { PlanSchema, type Plan } from '@shared/engine';
import { ApiError } from '@/api/client';

export type SaveState = 'saved' | 'pending' | 'saving' | 'offline' | 'conflict' | 'error';

export interface AutosaveOptions {
  /** Bumped on every document change. */
  revision: Ref<number>;
  document: () => Plan | null;
  baseUpdatedAt: () => string | undefined;
  save: (document: Plan, baseUpdatedAt?: string) => Promise<{ updatedAt: string }>;
  onSaved: (updatedAt: string) => void;
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

function storage(): Storage | null {
  try {
    return globalThis.localStorage ?? null;
  } catch {
    return null;
  }
}

/** The unsaved edits kept for a plan, if any and still a valid plan document. */
export function readEditsBackup(key: string): EditsBackup | null {
  try {
    const raw = storage()?.getItem(key);
    if (!raw) return null;
    const value = JSON.parse(raw) as Partial<EditsBackup>;
    const document = PlanSchema.safeParse(value.document);
    if (!document.success) return null;
    return { document: document.data, baseUpdatedAt: value.baseUpdatedAt, at: String(value.at ?? '') };
  } catch {
    return null;
  }
}

export function clearEditsBackup(key: string): void {
  try {
    storage()?.removeItem(key);
  } catch {
    // Storage refused: nothing was kept either.
  }
}

function writeEditsBackup(key: string, backup: EditsBackup): void {
  try {
    storage()?.setItem(key, JSON.stringify(backup));
  } catch {
    // Storage full or refused: the server copy and the in-memory edits remain.
  }
}

const RETRYABLE = new Set(['NETWORK', 'RATE_LIMITED', 'INTERNAL', 'BAD_RESPONSE']);
/** Answers that mean "the server is not there" rather than "the server said no". */
const UNREACHABLE = new Set([0, 502, 503, 504]);

export function useAutosave(options: AutosaveOptions) {
  const delay = options.delayMs ?? 800;
  const maxBackoff = options.maxBackoffMs ?? 30_000;

  const state = ref<SaveState>('saved');
  const errorMessage = ref<string | null>(null);
  const savedRevision = ref(options.revision.value);
  const attempts = ref(0);
  const dirty = computed(() => options.revision.value > savedRevision.value);

  let timer: ReturnType<typeof setTimeout> | null = null;
  let inFlight = false;

  function schedule(ms: number) {
    if (timer) clearTimeout(timer);
    timer = setTimeout(() => {
      timer = null;
      void flush();
    }, ms);
  }

  async function flush(): Promise<void> {
    if (inFlight || state.value === 'conflict') return;
    const document = options.document();
    if (!document || !dirty.value) {
      if (state.value !== 'error') state.value = 'saved';
      return;
    }
    const revision = options.revision.value;
    inFlight = true;
    if (state.value !== 'offline') state.value = 'saving';
    try {
      const record = await options.save(document, options.baseUpdatedAt());
      savedRevision.value = Math.max(savedRevision.value, revision);
      options.onSaved(record.updatedAt);
      attempts.value = 0;
      errorMessage.value = null;
      state.value = dirty.value ? 'pending' : 'saved';
      if (dirty.value) schedule(delay);
      else if (options.backupKey) clearEditsBackup(options.backupKey);
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
    } finally {
      inFlight = false;
    }
  }

  watch(options.revision, (rev) => {
    if (rev <= savedRevision.value) return;
    const document = options.document();
    if (options.backupKey && document) {
      writeEditsBackup(options.backupKey, {
        document,
        baseUpdatedAt: options.baseUpdatedAt(),
        at: new Date().toISOString(),
      });
    }
    if (state.value === 'conflict') return;
    if (state.value === 'saved' || state.value === 'error') state.value = 'pending';
    if (state.value !== 'offline') schedule(delay);
  });

  /** Forget unsaved work counting, e.g. after reloading the server's copy. */
  function reset() {
    if (options.backupKey) clearEditsBackup(options.backupKey);
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

  function onOnline() {
    if (dirty.value && state.value === 'offline') void saveNow();
  }

  function onBeforeUnload(event: BeforeUnloadEvent) {
    if (dirty.value) event.preventDefault();
  }

  onMounted(() => {
    window.addEventListener('online', onOnline);
    window.addEventListener('beforeunload', onBeforeUnload);
  });
  onBeforeUnmount(() => {
    window.removeEventListener('online', onOnline);
    window.removeEventListener('beforeunload', onBeforeUnload);
    if (timer) clearTimeout(timer);
    // Leaving the page with edits waiting: send them now rather than lose them.
    if (dirty.value && state.value !== 'conflict') void flush();
  });

  return { state, errorMessage, dirty, attempts, saveNow, reset };
}
