/**
 * The Bench store: the open plan, its edit history, the live simulation state and what the engine makes of them.
 * The document is replaced, never mutated, so every edit is one history entry and one re-evaluation.
 * The store never renders and never opens toasts; components decide how a refusal looks.
 */
import { computed, ref, shallowRef } from 'vue';
import { defineStore } from 'pinia';
import {
  findingKey,
  applyAction,
  applyCure as engineApplyCure,
  canConnect,
  evaluate,
  getTemplate,
  initialState,
  crossReferenceIssues,
  type CureResult,
  type Evaluation,
  type Finding,
  type LeadChange,
  type Plan,
  type PortRef,
  type SimAction,
  type SimState,
} from '@shared/engine';

export type PartKind = 'ksu' | 'set' | 'add-on' | 'adapter';

export interface HistoryEntry {
  label: string;
  plan: Plan;
}

export type EditResult = { ok: true } | { ok: false; reason: string };

const HISTORY_LIMIT = 200;

type Position = { x: number; y: number };

/** A stable key for a finding so a selection survives re-evaluation when the same fault is still there. */
export { findingKey };

/** Parts whose presence changes what a simulation state can refer to. Moves and renames leave it alone. */
function simShape(plan: Plan): string {
  return JSON.stringify([
    plan.sets.map((s) => [s.id, s.template]),
    plan.addOns.map((a) => [a.id, a.serves]),
    plan.ksu.lines.map((l) => l.number),
    plan.ksu.stations.map((s) => s.id),
  ]);
}

export function partIds(plan: Plan): Set<string> {
  return new Set([
    plan.ksu.id,
    ...plan.sets.map((p) => p.id),
    ...plan.addOns.map((p) => p.id),
    ...plan.adapters.map((p) => p.id),
    ...plan.cables.map((c) => c.id),
  ]);
}

/** Next free id like `set-3` among every part and cable id of the plan. */
export function nextId(plan: Plan, prefix: string): string {
  const used = partIds(plan);
  let n = 1;
  while (used.has(`${prefix}-${n}`)) n += 1;
  return `${prefix}-${n}`;
}

/** The lines among `lines` that a set template has a ringer strap for. */
export function strappable(template: string, lines: number[]): number[] {
  const straps = getTemplate(template)?.ringerStraps ?? [];
  return lines.filter((line) => straps.some((s) => s.line === line));
}

