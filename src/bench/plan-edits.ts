/**
 * Edits of a plan document as plain functions: a plan in, a new plan (and a history label) out, or a refusal
 * in plain words. Nothing here mutates its input, so the Bench store can keep every old plan as an undo step.
 * Each edit keeps the document one the engine's `validatePlan` accepts when it was one before.
 */
import {
  canConnect,
  crossReferenceIssues,
  getTemplate,
  type CureResult,
  type LeadChange,
  type Plan,
  type PortRef,
} from '@shared/engine';

export type Position = { x: number; y: number };

/** An accepted edit carries the next plan, its history label and, for additions, the new id. */
export type EditOutcome =
  { ok: true; plan: Plan; label: string; id?: string } | { ok: false; reason: string };

/** Upper bounds of the plan document (shared/engine/document/plan.schema.ts). */
const MAX = { sets: 200, addOns: 200, adapters: 200, cables: 600, stations: 40 } as const;

const refuse = (reason: string): EditOutcome => ({ ok: false, reason });

/** Parts whose presence changes what a simulation state can refer to. Moves and renames leave it alone. */
export function simShape(plan: Plan): string {
  return JSON.stringify([
    plan.sets.map((s) => [s.id, s.template]),
    plan.addOns.map((a) => [a.id, a.serves]),
    plan.ksu.lines.map((l) => l.number),
    plan.ksu.stations.map((s) => s.id),
  ]);
}

/** Ids of the parts and cables: what the canvas can select. */
export function partIds(plan: Plan): Set<string> {
  return new Set([
    plan.ksu.id,
    ...plan.sets.map((p) => p.id),
    ...plan.addOns.map((p) => p.id),
    ...plan.adapters.map((p) => p.id),
    ...plan.cables.map((c) => c.id),
  ]);
}

/** Every id the document holds: parts, cables and intercom stations. */
export function usedIds(plan: Plan): Set<string> {
  return new Set([...partIds(plan), ...plan.ksu.stations.map((s) => s.id)]);
}

/** The one id allocator: the first `prefix-N` that no part, cable or station of the plan has. */
export function nextId(plan: Plan, prefix: string): string {
  const used = usedIds(plan);
  let n = 1;
  while (used.has(`${prefix}-${n}`)) n += 1;
  return `${prefix}-${n}`;
}

/** The lines among `lines` that a set template has a ringer strap for. */
export function strappable(template: string, lines: number[]): number[] {
  const straps = getTemplate(template)?.ringerStraps ?? [];
  return lines.filter((line) => straps.some((s) => s.line === line));
}

/** The name a user sees for a part id (the id itself when no part has it). */
export function partName(plan: Plan, id: string): string {
  if (plan.ksu.id === id) return plan.ksu.name;
  return (
    plan.sets.find((s) => s.id === id)?.name ??
    plan.addOns.find((a) => a.id === id)?.name ??
    plan.adapters.find((a) => a.id === id)?.name ??
    id
  );
}

function templateOfKind(template: string, kind: 'set' | 'add-on' | 'adapter') {
  const t = getTemplate(template);
  return t?.kind === kind ? t : undefined;
}

/**
 * Accept `next` only if it brings no cross-reference issue that `before` did not already have; otherwise refuse
 * with the engine's own words for the first new one.
 */
function unlessNewIssues(before: Plan, next: Plan, label: string): EditOutcome {
  const known = new Set(crossReferenceIssues(before).map((i) => `${i.path}|${i.message}`));
  const fresh = crossReferenceIssues(next).find((i) => !known.has(`${i.path}|${i.message}`));
  return fresh ? refuse(`${fresh.message}.`) : { ok: true, plan: next, label };
}

// ---- adding parts --------------------------------------------------------------------------------

export function addSet(plan: Plan, template: string, position: Position): EditOutcome {
  const t = templateOfKind(template, 'set');
  if (!t) return refuse(`There is no key set called "${template}".`);
  if (plan.sets.length >= MAX.sets) return refuse(`A plan takes at most ${MAX.sets} key sets.`);
  const id = nextId(plan, 'set');
  const ringerLines = strappable(
    template,
    plan.ksu.lines.map((l) => l.number).sort((a, b) => a - b),
  );
  const set = { id, name: `Set ${plan.sets.length + 1}`, template, ringerLines, leadChanges: [], position };
  return { ok: true, id, label: `Add ${t.title}`, plan: { ...plan, sets: [...plan.sets, set] } };
}

