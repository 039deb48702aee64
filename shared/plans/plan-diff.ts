/**
 * The readable list of changes between two versions of a plan: parts added or removed, cables laid, pulled or
 * re-plugged, leads lifted, moved or put back, and cross-connect edits at the KSU. Pure; engine public API only.
 * Positions on the drawing are not compared: moving a part on the page changes nothing in the installation.
 */
import {
  effectiveCrossConnect,
  pairColour,
  type Cable,
  type CrossConnect,
  type KsuLead,
  type LeadChange,
  type Plan,
  type PortRef,
} from '../engine/index';

export const PLAN_CHANGE_KINDS = [
  'plan-renamed',
  'description-changed',
  'part-added',
  'part-removed',
  'part-changed',
  'cable-added',
  'cable-removed',
  'cable-changed',
  'lead-lifted',
  'lead-moved',
  'lead-restored',
  'cross-connect-added',
  'cross-connect-removed',
  'cross-connect-changed',
  'line-added',
  'line-removed',
  'station-added',
  'station-removed',
  'required-changed',
] as const;
export type PlanChangeKind = (typeof PLAN_CHANGE_KINDS)[number];

export interface PlanChange {
  kind: PlanChangeKind;
  part?: string;
  text: string;
}

interface Part {
  id: string;
  name: string;
  template: string;
  kindLabel: string;
  leadChanges: LeadChange[];
  extra: string;
}

function partsOf(plan: Plan): Map<string, Part> {
  const parts = new Map<string, Part>();
  const put = (
    p: { id: string; name: string; template: string },
    kindLabel: string,
    leadChanges: LeadChange[],
    settings: unknown,
  ) =>
    parts.set(p.id, {
      id: p.id,
      name: p.name,
      template: p.template,
      kindLabel,
      leadChanges,
      extra: JSON.stringify(settings),
    });
  for (const s of plan.sets)
    put(s, 'set', s.leadChanges, [s.station ?? null, [...s.ringerLines].sort((x, y) => x - y)]);
  for (const a of plan.addOns) put(a, 'add-on', a.leadChanges, [a.serves]);
  for (const a of plan.adapters) put(a, 'adapter', [], a.bridgedPairs ?? null);
  return parts;
}

const pairText = (pair: number) => `pair ${pair} (${pairColour(pair).name})`;

function leadChangeText(change: LeadChange): string {
  if (change.kind === 'move') return `${pairText(change.pair)} moved to ${pairText(change.toPair)}`;
  const which = change.conductor === 'both' ? '' : ` ${change.conductor}`;
  return `${pairText(change.pair)}${which} lifted`;
}

function leadKey(change: LeadChange): string {
  return change.kind === 'move' ? `${change.pair}>${change.toPair}` : `${change.pair}/${change.conductor}`;
}

function diffLeads(part: Part, before: LeadChange[], after: LeadChange[]): PlanChange[] {
  const out: PlanChange[] = [];
  const was = new Map(before.map((c) => [leadKey(c), c]));
  const now = new Map(after.map((c) => [leadKey(c), c]));
  for (const [key, change] of now) {
    if (was.has(key)) continue;
    out.push({
      kind: change.kind === 'move' ? 'lead-moved' : 'lead-lifted',
      part: part.id,
      text: `${part.name}: ${leadChangeText(change)}`,
    });
  }
  for (const [key, change] of was) {
    if (now.has(key)) continue;
    out.push({
      kind: 'lead-restored',
      part: part.id,
      text: `${part.name}: ${pairText(change.pair)} back on its terminals (was ${leadChangeText(change).replace(/^pair \d+ \([a-z-]+\)\s?/, '')})`,
    });
  }
  return out;
}

const endText = (plan: Plan, names: Map<string, string>, ref: PortRef) =>
  `${ref.part === plan.ksu.id ? plan.ksu.name : (names.get(ref.part) ?? ref.part)} ${ref.port}`;

function cableText(plan: Plan, names: Map<string, string>, cable: Cable) {
  return `${endText(plan, names, cable.from)} to ${endText(plan, names, cable.to)}`;
}

function leadText(lead: KsuLead): string {
  switch (lead.kind) {
    case 'line-talk':
      return `line ${lead.line} talk`;
    case 'line-a':
      return `line ${lead.line} A-lead`;
    case 'line-lamp':
      return `line ${lead.line} lamp`;
    case 'line-a-lamp':
      return `line ${lead.line} A-lead and lamp`;
    case 'buzzer':
      return `buzzer of station ${lead.station}`;
  }
}

