/**
 * The Bench store: the open plan, its edit history, the live simulation state and what the engine makes of them.
 * The document is replaced, never mutated, so every edit is one history entry and one re-evaluation.
 * The store never renders, never fetches and never opens toasts; pages load and save, components decide how a
 * refusal looks. A plan opened to view (shared with the user, an old revision) is read-only: the sets still
 * operate and the engine still sweeps and cures, but every edit is refused with the reason.
 */
import { computed, ref, shallowRef, watch } from 'vue';
import { defineStore } from 'pinia';
import {
  findingKey,
  applyAction,
  evaluate,
  initialState,
  crossReferenceIssues,
  type CureResult,
  type Evaluation,
  type Finding,
  type Plan,
  type PortRef,
  type SimAction,
  type SimState,
} from '@shared/engine';
import * as edits from '@/bench/plan-edits';
import { partIds, simShape, type EditOutcome, type Position } from '@/bench/plan-edits';
import { useSessionStore } from './session.store';

export interface HistoryEntry {
  label: string;
  plan: Plan;
}

export type EditResult = { ok: true } | { ok: false; reason: string };

const HISTORY_LIMIT = 200;

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

  const evaluationResult = computed<{ evaluation: Evaluation | null; error: string | null }>(() => {
    if (!plan.value || !sim.value) return { evaluation: null, error: null };
    try {
      return { evaluation: evaluate(plan.value, sim.value), error: null };
    } catch (err) {
      return { evaluation: null, error: err instanceof Error ? err.message : String(err) };
    }
  });
  /**
   * What the engine's cross-reference checks say about the drawing (the server refuses such documents).
   * Edits build documents field by field from valid ones, so only the cross-references need checking here.
   */
  const issues = computed(() => (plan.value ? crossReferenceIssues(plan.value) : []));
  const evaluation = computed(() => evaluationResult.value.evaluation);
  const evaluationError = computed(() => evaluationResult.value.error);
  const findings = computed<Finding[]>(() => evaluation.value?.findings ?? []);

  const selectedFinding = computed<Finding | null>(
    () => findings.value.find((f) => findingKey(f) === selectedFindingKey.value) ?? null,
  );

  /** Parts and cables on the selected finding's conductor path, for the canvas to light up. */
  const highlight = computed(() => {
    const parts = new Set<string>();
    const cables = new Set<string>();
    const finding = selectedFinding.value;
    if (finding) {
      for (const hop of finding.path) {
        parts.add(hop.part);
        if (hop.cable) cables.add(hop.cable);
      }
      finding.sets.forEach((s) => parts.add(s));
    }
    return { parts, cables };
  });

  const selectedSet = computed(() => plan.value?.sets.find((s) => s.id === selectedPartId.value) ?? null);
  const selectedSetObservation = computed(
    () => evaluation.value?.sets.find((s) => s.set === selectedSet.value?.id) ?? null,
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
    openKey.value = id;
    planId.value = detached ? null : id;
    plan.value = document;
    baseUpdatedAt.value = updatedAt;
    readOnlyReason.value = reason;
    past.value = [];
    future.value = [];
    revision.value = 0;
    savedRevision.value = 0;
    sim.value = initialState(document);
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
    openKey.value = null;
    planId.value = null;
    plan.value = null;
    sim.value = null;
    baseUpdatedAt.value = undefined;
    readOnlyReason.value = null;
    past.value = [];
    future.value = [];
    revision.value = 0;
    savedRevision.value = 0;
    selectedPartId.value = null;
    selectedFindingKey.value = null;
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
    if (selectedPartId.value && !partIds(next).has(selectedPartId.value)) selectedPartId.value = null;
  }

  /** Record one labelled edit. Every change to the document goes through here. */
  function commit(label: string, next: Plan) {
    if (!plan.value || readOnly.value || next === plan.value) return;
    past.value = [...past.value, { label, plan: plan.value }].slice(-HISTORY_LIMIT);
    future.value = [];
    replacePlan(next);
  }

  function undo() {
    const entry = past.value.at(-1);
    if (!entry || !plan.value || readOnly.value) return;
    past.value = past.value.slice(0, -1);
    future.value = [...future.value, { label: entry.label, plan: plan.value }];
    replacePlan(entry.plan);
  }

  function redo() {
    const entry = future.value.at(-1);
    if (!entry || !plan.value || readOnly.value) return;
    future.value = future.value.slice(0, -1);
    past.value = [...past.value, { label: entry.label, plan: plan.value }];
    replacePlan(entry.plan);
  }

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
    sim.value = state;
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
    if (readOnlyReason.value !== null) return { ok: false, reason: readOnlyReason.value };
    if (!outcome.ok) return outcome;
    commit(outcome.label, outcome.plan);
    return { ok: true };
  }

  /** Run an edit that adds something; the new id, or null when the edit was refused. */
  function runAdd(outcome: EditOutcome): string | null {
    const result = run(outcome);
    return result.ok && outcome.ok ? (outcome.id ?? null) : null;
  }

  const partName = (id: string) => edits.partName(requirePlan(), id);
  const addSet = (template: string, position: Position) =>
    runAdd(edits.addSet(requirePlan(), template, position));
  const addAdapter = (template: string, position: Position) =>
    runAdd(edits.addAdapter(requirePlan(), template, position));
  const addAddOn = (template: string, serves: string, position: Position) =>
    runAdd(edits.addAddOn(requirePlan(), template, serves, position));
  const moveParts = (moves: { id: string; position: Position }[]) =>
    run(edits.moveParts(requirePlan(), moves));
  const movePart = (id: string, position: Position) => moveParts([{ id, position }]);
  const renamePart = (id: string, name: string) => run(edits.renamePart(requirePlan(), id, name));

  function removePart(id: string): EditResult {
    const gone = edits.removedWith(requirePlan(), id);
    const result = run(edits.removePart(requirePlan(), id));
    if (result.ok && selectedPartId.value && gone.has(selectedPartId.value)) selectedPartId.value = null;
    return result;
  }

  function duplicatePart(id: string): { ok: true; id: string } | { ok: false; reason: string } {
    const outcome = edits.duplicatePart(requirePlan(), id);
    const result = run(outcome);
    if (!result.ok) return result;
    return { ok: true, id: (outcome.ok && outcome.id) || id };
  }

  const connect = (a: PortRef, b: PortRef) => run(edits.connect(requirePlan(), a, b));
  const liftLead = (id: string, pair: number, conductor: 'tip' | 'ring' | 'both' = 'both') =>
    run(edits.liftLead(requirePlan(), id, pair, conductor));
  const moveLead = (id: string, pair: number, toPair: number) =>
    run(edits.moveLead(requirePlan(), id, pair, toPair));
  const restoreLead = (id: string, pair: number) => run(edits.restoreLead(requirePlan(), id, pair));
  const updateSet = (id: string, patch: Parameters<typeof edits.updateSet>[2]) =>
    run(edits.updateSet(requirePlan(), id, patch));
  const setAddOnServes = (id: string, serves: string) => run(edits.setAddOnServes(requirePlan(), id, serves));
  const setLineCount = (count: number) => run(edits.setLineCount(requirePlan(), count));
  const setPortCount = (count: number) => run(edits.setPortCount(requirePlan(), count));
  const addStation = (code: string, label: string) => run(edits.addStation(requirePlan(), code, label));
  const removeStation = (stationId: string) => run(edits.removeStation(requirePlan(), stationId));
  const applyCure = (result: CureResult) => run(edits.applyCure(requirePlan(), result));

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
    partName,
    addSet,
    addAddOn,
    addAdapter,
    movePart,
    moveParts,
    renamePart,
    removePart,
    duplicatePart,
    connect,
    liftLead,
    moveLead,
    restoreLead,
    updateSet,
    setAddOnServes,
    setLineCount,
    setPortCount,
    addStation,
    removeStation,
    applyCure,
  };
});
