/**
 * The work sheet of one plan, as plain data: every lead change in plain words with colours, pins and its cost,
 * the KSU cross-connect entries that differ from the standard station plan, and what to check afterwards.
 * Everything it states comes from the engine's public API; this module only puts it into sentences. The page
 * and the server's PDF both build from it, so they say the same.
 */
import {
  checkRequired,
  describeKsuLead,
  evaluate,
  findSet,
  getTemplate,
  initialState,
  leadChangeWork,
  leadTable,
  linesOfSet,
  listWords,
  pairColour,
  pinOf,
  servedName,
  standardCrossConnect,
  type ChangedLead,
  type CrossConnect,
  type LeadChange,
  type PairColour,
  type Plan,
} from '../engine/index';
import { costWords } from './cost-words';
import { requiredFailureWords } from './words';

/** One conductor a step handles: its designation, the set's terminal and the connector pin of its cord pair. */
export type SheetLead = ChangedLead;

export interface SheetStep {
  step: number;
  /** Stable name of the step for the work record (`step:<part id>:<n>`). */
  key: string;
  kind: LeadChange['kind'];
  pair: number;
  colour: PairColour;
  /** The spare pair a move lands on. */
  toPair?: number;
  toColour?: PairColour;
  leads: SheetLead[];
  /** What the pair's leads do, from the lead table. */
  purpose: string;
  action: string;
  cost: string;
}

export interface SheetPart {
  id: string;
  kind: 'set' | 'add-on';
  name: string;
  templateTitle: string;
  /** Intercom station the set answers, or the set an add-on serves. */
  station: string;
  steps: SheetStep[];
}

export interface SheetCrossConnectRow {
  step: number;
  /** Stable name of the step for the work record (`xc:<port>:<pair>`). */
  key: string;
  port: number;
  pair: number;
  colour: PairColour;
  pins: { tip: number; ring: number };
  /** What the standard station plan puts on this pair of this port. */
  standard: string[];
  /** What this plan puts there. */
  planned: string[];
  /** `put-back`: the plan's entry is the fault and the step restores the standard one; `make`: the cure needs it. */
  direction: 'put-back' | 'make';
  action: string;
}

/** A cross-connect entry that differs from the standard plan but changes nothing the engine checks. */
export interface SheetCrossConnectKept {
  port: number;
  pair: number;
  colour: PairColour;
  standard: string[];
  planned: string[];
}

export interface SheetCheck {
  /** Who or what the check is about, e.g. the set's name. */
  subject: string;
  text: string;
}

export interface WorkSheet {
  planName: string;
  setCount: number;
  addOnCount: number;
  stepCount: number;
  parts: SheetPart[];
  crossConnect: SheetCrossConnectRow[];
  /** Cross-connect differences that are left as wired (no step). */
  crossConnectKept: SheetCrossConnectKept[];
  /** Findings of the plan in its initial state (everything on hook, no calls). */
  findings: { severity: 'fault' | 'warning'; message: string }[];
  /** Required functions the engine finds failing. */
  requiredFailures: string[];
  handChecks: SheetCheck[];
}

function pairText(pair: number): string {
  return `pair ${pair} (${pairColour(pair).name})`;
}

interface PartContext {
  plan: Plan;
  id: string;
  rows: ReturnType<typeof leadTable>;
}

function partSteps(ctx: PartContext, changes: LeadChange[], firstStep: number): SheetStep[] {
  return changes.map((change, i) => {
    const row = ctx.rows.find((r) => r.pair === change.pair);
    const work = leadChangeWork(ctx.plan, ctx.id, change)!;
    const { leads, action } = work;
    const cost = costWords(work.cost);
    const base = {
      step: firstStep + i,
      key: `step:${ctx.id}:${i + 1}`,
      pair: change.pair,
      colour: pairColour(change.pair),
      purpose: row?.purpose ?? '',
    };
    if (change.kind === 'move') {
      return {
        ...base,
        kind: 'move',
        toPair: change.toPair,
        toColour: pairColour(change.toPair),
        leads,
        action,
        cost,
      };
    }
    return { ...base, kind: 'lift', leads, action, cost };
  });
}

function stationText(plan: Plan, stationId: string | undefined): string {
  if (!stationId) return 'No intercom station';
  const st = plan.ksu.stations.find((s) => s.id === stationId);
  if (!st) return `Station ${stationId}`;
  return `Intercom station ${st.code}${st.label ? ` (${st.label})` : ''}`;
}

function collectParts(plan: Plan): SheetPart[] {
  const parts: SheetPart[] = [];
  let step = 1;
  const entries = [
    ...plan.sets.map((s) => ({
      doc: s,
      kind: 'set' as const,
      station: stationText(plan, s.station),
    })),
    ...plan.addOns.map((a) => ({
      doc: a,
      kind: 'add-on' as const,
      station: `Serves ${servedName(plan, a)}`,
    })),
  ];
  for (const { doc, kind, station } of entries) {
    if (!doc.leadChanges.length) continue;
    const template = getTemplate(doc.template);
    const ctx: PartContext = { plan, id: doc.id, rows: leadTable(plan, doc.id) };
    const steps = partSteps(ctx, doc.leadChanges, step);
    step += steps.length;
    parts.push({
      id: doc.id,
      kind,
      name: doc.name,
      templateTitle: template?.title ?? doc.template,
      station,
      steps,
    });
  }
  return parts;
}