function diffCrossConnect(before: Plan, after: Plan): PlanChange[] {
  const key = (c: CrossConnect) => `${c.port}:${c.pair}`;
  const was = new Map(effectiveCrossConnect(before.ksu).map((c) => [key(c), c]));
  const now = new Map(effectiveCrossConnect(after.ksu).map((c) => [key(c), c]));
  const out: PlanChange[] = [];
  const where = (c: CrossConnect) => `KSU port ${c.port}, ${pairText(c.pair)}`;
  for (const [k, c] of now) {
    const old = was.get(k);
    if (!old)
      out.push({
        kind: 'cross-connect-added',
        part: after.ksu.id,
        text: `${where(c)}: now ${leadText(c.lead)}`,
      });
    else if (JSON.stringify(old.lead) !== JSON.stringify(c.lead))
      out.push({
        kind: 'cross-connect-changed',
        part: after.ksu.id,
        text: `${where(c)}: ${leadText(old.lead)} → ${leadText(c.lead)}`,
      });
  }
  for (const [k, c] of was)
    if (!now.has(k))
      out.push({
        kind: 'cross-connect-removed',
        part: after.ksu.id,
        text: `${where(c)}: ${leadText(c.lead)} taken off`,
      });
  return out;
}

/** Every change from `before` to `after`, in a stable order: plan, KSU, each part with its leads, cables. */
export function diffPlans(before: Plan, after: Plan): PlanChange[] {
  const out: PlanChange[] = [];
  if (before.name !== after.name)
    out.push({ kind: 'plan-renamed', text: `Renamed from “${before.name}” to “${after.name}”` });
  if (before.description !== after.description)
    out.push({ kind: 'description-changed', text: 'Description changed' });

  const lines = (p: Plan) => new Set(p.ksu.lines.map((l) => l.number));
  for (const n of lines(after))
    if (!lines(before).has(n)) out.push({ kind: 'line-added', text: `Line ${n} added` });
  for (const n of lines(before))
    if (!lines(after).has(n)) out.push({ kind: 'line-removed', text: `Line ${n} removed` });
  const stations = (p: Plan) => new Map(p.ksu.stations.map((s) => [s.id, s.code]));
  for (const [id, code] of stations(after))
    if (!stations(before).has(id))
      out.push({ kind: 'station-added', text: `Intercom station ${code} added` });
  for (const [id, code] of stations(before))
    if (!stations(after).has(id))
      out.push({ kind: 'station-removed', text: `Intercom station ${code} removed` });
  out.push(...diffCrossConnect(before, after));

  const was = partsOf(before);
  const now = partsOf(after);
  for (const part of now.values()) {
    const old = was.get(part.id);
    if (!old) {
      out.push({
        kind: 'part-added',
        part: part.id,
        text: `Added ${part.kindLabel} ${part.name} (${part.template})`,
      });
      continue;
    }
    const what: string[] = [];
    if (old.name !== part.name) what.push(`renamed from ${old.name}`);
    if (old.template !== part.template) what.push(`template ${old.template} → ${part.template}`);
    if (old.extra !== part.extra) what.push('settings changed');
    if (what.length)
      out.push({ kind: 'part-changed', part: part.id, text: `${part.name}: ${what.join(', ')}` });
    out.push(...diffLeads(part, old.leadChanges, part.leadChanges));
  }
  for (const part of was.values())
    if (!now.has(part.id))
      out.push({ kind: 'part-removed', part: part.id, text: `Removed ${part.kindLabel} ${part.name}` });

  const namesBefore = new Map([...was.values()].map((p) => [p.id, p.name]));
  const namesAfter = new Map([...now.values()].map((p) => [p.id, p.name]));
  const cablesBefore = new Map(before.cables.map((c) => [c.id, c]));
  const cablesAfter = new Map(after.cables.map((c) => [c.id, c]));
  for (const cable of after.cables) {
    const old = cablesBefore.get(cable.id);
    if (!old)
      out.push({ kind: 'cable-added', text: `Cable laid from ${cableText(after, namesAfter, cable)}` });
    else if (JSON.stringify([old.from, old.to]) !== JSON.stringify([cable.from, cable.to]))
      out.push({
        kind: 'cable-changed',
        text: `Cable ${cable.label || cable.id} now runs from ${cableText(after, namesAfter, cable)} (was ${cableText(before, namesBefore, old)})`,
      });
  }
  for (const cable of before.cables)
    if (!cablesAfter.has(cable.id))
      out.push({ kind: 'cable-removed', text: `Cable pulled from ${cableText(before, namesBefore, cable)}` });

  if (JSON.stringify(before.required) !== JSON.stringify(after.required))
    out.push({ kind: 'required-changed', text: 'Required functions changed' });
  return out;
}
