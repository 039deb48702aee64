/**
 * The work sheet of one plan, as plain data: every lead change in plain words with colours, pins and its cost,
 * the KSU cross-connect entries that differ from the standard station plan, and what to check afterwards.
 * Everything it states comes from the engine's public API; this module only puts it into sentences.
 */
import {
  checkRequired,
  evaluate,
  getTemplate,
  initialState,
  leadTable,
  linesOfSet,
  pairColour,
  pinOf,
  standardCrossConnect,
  type Conductor,
  type CrossConnect,
  type KsuLead,
  type LeadChange,
  type LeadRow,
  type LeadSpec,
  type PairColour,
  type Plan,
} from '@shared/engine';

/** One conductor a step handles: its designation, the set's terminal and the connector pin of its cord pair. */
export interface SheetLead {
  conductor: Conductor;
  colour: string;
  designation: string;
  terminal: string;
  pin: number;
}

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

const CONDUCTORS: Conductor[] = ['tip', 'ring'];

function conductorColour(colour: PairColour, conductor: Conductor): string {
  return conductor === 'tip' ? colour.tip : colour.ring;
}

function pairText(pair: number): string {
  return `pair ${pair} (${pairColour(pair).name})`;
}

function joinWords(words: string[]): string {
  if (words.length <= 1) return words.join('');
  return `${words.slice(0, -1).join(', ')} and ${words[words.length - 1]}`;
}

/** The line a line lead belongs to, from its trade designation ("L3 A1" → 3). */
function lineOfDesignation(designation: string): number | null {
  const match = /^L(\d+)\b/.exec(designation);
  return match ? Number(match[1]) : null;
}

interface PartContext {
  plan: Plan;
  id: string;
  kind: 'set' | 'add-on';
  name: string;
  /** Template leads of the part. */
  leads: readonly LeadSpec[];
  rows: LeadRow[];
}

function leadsOf(ctx: PartContext, pair: number, conductors: readonly Conductor[]): SheetLead[] {
  const colour = pairColour(pair);
  return CONDUCTORS.filter((c) => conductors.includes(c)).flatMap((conductor) => {
    const spec = ctx.leads.find((l) => l.pair === pair && l.conductor === conductor);
    return spec
      ? [
          {
            conductor,
            colour: conductorColour(colour, conductor),
            designation: spec.designation,
            terminal: spec.terminal,
            pin: pinOf(pair, conductor),
          },
        ]
      : [];
  });
}

function liftAction(ctx: PartContext, pair: number, leads: SheetLead[], both: boolean): string {
  const where = ctx.kind === 'set' ? 'the set' : 'the add-on';
  const which = both ? 'both leads' : `the ${leads[0]?.conductor ?? 'lead'} lead`;
  const each = leads.map((l) => `${l.conductor} (${l.colour}, cord pin ${l.pin}) off terminal ${l.terminal}`);
  const kept = both ? '' : ` Leave the ${leads[0]?.conductor === 'tip' ? 'ring' : 'tip'} lead on.`;
  return `Lift ${which} of ${pairText(pair)} inside ${where}: ${joinWords(each)}; insulate each end and tie it back.${kept}`;
}

function moveAction(pair: number, toPair: number, leads: SheetLead[]): string {
  const to = pairColour(toPair);
  const each = leads.map(
    (l) =>
      `at terminal ${l.terminal} take off the ${l.colour} ${l.conductor} (pin ${l.pin}) and land the ${conductorColour(to, l.conductor)} ${l.conductor} of pair ${toPair} (pin ${pinOf(toPair, l.conductor)})`,
  );
  return `Re-terminate ${pairText(pair)} leads on spare ${pairText(toPair)}: ${each.join('; ')}. Insulate the freed ${pairColour(pair).name} leads.`;
}