export const useBenchStore = defineStore('bench', () => {
  const planId = ref<string | null>(null);
  const plan = shallowRef<Plan | null>(null);
  /** Server timestamp of the version this tab last loaded or saved. */
  const baseUpdatedAt = ref<string | undefined>(undefined);
  /** Bumped on every change to the document (edits, undo, redo); autosave watches this, not the plan. */
  const revision = ref(0);
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

  const canUndo = computed(() => past.value.length > 0);
  const canRedo = computed(() => future.value.length > 0);
  const undoLabel = computed(() => past.value.at(-1)?.label ?? null);
  const redoLabel = computed(() => future.value.at(-1)?.label ?? null);

  function load(id: string, document: Plan, updatedAt?: string) {
    planId.value = id;
    plan.value = document;
    baseUpdatedAt.value = updatedAt;
    past.value = [];
    future.value = [];
    revision.value = 0;
    sim.value = initialState(document);
    selectedPartId.value = null;
    selectedFindingKey.value = null;
  }

  /** Forget the open plan (another plan is about to be opened). */
  function unload() {
    planId.value = null;
    plan.value = null;
    sim.value = null;
    baseUpdatedAt.value = undefined;
    past.value = [];
    future.value = [];
    revision.value = 0;
    selectedPartId.value = null;
    selectedFindingKey.value = null;
  }

  function markSaved(updatedAt: string) {
    baseUpdatedAt.value = updatedAt;
  }

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
    if (!plan.value || next === plan.value) return;
    past.value = [...past.value, { label, plan: plan.value }].slice(-HISTORY_LIMIT);
    future.value = [];
    replacePlan(next);
  }

  function undo() {
    const entry = past.value.at(-1);
    if (!entry || !plan.value) return;
    past.value = past.value.slice(0, -1);
    future.value = [...future.value, { label: entry.label, plan: plan.value }];
    replacePlan(entry.plan);
  }

  function redo() {
    const entry = future.value.at(-1);
    if (!entry || !plan.value) return;
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

  // ---- drawing ---------------------------------------------------------------------------------

  function partName(id: string): string {
    const p = requirePlan();
    if (p.ksu.id === id) return p.ksu.name;
    return (
      p.sets.find((s) => s.id === id)?.name ??
      p.addOns.find((a) => a.id === id)?.name ??
      p.adapters.find((a) => a.id === id)?.name ??
      id
    );
  }

  function addSet(template: string, position: Position): string {
    const p = requirePlan();
    const t = getTemplate(template);
    const id = nextId(p, 'set');
    const n = p.sets.length + 1;
    const lines = strappable(
      template,
      p.ksu.lines.map((l) => l.number),
    );
    commit(`Add ${t?.title ?? 'set'}`, {
      ...p,
      sets: [...p.sets, { id, name: `Set ${n}`, template, ringerLines: lines, leadChanges: [], position }],
    });
    return id;
  }

  function addAddOn(template: string, serves: string, position: Position): string {
    const p = requirePlan();
    const t = getTemplate(template);
    const id = nextId(p, 'addon');
    commit(`Add ${t?.title ?? 'add-on'}`, {
      ...p,
      addOns: [
        ...p.addOns,
        {
          id,
          name: `${t?.title ?? 'Add-on'} for ${partName(serves)}`.slice(0, 60),
          template,
          serves,
          leadChanges: [],
          position,
        },
      ],
    });
    return id;
  }

  function addAdapter(template: string, position: Position): string {
    const p = requirePlan();
    const t = getTemplate(template);
    const id = nextId(p, 'adapter');
    commit(`Add ${t?.title ?? 'adapter'}`, {
      ...p,
      adapters: [...p.adapters, { id, name: `Adapter ${p.adapters.length + 1}`, template, position }],
    });
    return id;
  }

  /** Moving several parts at once (a dragged selection) is one step in the history. */
  function moveParts(moves: { id: string; position: Position }[]) {
    const p = requirePlan();
    const at = new Map(
      moves.map((m) => [m.id, { x: Math.round(m.position.x), y: Math.round(m.position.y) }]),
    );
    const same = (a?: Position, b?: Position) => !!a && !!b && a.x === b.x && a.y === b.y;
    const changed = moves.filter((m) => {
      const part =
        p.ksu.id === m.id
          ? p.ksu
          : (p.sets.find((s) => s.id === m.id) ??
            p.addOns.find((x) => x.id === m.id) ??
            p.adapters.find((x) => x.id === m.id));
      return part && !same(part.position, at.get(m.id));
    });
    if (!changed.length) return;
    const move = <T extends { id: string; position?: Position }>(list: T[]) =>
      list.map((x) => (at.has(x.id) ? { ...x, position: at.get(x.id) } : x));
    const next: Plan = {
      ...p,
      ksu: at.has(p.ksu.id) ? { ...p.ksu, position: at.get(p.ksu.id) } : p.ksu,
      sets: move(p.sets),
      addOns: move(p.addOns),
      adapters: move(p.adapters),
    };
    commit(changed.length === 1 ? `Move ${partName(changed[0].id)}` : `Move ${changed.length} parts`, next);
  }

  function movePart(id: string, position: Position) {
    moveParts([{ id, position }]);
  }

  function renamePart(id: string, name: string): EditResult {
    const p = requirePlan();
    const clean = name.trim();
    if (!clean) return { ok: false, reason: 'A name is required.' };
    if (clean.length > 60) return { ok: false, reason: 'Keep names to 60 characters.' };
    const rename = <T extends { id: string; name: string }>(list: T[]) =>
      list.map((x) => (x.id === id ? { ...x, name: clean } : x));
    const next: Plan =
      p.ksu.id === id
        ? { ...p, ksu: { ...p.ksu, name: clean } }
        : { ...p, sets: rename(p.sets), addOns: rename(p.addOns), adapters: rename(p.adapters) };
    commit(`Rename ${partName(id)} to ${clean}`, next);
    return { ok: true };
  }

  /** Removing a set takes its add-ons with it; every cable on a removed part goes too. */
  function removePart(id: string): EditResult {
    const p = requirePlan();
    if (p.ksu.id === id) return { ok: false, reason: 'The key service unit stays: a plan always has one.' };
    const cable = p.cables.find((c) => c.id === id);
    if (cable) {
      commit(`Remove cable ${cable.label || cable.id}`, {
        ...p,
        cables: p.cables.filter((c) => c.id !== id),
      });
      return { ok: true };
    }
    const gone = new Set([id, ...p.addOns.filter((a) => a.serves === id).map((a) => a.id)]);
    commit(`Delete ${partName(id)}`, {
      ...p,
      sets: p.sets.filter((s) => !gone.has(s.id)),
      addOns: p.addOns.filter((a) => !gone.has(a.id)),
      adapters: p.adapters.filter((a) => !gone.has(a.id)),
      cables: p.cables.filter((c) => !gone.has(c.from.part) && !gone.has(c.to.part)),
      required: { ...p.required, handsFreeSets: p.required.handsFreeSets.filter((s) => !gone.has(s)) },
    });
    if (selectedPartId.value && gone.has(selectedPartId.value)) selectedPartId.value = null;
    return { ok: true };
  }

  /** A copy of a part (not its cables), offset so it does not hide the original. */
  function duplicatePart(id: string): { ok: true; id: string } | { ok: false; reason: string } {
    const p = requirePlan();
    const offset = (pos?: Position) => (pos ? { x: pos.x + 40, y: pos.y + 40 } : { x: 40, y: 40 });
    const set = p.sets.find((s) => s.id === id);
    if (set) {
      const newId = nextId(p, 'set');
      const copy = {
        ...set,
        id: newId,
        name: `${set.name} copy`.slice(0, 60),
        station: undefined,
        position: offset(set.position),
      };
      commit(`Duplicate ${set.name}`, { ...p, sets: [...p.sets, copy] });
      return { ok: true, id: newId };
    }
    const addOn = p.addOns.find((a) => a.id === id);
    if (addOn) {
      const newId = nextId(p, 'addon');
      const copy = {
        ...addOn,
        id: newId,
        name: `${addOn.name} copy`.slice(0, 60),
        position: offset(addOn.position),
      };
      commit(`Duplicate ${addOn.name}`, { ...p, addOns: [...p.addOns, copy] });
      return { ok: true, id: newId };
    }
    const adapter = p.adapters.find((a) => a.id === id);
    if (adapter) {
      const newId = nextId(p, 'adapter');
      const copy = {
        ...adapter,
        id: newId,
        name: `${adapter.name} copy`.slice(0, 60),
        position: offset(adapter.position),
      };
      commit(`Duplicate ${adapter.name}`, { ...p, adapters: [...p.adapters, copy] });
      return { ok: true, id: newId };
    }
    return { ok: false, reason: 'Only sets, add-ons and adapters can be duplicated.' };
  }

  /** One 25-pair cable between two ports, if the engine accepts it; the plug end is recorded as `from`. */
  function connect(a: PortRef, b: PortRef): EditResult {
    const p = requirePlan();
    const verdict = canConnect(p, a, b);
    if (!verdict.ok) return verdict;
    const gender = (ref: PortRef) => {
      const part =
        p.ksu.id === ref.part
          ? null
          : (p.sets.find((s) => s.id === ref.part) ??
            p.addOns.find((x) => x.id === ref.part) ??
            p.adapters.find((x) => x.id === ref.part));
      const template = part ? getTemplate(part.template) : undefined;
      return template?.ports.find((port) => port.name === ref.port)?.gender ?? 'jack';
    };
    const [from, to] = gender(a) === 'plug' ? [a, b] : [b, a];
    const id = nextId(p, 'cable');
    commit(`Cable ${partName(from.part)} to ${partName(to.part)}`, {
      ...p,
      cables: [...p.cables, { id, from, to }],
    });
    return { ok: true };
  }

  // ---- sets, leads and the KSU -----------------------------------------------------------------

  type LeadOwner = 'sets' | 'addOns';
  function ownerOf(p: Plan, id: string): LeadOwner | null {
    if (p.sets.some((s) => s.id === id)) return 'sets';
    if (p.addOns.some((a) => a.id === id)) return 'addOns';
    return null;
  }

  function changeLeads(id: string, label: string, edit: (changes: LeadChange[]) => LeadChange[]) {
    const p = requirePlan();
    const owner = ownerOf(p, id);
    if (!owner) return;
    if (owner === 'sets') {
      commit(label, {
        ...p,
        sets: p.sets.map((s) => (s.id === id ? { ...s, leadChanges: edit(s.leadChanges) } : s)),
      });
    } else {
      commit(label, {
        ...p,
        addOns: p.addOns.map((a) => (a.id === id ? { ...a, leadChanges: edit(a.leadChanges) } : a)),
      });
    }
  }

  function liftLead(id: string, pair: number, conductor: 'tip' | 'ring' | 'both' = 'both') {
    const what = conductor === 'both' ? `pair ${pair}` : `pair ${pair} ${conductor}`;
    changeLeads(id, `Lift ${what} in ${partName(id)}`, (list) => [
      ...list.filter((c) => c.pair !== pair),
      { kind: 'lift', pair, conductor },
    ]);
  }

  function moveLead(id: string, pair: number, toPair: number) {
    changeLeads(id, `Move pair ${pair} to pair ${toPair} in ${partName(id)}`, (list) => [
      ...list.filter((c) => c.pair !== pair),
      { kind: 'move', pair, toPair },
    ]);
  }

  function restoreLead(id: string, pair: number) {
    changeLeads(id, `Restore pair ${pair} in ${partName(id)}`, (list) => list.filter((c) => c.pair !== pair));
  }

  function updateSet(
    id: string,
    patch: { station?: string | null; ringerLines?: number[]; template?: string },
  ) {
    const p = requirePlan();
    const set = p.sets.find((s) => s.id === id);
    if (!set) return;
    const next = { ...set };
    if (patch.station !== undefined) next.station = patch.station ?? undefined;
    if (patch.ringerLines) next.ringerLines = [...patch.ringerLines].sort((a, b) => a - b);
    if (patch.template) {
      next.template = patch.template;
      next.ringerLines = strappable(patch.template, next.ringerLines);
    }
    commit(`Change ${set.name} options`, { ...p, sets: p.sets.map((s) => (s.id === id ? next : s)) });
  }

  function setAddOnServes(id: string, serves: string) {
    const p = requirePlan();
    commit(`Move ${partName(id)} to ${partName(serves)}`, {
      ...p,
      addOns: p.addOns.map((a) => (a.id === id ? { ...a, serves } : a)),
    });
  }

  function setLineCount(count: number): EditResult {
    const p = requirePlan();
    if (!Number.isInteger(count) || count < 1 || count > 30)
      return { ok: false, reason: 'A KSU has 1 to 30 lines.' };
    const lines = [...p.ksu.lines].slice(0, count);
    for (let n = lines.length + 1; n <= count; n += 1) {
      lines.push({ number: n, label: '', directoryNumber: String(5550100 + n) });
    }
    commit(`Set ${p.ksu.name} to ${count} lines`, {
      ...p,
      ksu: { ...p.ksu, lines },
      sets: p.sets.map((s) => ({ ...s, ringerLines: s.ringerLines.filter((l) => l <= count) })),
    });
    return { ok: true };
  }

  function setPortCount(count: number): EditResult {
    const p = requirePlan();
    if (!Number.isInteger(count) || count < 1 || count > 24)
      return { ok: false, reason: 'A KSU has 1 to 24 station ports.' };
    const used = p.cables
      .flatMap((c) => [c.from, c.to])
      .filter((end) => end.part === p.ksu.id)
      .map((end) => Number(/(\d+)$/.exec(end.port)?.[1] ?? 0));
    const highest = Math.max(0, ...used);
    if (count < highest) return { ok: false, reason: `Station port ${highest} is cabled: unplug it first.` };
    commit(`Set ${p.ksu.name} to ${count} station ports`, { ...p, ksu: { ...p.ksu, ports: count } });
    return { ok: true };
  }

  function addStation(code: string, label: string): EditResult {
    const p = requirePlan();
    if (!/^[0-9]{1,4}$/.test(code)) return { ok: false, reason: 'An intercom code is one to four digits.' };
    if (p.ksu.stations.some((s) => s.code === code))
      return { ok: false, reason: `Code ${code} is already in use.` };
    if (p.ksu.stations.length >= 40)
      return { ok: false, reason: 'A KSU takes at most 40 intercom stations.' };
    const id = nextId(p, 'station');
    commit(`Add intercom station ${code}`, {
      ...p,
      ksu: { ...p.ksu, stations: [...p.ksu.stations, { id, code, label: label.trim().slice(0, 40) }] },
    });
    return { ok: true };
  }

  function removeStation(stationId: string) {
    const p = requirePlan();
    commit(`Remove intercom station ${p.ksu.stations.find((s) => s.id === stationId)?.code ?? stationId}`, {
      ...p,
      ksu: { ...p.ksu, stations: p.ksu.stations.filter((s) => s.id !== stationId) },
      sets: p.sets.map((s) => (s.station === stationId ? { ...s, station: undefined } : s)),
    });
  }

  /** Applying a remedy is one step in the history, like any other edit. */
  function applyRemedy(result: CureResult) {
    const p = requirePlan();
    commit(
      `Apply remedy (${result.changes.length} change${result.changes.length === 1 ? '' : 's'})`,
      engineApplyCure(p, result),
    );
  }

  return {
    planId,
    plan,
    baseUpdatedAt,
    revision,
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
    applyRemedy,
  };
});