export function addAddOn(plan: Plan, template: string, serves: string, position: Position): EditOutcome {
  const t = templateOfKind(template, 'add-on');
  if (!t) return refuse(`There is no add-on called "${template}".`);
  if (!plan.sets.some((s) => s.id === serves))
    return refuse('Place a key set first: an add-on serves one set.');
  if (plan.addOns.length >= MAX.addOns) return refuse(`A plan takes at most ${MAX.addOns} add-ons.`);
  const id = nextId(plan, 'addon');
  const name = `${t.title} for ${partName(plan, serves)}`.slice(0, 60).trim();
  const addOn = { id, name, template, serves, leadChanges: [], position };
  return { ok: true, id, label: `Add ${t.title}`, plan: { ...plan, addOns: [...plan.addOns, addOn] } };
}

export function addAdapter(plan: Plan, template: string, position: Position): EditOutcome {
  const t = templateOfKind(template, 'adapter');
  if (!t) return refuse(`There is no adapter called "${template}".`);
  if (plan.adapters.length >= MAX.adapters) return refuse(`A plan takes at most ${MAX.adapters} adapters.`);
  const id = nextId(plan, 'adapter');
  const adapter = { id, name: `Adapter ${plan.adapters.length + 1}`, template, position };
  return { ok: true, id, label: `Add ${t.title}`, plan: { ...plan, adapters: [...plan.adapters, adapter] } };
}

// ---- moving, renaming, removing, duplicating -----------------------------------------------------

/** Moving several parts at once (a dragged selection) is one edit; positions are rounded to whole units. */
export function moveParts(plan: Plan, moves: { id: string; position: Position }[]): EditOutcome {
  const at = new Map(moves.map((m) => [m.id, { x: Math.round(m.position.x), y: Math.round(m.position.y) }]));
  const same = (a?: Position, b?: Position) => !!a && !!b && a.x === b.x && a.y === b.y;
  const changed = moves.filter((m) => {
    const part =
      plan.ksu.id === m.id
        ? plan.ksu
        : (plan.sets.find((s) => s.id === m.id) ??
          plan.addOns.find((x) => x.id === m.id) ??
          plan.adapters.find((x) => x.id === m.id));
    return part && !same(part.position, at.get(m.id));
  });
  if (!changed.length) return { ok: true, plan, label: 'Move' };
  const move = <T extends { id: string; position?: Position }>(list: T[]) =>
    list.map((x) => (at.has(x.id) ? { ...x, position: at.get(x.id) } : x));
  const next: Plan = {
    ...plan,
    ksu: at.has(plan.ksu.id) ? { ...plan.ksu, position: at.get(plan.ksu.id) } : plan.ksu,
    sets: move(plan.sets),
    addOns: move(plan.addOns),
    adapters: move(plan.adapters),
  };
  const label =
    changed.length === 1 ? `Move ${partName(plan, changed[0].id)}` : `Move ${changed.length} parts`;
  return { ok: true, plan: next, label };
}

export function renamePart(plan: Plan, id: string, name: string): EditOutcome {
  const clean = name.trim();
  if (!clean) return refuse('A name is required.');
  if (clean.length > 60) return refuse('Keep names to 60 characters.');
  const rename = <T extends { id: string; name: string }>(list: T[]) =>
    list.map((x) => (x.id === id ? { ...x, name: clean } : x));
  const next: Plan =
    plan.ksu.id === id
      ? { ...plan, ksu: { ...plan.ksu, name: clean } }
      : { ...plan, sets: rename(plan.sets), addOns: rename(plan.addOns), adapters: rename(plan.adapters) };
  return { ok: true, plan: next, label: `Rename ${partName(plan, id)} to ${clean}` };
}

/** The ids a removal of `id` takes away: the part and, for a set, the add-ons serving it. */
export function removedWith(plan: Plan, id: string): Set<string> {
  return new Set([id, ...plan.addOns.filter((a) => a.serves === id).map((a) => a.id)]);
}

/** Removing a set takes its add-ons with it; every cable on a removed part goes too. */
export function removePart(plan: Plan, id: string): EditOutcome {
  if (plan.ksu.id === id) return refuse('The key service unit stays: a plan always has one.');
  const cable = plan.cables.find((c) => c.id === id);
  if (cable) {
    return {
      ok: true,
      label: `Remove cable ${cable.label || cable.id}`,
      plan: { ...plan, cables: plan.cables.filter((c) => c.id !== id) },
    };
  }
  if (!partIds(plan).has(id)) return refuse(`There is no part "${id}" in this plan.`);
  const gone = removedWith(plan, id);
  const next: Plan = {
    ...plan,
    sets: plan.sets.filter((s) => !gone.has(s.id)),
    addOns: plan.addOns.filter((a) => !gone.has(a.id)),
    adapters: plan.adapters.filter((a) => !gone.has(a.id)),
    cables: plan.cables.filter((c) => !gone.has(c.from.part) && !gone.has(c.to.part)),
    required: { ...plan.required, handsFreeSets: plan.required.handsFreeSets.filter((s) => !gone.has(s)) },
  };
  return { ok: true, plan: next, label: `Delete ${partName(plan, id)}` };
}