/** What lifting these leads takes away from the user, judged by the leads' scope in the lead table. */
function liftCost(ctx: PartContext, row: LeadRow | undefined, leads: SheetLead[]): string {
  const { plan, name } = ctx;
  if (ctx.kind === 'add-on') {
    const served = plan.addOns.find((a) => a.id === ctx.id)?.serves;
    const servedName = plan.sets.find((s) => s.id === served)?.name ?? served ?? 'its set';
    return `${name} no longer works for ${servedName}: its hands-free stops.`;
  }
  switch (row?.scope) {
    case 'station':
      return `${name} no longer buzzes for intercom calls.`;
    case 'bus': {
      const onKsu = new Set(plan.ksu.lines.map((l) => l.number));
      const lines = [
        ...new Set(leads.map((l) => lineOfDesignation(l.designation)).filter((l) => l !== null)),
      ];
      const live = lines.filter((l) => onKsu.has(l));
      if (live.length) return `${name} loses line ${joinWords(live.map(String))}.`;
      return `None today: the KSU has no line ${joinWords(lines.map(String))}; ${name} could not use it if one is added.`;
    }
    case 'private':
      return plan.addOns.some((a) => a.serves === ctx.id)
        ? `${name} loses its hands-free connection.`
        : `None today: ${name} has no hands-free add-on (it can no longer take one).`;
    default:
      return 'None: the pair carries no lead in this part.';
  }
}

function moveCost(ctx: PartContext, row: LeadRow | undefined, pair: number, toPair: number): string {
  const what = row?.scope === 'station' ? `its intercom buzzer` : `these leads`;
  return `None once the KSU feeds pair ${toPair} on ${ctx.name}'s station port (see KSU cross-connect) — ${what} then work only on pair ${toPair}; pair ${pair} is free afterwards.`;
}

function partSteps(ctx: PartContext, changes: LeadChange[], firstStep: number): SheetStep[] {
  return changes.map((change, i) => {
    const row = ctx.rows.find((r) => r.pair === change.pair);
    const colour = pairColour(change.pair);
    const base = { step: firstStep + i, pair: change.pair, colour, purpose: row?.purpose ?? '' };
    if (change.kind === 'move') {
      const leads = leadsOf(ctx, change.pair, CONDUCTORS);
      return {
        ...base,
        kind: 'move',
        toPair: change.toPair,
        toColour: pairColour(change.toPair),
        leads,
        action: moveAction(change.pair, change.toPair, leads),
        cost: moveCost(ctx, row, change.pair, change.toPair),
      };
    }
    const conductor = change.conductor;
    const both = conductor === 'both';
    const leads = leadsOf(ctx, change.pair, conductor === 'both' ? CONDUCTORS : [conductor]);
    return {
      ...base,
      kind: 'lift',
      leads,
      action: liftAction(ctx, change.pair, leads, both),
      cost: liftCost(ctx, row, leads),
    };
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
      station: `Serves ${plan.sets.find((s) => s.id === a.serves)?.name ?? a.serves}`,
    })),
  ];
  for (const { doc, kind, station } of entries) {
    if (!doc.leadChanges.length) continue;
    const template = getTemplate(doc.template);
    const ctx: PartContext = {
      plan,
      id: doc.id,
      kind,
      name: doc.name,
      leads: template?.leads ?? [],
      rows: leadTable(plan, doc.id),
    };
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

const LEAD_WORDS: Record<Exclude<KsuLead['kind'], 'buzzer'>, string> = {
  'line-talk': 'talk pair (T, R)',
  'line-a': 'A-lead pair (A, A1)',
  'line-lamp': 'lamp pair (L, LG)',
  'line-a-lamp': 'A-lead and lamp lead (A, L)',
};

export function describeKsuLead(plan: Plan, lead: KsuLead): string {
  if (lead.kind === 'buzzer') {
    const st = plan.ksu.stations.find((s) => s.id === lead.station);
    return `buzzer output of intercom station ${st?.code ?? lead.station}`;
  }
  return `line ${lead.line} ${LEAD_WORDS[lead.kind]}`;
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
      ...(drop.length ? [`take the ${joinWords(drop)} off ${where}`] : []),
      ...(add.length ? [`connect the ${joinWords(add)} to ${where}`] : []),
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
        text: `On line ${joinWords(lines.map(String))}, one line at a time: lift the handset, hear only that line, hold it, take it back, hang up and see its lamp go dark.`,
      });
    }
  }
  if (plan.required.intercomPerStation) {
    for (const st of plan.ksu.stations) {
      const assigned = plan.sets.filter((s) => s.station === st.id).map((s) => s.name);
      checks.push({
        subject: `Intercom station ${st.code}`,
        text: assigned.length
          ? `Dial ${st.code} on the intercom: ${joinWords(assigned)} buzzes, no other set does.`
          : `Dial ${st.code} on the intercom: no set is assigned, so note which set, if any, buzzes.`,
      });
    }
  }
  for (const id of plan.required.handsFreeSets) {
    const set = plan.sets.find((s) => s.id === id);
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
