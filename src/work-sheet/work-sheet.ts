/**
 * The work sheet of one plan, as plain data: every lead change in plain words with colours, pins and its cost,
 * the KSU cross-connect entries that differ from the standard station plan, and what to check afterwards.
 * Everything it states comes from the engine's public API; this module only puts it into sentences.
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
} from '@shared/engine';

/** One conductor a step handles: its designation, the set's terminal and the connector pin of its cord pair. */
export type SheetLead = ChangedLead;

export interface SheetStep {
  step: number;
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
  port: number;
  pair: number;
  colour: PairColour;
  pins: { tip: number; ring: number };
  /** What the standard station plan puts on this pair of this port. */
  standard: string[];
  /** What this plan puts there. */
  planned: string[];
  action: string;
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
    const { leads, action, cost } = leadChangeWork(ctx.plan, ctx.id, change)!;
    const base = {
      step: firstStep + i,
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

/** Cross-connect entries of the plan that differ from the standard station plan, pair by pair of each port. */
function crossConnectRows(plan: Plan, firstStep: number): SheetCrossConnectRow[] {
  const own = plan.ksu.crossConnect;
  if (!own) return [];
  const group = (entries: CrossConnect[]) => {
    const out = new Map<string, { port: number; pair: number; leads: string[] }>();
    for (const x of entries) {
      const key = `${x.port}/${x.pair}`;
      const slot = out.get(key) ?? { port: x.port, pair: x.pair, leads: [] };
      slot.leads.push(describeKsuLead(plan, x.lead));
      out.set(key, slot);
    }
    return out;
  };
  const standard = group(standardCrossConnect(plan.ksu));
  const planned = group(own);
  const keys = [...new Set([...standard.keys(), ...planned.keys()])]
    .map((key) => (standard.get(key) ?? planned.get(key))!)
    .sort((a, b) => a.port - b.port || a.pair - b.pair);
  const rows: SheetCrossConnectRow[] = [];
  for (const { port, pair } of keys) {
    const was = [...(standard.get(`${port}/${pair}`)?.leads ?? [])].sort();
    const now = [...(planned.get(`${port}/${pair}`)?.leads ?? [])].sort();
    if (was.join('|') === now.join('|')) continue;
    const add = now.filter((l) => !was.includes(l));
    const drop = was.filter((l) => !now.includes(l));
    const where = `port ${port}, ${pairText(pair)}`;
    const parts = [
      ...(drop.length ? [`take the ${listWords(drop)} off ${where}`] : []),
      ...(add.length ? [`connect the ${listWords(add)} to ${where}`] : []),
    ];
    const action = parts.join('; then ');
    rows.push({
      step: firstStep + rows.length,
      port,
      pair,
      colour: pairColour(pair),
      pins: { tip: pinOf(pair, 'tip'), ring: pinOf(pair, 'ring') },
      standard: was,
      planned: now,
      action: action.charAt(0).toUpperCase() + action.slice(1) + '.',
    });
  }
  return rows;
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
  const crossConnect = crossConnectRows(plan, leadSteps + 1);
  const hasWork = leadSteps + crossConnect.length > 0;
  return {
    planName: plan.name,
    setCount: plan.sets.length,
    addOnCount: plan.addOns.length,
    stepCount: leadSteps + crossConnect.length,
    parts,
    crossConnect,
    findings: hasWork
      ? evaluate(plan, initialState(plan)).findings.map((f) => ({
          severity: f.severity,
          message: f.message,
        }))
      : [],
    requiredFailures: hasWork ? checkRequired(plan).map((f) => f.message) : [],
    handChecks: hasWork ? handChecks(plan) : [],
  };
}