/** A copy of a set, add-on or adapter (not its cables, nor a set's station), offset from the original. */
export function duplicatePart(plan: Plan, id: string): EditOutcome {
  const offset = (pos?: Position) => (pos ? { x: pos.x + 40, y: pos.y + 40 } : { x: 40, y: 40 });
  const copyOf = <T extends { id: string; name: string; position?: Position }>(
    part: T,
    newId: string,
  ): T => ({
    ...part,
    id: newId,
    name: `${part.name} copy`.slice(0, 60).trim(),
    position: offset(part.position),
  });
  const set = plan.sets.find((s) => s.id === id);
  if (set) {
    if (plan.sets.length >= MAX.sets) return refuse(`A plan takes at most ${MAX.sets} key sets.`);
    const copy = { ...copyOf(set, nextId(plan, 'set')), station: undefined };
    return {
      ok: true,
      id: copy.id,
      label: `Duplicate ${set.name}`,
      plan: { ...plan, sets: [...plan.sets, copy] },
    };
  }
  const addOn = plan.addOns.find((a) => a.id === id);
  if (addOn) {
    if (plan.addOns.length >= MAX.addOns) return refuse(`A plan takes at most ${MAX.addOns} add-ons.`);
    const copy = copyOf(addOn, nextId(plan, 'addon'));
    const next = { ...plan, addOns: [...plan.addOns, copy] };
    return { ok: true, id: copy.id, label: `Duplicate ${addOn.name}`, plan: next };
  }
  const adapter = plan.adapters.find((a) => a.id === id);
  if (adapter) {
    if (plan.adapters.length >= MAX.adapters) return refuse(`A plan takes at most ${MAX.adapters} adapters.`);
    const copy = copyOf(adapter, nextId(plan, 'adapter'));
    const next = { ...plan, adapters: [...plan.adapters, copy] };
    return { ok: true, id: copy.id, label: `Duplicate ${adapter.name}`, plan: next };
  }
  return refuse('Only sets, add-ons and adapters can be duplicated.');
}

// ---- cables --------------------------------------------------------------------------------------

/** One 25-pair cable between two ports, if the engine accepts it; the plug end is recorded as `from`. */
export function connect(plan: Plan, a: PortRef, b: PortRef): EditOutcome {
  const verdict = canConnect(plan, a, b);
  if (!verdict.ok) return verdict;
  if (plan.cables.length >= MAX.cables) return refuse(`A plan takes at most ${MAX.cables} cables.`);
  const gender = (ref: PortRef) => {
    const part =
      plan.ksu.id === ref.part
        ? null
        : (plan.sets.find((s) => s.id === ref.part) ??
          plan.addOns.find((x) => x.id === ref.part) ??
          plan.adapters.find((x) => x.id === ref.part));
    const template = part ? getTemplate(part.template) : undefined;
    return template?.ports.find((port) => port.name === ref.port)?.gender ?? 'jack';
  };
  const [from, to] = gender(a) === 'plug' ? [a, b] : [b, a];
  const id = nextId(plan, 'cable');
  return {
    ok: true,
    id,
    label: `Cable ${partName(plan, from.part)} to ${partName(plan, to.part)}`,
    plan: { ...plan, cables: [...plan.cables, { id, from, to }] },
  };
}

// ---- leads, set options and the KSU --------------------------------------------------------------

function changeLeads(
  plan: Plan,
  id: string,
  label: string,
  edit: (changes: LeadChange[]) => LeadChange[],
): EditOutcome {
  let next: Plan;
  if (plan.sets.some((s) => s.id === id)) {
    next = {
      ...plan,
      sets: plan.sets.map((s) => (s.id === id ? { ...s, leadChanges: edit(s.leadChanges) } : s)),
    };
  } else if (plan.addOns.some((a) => a.id === id)) {
    next = {
      ...plan,
      addOns: plan.addOns.map((a) => (a.id === id ? { ...a, leadChanges: edit(a.leadChanges) } : a)),
    };
  } else return refuse('Only key sets and add-ons have leads to change.');
  return unlessNewIssues(plan, next, label);
}