/** Faults at rest plus failing required functions: how far a plan is from working. */
function troubles(plan: Plan): number {
  return evaluate(plan, initialState(plan)).findings.length + checkRequired(plan).length;
}

/**
 * Cross-connect entries of the plan that differ from the standard station plan, pair by pair of each port.
 * Each difference is tried both ways: when putting the pair back to the standard plan leaves fewer troubles, the
 * difference is a fault as wired and the step puts it back; when it leaves more, the difference is part of the
 * cure and the step makes it; when it changes nothing, it is no step at all, only a note (`kept`).
 */
function crossConnectRows(
  plan: Plan,
  firstStep: number,
): { rows: SheetCrossConnectRow[]; kept: SheetCrossConnectKept[] } {
  const own = plan.ksu.crossConnect;
  if (!own) return { rows: [], kept: [] };
  const slot = (x: CrossConnect) => `${x.port}/${x.pair}`;
  const standardEntries = standardCrossConnect(plan.ksu);
  const words = (entries: CrossConnect[], key: string) =>
    entries
      .filter((x) => slot(x) === key)
      .map((x) => describeKsuLead(plan, x.lead))
      .sort();
  const keys = [...new Set([...standardEntries, ...own].map(slot))]
    .map((key) => ({ key, port: Number(key.split('/')[0]), pair: Number(key.split('/')[1]) }))
    .sort((a, b) => a.port - b.port || a.pair - b.pair);
  const base = troubles(plan);
  const rows: SheetCrossConnectRow[] = [];
  const kept: SheetCrossConnectKept[] = [];
  for (const { key, port, pair } of keys) {
    const was = words(standardEntries, key);
    const now = words(own, key);
    if (was.join('|') === now.join('|')) continue;
    const putBack = [
      ...own.filter((x) => slot(x) !== key),
      ...standardEntries.filter((x) => slot(x) === key),
    ];
    const after = troubles({ ...plan, ksu: { ...plan.ksu, crossConnect: putBack } });
    const where = { port, pair, colour: pairColour(pair), standard: was, planned: now };
    if (after === base) {
      kept.push(where);
      continue;
    }
    // The fault is in the wiring as found: go from the plan's entries to the standard ones; else the other way.
    const [from, to] = after < base ? [now, was] : [was, now];
    const add = to.filter((l) => !from.includes(l));
    const drop = from.filter((l) => !to.includes(l));
    const place = `port ${port}, ${pairText(pair)}`;
    const action = [
      ...(drop.length ? [`take the ${listWords(drop)} off ${place}`] : []),
      ...(add.length ? [`connect the ${listWords(add)} to ${place}`] : []),
    ].join('; then ');
    rows.push({
      ...where,
      step: firstStep + rows.length,
      key: `xc:${port}:${pair}`,
      pins: { tip: pinOf(pair, 'tip'), ring: pinOf(pair, 'ring') },
      direction: after < base ? 'put-back' : 'make',
      action: action.charAt(0).toUpperCase() + action.slice(1) + '.',
    });
  }
  return { rows, kept };
}

function handChecks(plan: Plan): SheetCheck[] {
  const checks: SheetCheck[] = [];
  if (plan.required.allLinesOnEverySet) {
    for (const set of plan.sets) {
      const lines = linesOfSet(plan, set.id).map((l) => l.line);
      if (!lines.length) continue;
      checks.push({
        subject: set.name,
        text: `On line ${listWords(lines.map(String))}, one line at a time: lift the handset, hear only that line, hold it, take it back, hang up and see its lamp go dark.`,
      });
    }
  }
  if (plan.required.intercomPerStation) {
    for (const st of plan.ksu.stations) {
      const assigned = plan.sets.filter((s) => s.station === st.id).map((s) => s.name);
      checks.push({
        subject: `Intercom station ${st.code}`,
        text: assigned.length
          ? `Dial ${st.code} on the intercom: ${listWords(assigned)} buzzes, no other set does.`
          : `Dial ${st.code} on the intercom: no set is assigned, so note which set, if any, buzzes.`,
      });
    }
  }
  for (const id of plan.required.handsFreeSets) {
    const set = findSet(plan, id);
    if (!set) continue;
    checks.push({
      subject: set.name,
      text: 'Switch the hands-free add-on on during a call: the call is heard on the loudspeaker, the handset mutes, and the hold key still holds.',
    });
  }
  return checks;
}

export function buildWorkSheet(plan: Plan): WorkSheet {
  const parts = collectParts(plan);
  const leadSteps = parts.reduce((n, p) => n + p.steps.length, 0);
  const { rows: crossConnect, kept } = crossConnectRows(plan, leadSteps + 1);
  const hasWork = leadSteps + crossConnect.length > 0;
  return {
    planName: plan.name,
    setCount: plan.sets.length,
    addOnCount: plan.addOns.length,
    stepCount: leadSteps + crossConnect.length,
    parts,
    crossConnect,
    crossConnectKept: kept,
    findings: hasWork
      ? evaluate(plan, initialState(plan)).findings.map((f) => ({
          severity: f.severity,
          message: f.message,
        }))
      : [],
    requiredFailures: hasWork ? checkRequired(plan).map((f) => requiredFailureWords(plan, f)) : [],
    handChecks: hasWork ? handChecks(plan) : [],
  };
}
