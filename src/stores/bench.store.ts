/**
 * The Bench store: the open plan, its edit history, the live simulation state and what the engine makes of them.
 * The document is replaced, never mutated, so every edit is one history entry and one re-evaluation.
 * The store never renders, never fetches and never opens toasts; pages load and save, components decide how a
 * refusal looks. A plan opened to view (shared with the user, an old revision) is read-only: the sets still
 * operate and the engine still sweeps and cures, but every edit is refused with the reason.
 */
import { computed, ref, shallowRef, toRaw, watch } from 'vue';
import { defineStore } from 'pinia';
import {
  findingKey,
  applyAction,
  initialState,
  crossReferenceIssues,
  type Finding,
  type Plan,
  type SimAction,
  type SimState,
} from '@shared/engine';
import * as edits from '@/bench/plan-edits';
import { simShape, type EditOutcome } from '@/bench/plan-edits';
import { recordEdit, redoStep, undoStep, type History, type HistoryEntry } from '@/bench/edit-history';
import { highlightOf, keptSelection } from '@/bench/bench-selection';
import { refusalOf, type EditResult } from '@/bench/edit-refusal';
import { editCommands } from '@/bench/edit-commands';
import { useSessionStore } from './session.store';
import { evaluationOf, keptFindings, keptSetObservations } from './bench-views';

export type { HistoryEntry, EditResult };

export interface LoadOptions {
  /** Server timestamp of this version; absent for a plan that is never saved (the guest bench). */
  updatedAt?: string;
  /** Why the plan may not be changed here; absent or null means it may. */
  readOnly?: string | null;
  /** Not the server's current copy of a plan (the guest bench, an old revision): `planId` stays null. */
  detached?: boolean;
}

/** A stable key for a finding so a selection survives re-evaluation when the same fault is still there. */
export { findingKey };