export function liftLead(plan: Plan, id: string, pair: number, conductor: 'tip' | 'ring' | 'both' = 'both') {
  const what = conductor === 'both' ? `pair ${pair}` : `pair ${pair} ${conductor}`;
  return changeLeads(plan, id, `Lift ${what} in ${partName(plan, id)}`, (list) => [
    ...list.filter((c) => c.pair !== pair),
    { kind: 'lift', pair, conductor },
  ]);
}

export function moveLead(plan: Plan, id: string, pair: number, toPair: number) {
  return changeLeads(plan, id, `Move pair ${pair} to pair ${toPair} in ${partName(plan, id)}`, (list) => [
    ...list.filter((c) => c.pair !== pair),
    { kind: 'move', pair, toPair },
  ]);
}

export function restoreLead(plan: Plan, id: string, pair: number) {
  return changeLeads(plan, id, `Restore pair ${pair} in ${partName(plan, id)}`, (list) =>
    list.filter((c) => c.pair !== pair),
  );
}

export function updateSet(
  plan: Plan,
  id: string,
  patch: { station?: string | null; ringerLines?: number[]; template?: string },
): EditOutcome {
  const set = plan.sets.find((s) => s.id === id);
  if (!set) return refuse(`There is no key set "${id}" in this plan.`);
  if (patch.template && !templateOfKind(patch.template, 'set'))
    return refuse(`There is no key set called "${patch.template}".`);
  if (patch.station && !plan.ksu.stations.some((s) => s.id === patch.station))
    return refuse('That intercom station is not on the KSU.');
  const next = { ...set };
  if (patch.station !== undefined) next.station = patch.station ?? undefined;
  if (patch.template) next.template = patch.template;
  const lines = new Set(plan.ksu.lines.map((l) => l.number));
  const wanted = [...new Set(patch.ringerLines ?? next.ringerLines)].filter((l) => lines.has(l));
  next.ringerLines = strappable(
    next.template,
    wanted.sort((a, b) => a - b),
  );
  const label = `Change ${set.name} options`;
  return unlessNewIssues(plan, { ...plan, sets: plan.sets.map((s) => (s.id === id ? next : s)) }, label);
}

export function setAddOnServes(plan: Plan, id: string, serves: string): EditOutcome {
  if (!plan.addOns.some((a) => a.id === id)) return refuse(`There is no add-on "${id}" in this plan.`);
  if (!plan.sets.some((s) => s.id === serves)) return refuse('An add-on serves a key set.');
  return {
    ok: true,
    label: `Move ${partName(plan, id)} to ${partName(plan, serves)}`,
    plan: { ...plan, addOns: plan.addOns.map((a) => (a.id === id ? { ...a, serves } : a)) },
  };
}

/** Lines are numbered 1..N; new lines get the next directory numbers no line of the plan has. */
export function setLineCount(plan: Plan, count: number): EditOutcome {
  if (!Number.isInteger(count) || count < 1 || count > 30) return refuse('A KSU has 1 to 30 lines.');
  const wired = (plan.ksu.crossConnect ?? []).find((cc) => cc.lead.kind !== 'buzzer' && cc.lead.line > count);
  if (wired && wired.lead.kind !== 'buzzer')
    return refuse(
      `Line ${wired.lead.line} is cross-connected on station port ${wired.port}: change that first.`,
    );
  const lines = plan.ksu.lines.filter((l) => l.number <= count).sort((a, b) => a.number - b.number);
  const numbers = new Set(lines.map((l) => l.directoryNumber));
  let dn = 5550100;
  for (let n = lines.length + 1; n <= count; n += 1) {
    while (numbers.has(String(dn + n))) dn += 100;
    numbers.add(String(dn + n));
    lines.push({ number: n, label: '', directoryNumber: String(dn + n) });
  }
  return {
    ok: true,
    label: `Set ${plan.ksu.name} to ${count} lines`,
    plan: {
      ...plan,
      ksu: { ...plan.ksu, lines },
      sets: plan.sets.map((s) => ({ ...s, ringerLines: s.ringerLines.filter((l) => l <= count) })),
    },
  };
}

export function setPortCount(plan: Plan, count: number): EditOutcome {
  if (!Number.isInteger(count) || count < 1 || count > 24) return refuse('A KSU has 1 to 24 station ports.');
  const used = plan.cables
    .flatMap((c) => [c.from, c.to])
    .filter((end) => end.part === plan.ksu.id)
    .map((end) => Number(/(\d+)$/.exec(end.port)?.[1] ?? 0));
  const highest = Math.max(0, ...used);
  if (count < highest) return refuse(`Station port ${highest} is cabled: unplug it first.`);
  const wired = Math.max(0, ...(plan.ksu.crossConnect ?? []).map((cc) => cc.port));
  if (count < wired) return refuse(`Station port ${wired} has a cross-connect: change that first.`);
  return {
    ok: true,
    label: `Set ${plan.ksu.name} to ${count} station ports`,
    plan: { ...plan, ksu: { ...plan.ksu, ports: count } },
  };
}