export const useBenchStore = defineStore('bench', () => {
  /** What is open (a plan id, or a page's own key for a detached document). */
  const openKey = ref<string | null>(null);
  /** The saved plan open here, if it is one; the work sheet and autosave go by it. */
  const planId = ref<string | null>(null);
  const plan = shallowRef<Plan | null>(null);
  /** Server timestamp of the version this tab last loaded or saved. */
  const baseUpdatedAt = ref<string | undefined>(undefined);
  /** Bumped on every change to the document (edits, undo, redo); autosave watches this, not the plan. */
  const revision = ref(0);
  /** The newest revision the server has; above it, edits wait to be saved (kept across leaving the Bench). */
  const savedRevision = ref(0);
  /** Why this plan may not be changed (shared to view, an old revision); null when it may. */
  const readOnlyReason = ref<string | null>(null);
  const past = shallowRef<HistoryEntry[]>([]);
  const future = shallowRef<HistoryEntry[]>([]);
  const sim = shallowRef<SimState | null>(null);
  const selectedPartId = ref<string | null>(null);
  const selectedFindingKey = ref<string | null>(null);

  const evaluationResult = computed(() => evaluationOf(plan.value, sim.value));
  /**
   * What the engine's cross-reference checks say about the drawing (the server refuses such documents).
   * Edits build documents field by field from valid ones, so only the cross-references need checking here.
   */
  const issues = computed(() => (plan.value ? crossReferenceIssues(plan.value) : []));
  const evaluation = computed(() => evaluationResult.value.evaluation);
  const evaluationError = computed(() => evaluationResult.value.error);
  const findings = keptFindings(() => evaluation.value);
  const setObservations = keptSetObservations(() => evaluation.value);

  const selectedFinding = computed<Finding | null>(
    () => findings.value.find((f) => findingKey(f) === selectedFindingKey.value) ?? null,
  );

  /** Parts and cables on the selected finding's conductor path, for the canvas to light up. */
  const highlight = computed(() => highlightOf(selectedFinding.value));

  const selectedSet = computed(() => plan.value?.sets.find((s) => s.id === selectedPartId.value) ?? null);
  const selectedSetObservation = computed(() =>
    selectedSet.value ? (setObservations.value.get(selectedSet.value.id) ?? null) : null,
  );

  const readOnly = computed(() => readOnlyReason.value !== null);
  const unsaved = computed(() => revision.value > savedRevision.value);
  const canUndo = computed(() => !readOnly.value && past.value.length > 0);
  const canRedo = computed(() => !readOnly.value && future.value.length > 0);
  const undoLabel = computed(() => past.value.at(-1)?.label ?? null);
  const redoLabel = computed(() => future.value.at(-1)?.label ?? null);

  /** Start afresh on a plan: no history, every set on hook. */
  function load(id: string, document: Plan, options: LoadOptions | string = {}) {
    const {
      updatedAt,
      readOnly: reason = null,
      detached = false,
    } = typeof options === 'string' ? { updatedAt: options } : options;
    reset(id, detached ? null : id, document, updatedAt, reason);
  }

  /** Every piece of state a plan owns, set at once so opening and forgetting cannot drift apart. */
  function reset(
    key: string | null,
    id: string | null,
    document: Plan | null,
    updatedAt?: string,
    reason = null as string | null,
  ) {
    openKey.value = key;
    planId.value = id;
    plan.value = document ? toRaw(document) : null; // not a query's deep read-only proxy: evaluations walk it
    baseUpdatedAt.value = updatedAt;
    readOnlyReason.value = reason;
    past.value = [];
    future.value = [];
    revision.value = 0;
    savedRevision.value = 0;
    sim.value = plan.value ? initialState(plan.value) : null;
    selectedPartId.value = null;
    selectedFindingKey.value = null;
  }

  /**
   * Open a plan as the server sent it. The same plan at the version this store last loaded or saved keeps its
   * drawing, undo history, unsaved edits and simulation (coming back from the work sheet); another plan, or
   * this one saved elsewhere since, starts afresh. True when it started afresh.
   */
  function open(id: string, document: Plan, options: LoadOptions = {}): boolean {
    const same =
      openKey.value === id &&
      plan.value !== null &&
      baseUpdatedAt.value === options.updatedAt &&
      readOnlyReason.value === (options.readOnly ?? null);
    if (same) return false;
    load(id, document, options);
    return true;
  }

  /** Forget the open plan and its history (another plan is about to be opened, or the user signed out). */
  function unload() {
    reset(null, null, null);
  }

  /** The server holds the document as of `rev` (the revision that was sent), stamped `updatedAt`. */
  function markSaved(updatedAt: string, rev = revision.value) {
    baseUpdatedAt.value = updatedAt;
    savedRevision.value = Math.max(savedRevision.value, rev);
  }

  // A history belongs to whoever made it: signing out (or in as someone else) drops it.
  const session = useSessionStore();
  watch(
    () => session.user?.id ?? null,
    (now, before) => {
      if (now !== before) unload();
    },
  );

  /** Swap in a new document; the simulation is restarted only when parts it refers to came or went. */
  function replacePlan(next: Plan) {
    const prev = plan.value;
    plan.value = next;
    revision.value += 1;
    if (!prev || simShape(prev) !== simShape(next) || !sim.value) sim.value = initialState(next);
    selectedPartId.value = keptSelection(next, selectedPartId.value);
  }

  function setHistory(history: History) {
    past.value = history.past;
    future.value = history.future;
  }

  /** Record one labelled edit. Every change to the document goes through here. */
  function commit(label: string, next: Plan) {
    if (!plan.value || readOnly.value || next === plan.value) return;
    setHistory(recordEdit({ past: past.value, future: future.value }, label, plan.value));
    replacePlan(next);
  }

  /** Walk the history one step (undo or redo); nothing happens on a read-only plan or at either end. */
  function step(move: typeof undoStep) {
    if (!plan.value || readOnly.value) return;
    const moved = move({ past: past.value, future: future.value }, plan.value);
    if (!moved) return;
    setHistory(moved.history);
    replacePlan(moved.plan);
  }
  const undo = () => step(undoStep);
  const redo = () => step(redoStep);

  function requirePlan(): Plan {
    if (!plan.value) throw new Error('No plan is open on the bench');
    return plan.value;
  }

  // ---- operating -------------------------------------------------------------------------------

  function operate(action: SimAction) {
    if (!plan.value || !sim.value) return;
    sim.value = applyAction(plan.value, sim.value, action);
  }

  function setSimState(state: SimState) {
    sim.value = toRaw(state);
  }

  function resetSim() {
    if (plan.value) sim.value = initialState(plan.value);
  }

  // ---- selection -------------------------------------------------------------------------------

  function select(partId: string | null) {
    selectedPartId.value = partId;
  }

  function selectFinding(finding: Finding | null) {
    selectedFindingKey.value = finding ? findingKey(finding) : null;
  }

  // ---- editing: every edit is a pure function of src/bench/plan-edits.ts ---------------------------

  /** Commit an accepted edit and tell the caller what happened; a refusal records nothing. */
  function run(outcome: EditOutcome): EditResult {
    const refusal = refusalOf(readOnlyReason.value, outcome);
    if (refusal || !outcome.ok) return refusal ?? outcome;
    commit(outcome.label, outcome.plan);
    return { ok: true };
  }

  /** Run an edit that adds something; the new id, or null when the edit was refused. */
  function runAdd(outcome: EditOutcome): string | null {
    const result = run(outcome);
    return result.ok && outcome.ok ? (outcome.id ?? null) : null;
  }

  const commands = editCommands(requirePlan, run, runAdd);

  function removePart(id: string): EditResult {
    const gone = edits.removedWith(requirePlan(), id);
    const result = run(edits.removePart(requirePlan(), id));
    if (result.ok && selectedPartId.value && gone.has(selectedPartId.value)) selectedPartId.value = null;
    return result;
  }

  return {
    openKey,
    planId,
    plan,
    baseUpdatedAt,
    revision,
    savedRevision,
    unsaved,
    readOnlyReason,
    readOnly,
    past,
    future,
    sim,
    selectedPartId,
    selectedFindingKey,
    evaluation,
    evaluationError,
    issues,
    findings,
    setObservations,
    selectedFinding,
    highlight,
    selectedSet,
    selectedSetObservation,
    canUndo,
    canRedo,
    undoLabel,
    redoLabel,
    load,
    open,
    unload,
    markSaved,
    commit,
    undo,
    redo,
    operate,
    setSimState,
    resetSim,
    select,
    selectFinding,
    ...commands,
    removePart,
  };
});