export function addStation(plan: Plan, code: string, label: string): EditOutcome {
  if (!/^[0-9]{1,4}$/.test(code)) return refuse('An intercom code is one to four digits.');
  if (plan.ksu.stations.some((s) => s.code === code)) return refuse(`Code ${code} is already in use.`);
  if (plan.ksu.stations.length >= MAX.stations)
    return refuse(`A KSU takes at most ${MAX.stations} intercom stations.`);
  const id = nextId(plan, 'station');
  const station = { id, code, label: label.trim().slice(0, 40).trim() };
  return {
    ok: true,
    id,
    label: `Add intercom station ${code}`,
    plan: { ...plan, ksu: { ...plan.ksu, stations: [...plan.ksu.stations, station] } },
  };
}

/** Sets meant to answer the station lose that assignment; a station whose buzzer is cross-connected stays. */
export function removeStation(plan: Plan, stationId: string): EditOutcome {
  const station = plan.ksu.stations.find((s) => s.id === stationId);
  if (!station) return refuse('That intercom station is not on the KSU.');
  const wired = (plan.ksu.crossConnect ?? []).find(
    (cc) => cc.lead.kind === 'buzzer' && cc.lead.station === stationId,
  );
  if (wired)
    return refuse(
      `Station ${station.code}'s buzzer is cross-connected on station port ${wired.port}: change that first.`,
    );
  return {
    ok: true,
    label: `Remove intercom station ${station.code}`,
    plan: {
      ...plan,
      ksu: { ...plan.ksu, stations: plan.ksu.stations.filter((s) => s.id !== stationId) },
      sets: plan.sets.map((s) => (s.station === stationId ? { ...s, station: undefined } : s)),
    },
  };
}

/**
 * The engine's `applyCure`. The Cure panel passes it in: it lives with the search, which the Bench's first load
 * leaves out (the search itself runs in the worker).
 */
export type CureApplier = (plan: Plan, result: CureResult) => Plan;

/** Applying a cure is one edit, like any other. */
export function applyCure(plan: Plan, result: CureResult, withCure: CureApplier): EditOutcome {
  const n = result.changes.length;
  return {
    ok: true,
    label: `Apply cure (${n} change${n === 1 ? '' : 's'})`,
    plan: withCure(plan, result),
  };
}

/**
 * Splice a new add-on into a set's cable: the set's cord now plugs into the add-on's jack, and the cable that
 * left the set leaves the add-on's plug instead, to wherever it went. One edit, so one undo takes it all back.
 * A set with nothing on its cord just gets the add-on on it.
 */
export function spliceAddOn(plan: Plan, template: string, setId: string, position: Position): EditOutcome {
  const added = addAddOn(plan, template, setId, position);
  if (!added.ok || !added.id) return added;
  const t = getTemplate(template);
  const plug = t?.ports.find((p) => p.gender === 'plug')?.name;
  const jack = t?.ports.find((p) => p.gender === 'jack')?.name;
  const cord = getTemplate(plan.sets.find((s) => s.id === setId)?.template ?? '')?.ports.find(
    (p) => p.gender === 'plug',
  )?.name;
  if (!plug || !jack || !cord) return refuse('This add-on has no plug and jack to splice with.');
  if (plan.cables.length >= MAX.cables) return refuse(`A plan takes at most ${MAX.cables} cables.`);
  const id = added.id;
  const onCord = (end: PortRef) => end.part === setId && end.port === cord;
  const bridged = added.plan.cables.map((c) =>
    onCord(c.from)
      ? { ...c, from: { part: id, port: plug } }
      : onCord(c.to)
        ? { ...c, to: { part: id, port: plug } }
        : c,
  );
  const next: Plan = {
    ...added.plan,
    cables: [
      ...bridged,
      { id: nextId(added.plan, 'cable'), from: { part: setId, port: cord }, to: { part: id, port: jack } },
    ],
  };
  const outcome = unlessNewIssues(
    plan,
    next,
    `Splice ${t?.title ?? 'add-on'} into ${partName(plan, setId)}'s cable`,
  );
  return outcome.ok ? { ...outcome, id } : outcome;
}
