/**
 * Planting faults in a plan and carrying out a repair: both are pure transformations of the plan document.
 * A fault that does not fit the plan (unknown part, nothing to undo) is reported as a problem, never thrown.
 */
import {
  cure,
  effectiveCrossConnect,
  validatePlan,
  type CrossConnect,
  type KsuLead,
  type LeadChange,
  type Plan,
  type WiringFault,
} from '../engine/index';
import type { PlantedFault, RepairStep } from './puzzle.schema';

export type Transformed = { ok: true; plan: Plan } | { ok: false; problem: string };

type LeadOwner = { id: string; name: string; leadChanges: LeadChange[] };

function leadOwner(plan: Plan, id: string): LeadOwner | undefined {
  return plan.sets.find((s) => s.id === id) ?? plan.addOns.find((a) => a.id === id);
}

function withLeadChanges(plan: Plan, id: string, edit: (changes: LeadChange[]) => LeadChange[]): Plan {
  return {
    ...plan,
    sets: plan.sets.map((s) => (s.id === id ? { ...s, leadChanges: edit(s.leadChanges) } : s)),
    addOns: plan.addOns.map((a) => (a.id === id ? { ...a, leadChanges: edit(a.leadChanges) } : a)),
  };
}

function withCrossConnect(plan: Plan, port: number, pair: number, lead: KsuLead | null): Plan {
  const rest = effectiveCrossConnect(plan.ksu).filter((c) => !(c.port === port && c.pair === pair));
  const crossConnect: CrossConnect[] = lead ? [...rest, { port, pair, lead }] : rest;
  crossConnect.sort((a, b) => a.port - b.port || a.pair - b.pair);
  return { ...plan, ksu: { ...plan.ksu, crossConnect } };
}

function withCableEnd(plan: Plan, cable: string, end: 'from' | 'to', part: string, port: string): Plan {
  return {
    ...plan,
    cables: plan.cables.map((c) => (c.id === cable ? { ...c, [end]: { part, port } } : c)),
  };
}

const touches = (c: LeadChange, pair: number) => c.pair === pair;

type CableFault = Extract<PlantedFault, { kind: 'split-pair' | 'reversed-pair' | 'open-conductor' }>;

function withCableFaults(plan: Plan, cable: string, edit: (faults: WiringFault[]) => WiringFault[]): Plan {
  return {
    ...plan,
    cables: plan.cables.map((c) => {
      if (c.id !== cable) return c;
      const faults = edit(c.faults ?? []);
      const { faults: _old, ...rest } = c;
      return faults.length ? { ...rest, faults } : rest;
    }),
  };
}

/** The plan document's form of a planted wiring fault (the same fields, without the cable). */
function wiringFault(fault: CableFault): WiringFault {
  const { cable: _cable, ...rest } = fault;
  return rest;
}

const wiringTouches = (f: WiringFault, pair: number) =>
  f.pair === pair || (f.kind === 'split-pair' && f.withPair === pair);

/** The plan once the fault is planted. */
export function plantFault(plan: Plan, fault: PlantedFault): Transformed {
  switch (fault.kind) {
    case 'lead-left-on': {
      const owner = leadOwner(plan, fault.part);
      if (!owner) return { ok: false, problem: `No set or add-on "${fault.part}" in the plan` };
      if (!owner.leadChanges.some((c) => c.kind === 'lift' && touches(c, fault.pair)))
        return { ok: false, problem: `${owner.name} has no lifted lead on pair ${fault.pair} to leave on` };
      return {
        ok: true,
        plan: withLeadChanges(plan, fault.part, (cs) => cs.filter((c) => !touches(c, fault.pair))),
      };
    }
    case 'lead-wrongly-lifted': {
      const owner = leadOwner(plan, fault.part);
      if (!owner) return { ok: false, problem: `No set or add-on "${fault.part}" in the plan` };
      if (owner.leadChanges.some((c) => touches(c, fault.pair)))
        return { ok: false, problem: `${owner.name} already has a lead change on pair ${fault.pair}` };
      const lift: LeadChange = { kind: 'lift', pair: fault.pair, conductor: fault.conductor };
      return { ok: true, plan: withLeadChanges(plan, fault.part, (cs) => [...cs, lift]) };
    }
    case 'cross-connect-wrong':
      if (fault.port > plan.ksu.ports) return { ok: false, problem: `The KSU has no station port ${fault.port}` };
      return { ok: true, plan: withCrossConnect(plan, fault.port, fault.pair, fault.lead) };
    case 'wrong-set-fitted': {
      if (!plan.sets.some((s) => s.id === fault.part))
        return { ok: false, problem: `No set "${fault.part}" in the plan` };
      const next = {
        ...plan,
        sets: plan.sets.map((s) => (s.id === fault.part ? { ...s, template: fault.template } : s)),
      };
      return checked(next);
    }
    case 'cable-wrong-port':
      if (!plan.cables.some((c) => c.id === fault.cable))
        return { ok: false, problem: `No cable "${fault.cable}" in the plan` };
      return checked(withCableEnd(plan, fault.cable, fault.end, fault.part, fault.port));
    case 'split-pair':
    case 'reversed-pair':
    case 'open-conductor':
      if (!plan.cables.some((c) => c.id === fault.cable))
        return { ok: false, problem: `No cable "${fault.cable}" in the plan` };
      return checked(withCableFaults(plan, fault.cable, (fs) => [...fs, wiringFault(fault)]));
  }
}

/** With `paths` the problem names where in the document it is (for instructors); without, only what is wrong. */
function checked(plan: Plan, paths = true): Transformed {
  const result = validatePlan(plan);
  if (result.ok) return { ok: true, plan: result.plan };
  return {
    ok: false,
    problem: result.issues.map((i) => (paths ? `${i.path}: ${i.message}` : i.message)).join('; '),
  };
}

/** Applies every fault in order; the first one that does not fit stops it. */
export function plantFaults(plan: Plan, faults: readonly PlantedFault[]): Transformed {
  let current = plan;
  for (const [i, fault] of faults.entries()) {
    const next = plantFault(current, fault);
    if (!next.ok) return { ok: false, problem: `Fault ${i + 1}: ${next.problem}` };
    current = next.plan;
  }
  return { ok: true, plan: current };
}

export function applyRepairStep(plan: Plan, step: RepairStep): Transformed {
  switch (step.kind) {
    case 'lead': {
      if (!leadOwner(plan, step.part)) return { ok: false, problem: `No set or add-on "${step.part}"` };
      const next = withLeadChanges(plan, step.part, (cs) => [
        ...cs.filter((c) => !touches(c, step.change.pair)),
        step.change,
      ]);
      return checked(next, false);
    }
    case 'restore':
      if (!leadOwner(plan, step.part)) return { ok: false, problem: `No set or add-on "${step.part}"` };
      return { ok: true, plan: withLeadChanges(plan, step.part, (cs) => cs.filter((c) => !touches(c, step.pair))) };
    case 'cross-connect':
      if (step.port > plan.ksu.ports) return { ok: false, problem: `The KSU has no station port ${step.port}` };
      return checked(withCrossConnect(plan, step.port, step.pair, step.lead), false);
    case 'replug':
      if (!plan.cables.some((c) => c.id === step.cable)) return { ok: false, problem: `No cable "${step.cable}"` };
      return checked(withCableEnd(plan, step.cable, step.end, step.part, step.port), false);
    case 'cable-pair':
      if (!plan.cables.some((c) => c.id === step.cable)) return { ok: false, problem: `No cable "${step.cable}"` };
      return { ok: true, plan: withCableFaults(plan, step.cable, (fs) => fs.filter((f) => !wiringTouches(f, step.pair))) };
  }
}

export function applyRepair(plan: Plan, steps: readonly RepairStep[]): Transformed {
  let current = plan;
  for (const [i, step] of steps.entries()) {
    const next = applyRepairStep(current, step);
    if (!next.ok) return { ok: false, problem: `Step ${i + 1}: ${next.problem}` };
    current = next.plan;
  }
  return { ok: true, plan: current };
}

/** Where a fault sits, in the terms a diagnosis uses (a replugged cable is named by the part at its other end). */
export function faultLocation(plan: Plan, fault: PlantedFault): { part: string; pair: number | null } {
  switch (fault.kind) {
    case 'lead-left-on':
    case 'lead-wrongly-lifted':
      return { part: fault.part, pair: fault.pair };
    case 'cross-connect-wrong':
      return { part: 'ksu', pair: fault.pair };
    case 'wrong-set-fitted':
      return { part: fault.part, pair: null };
    case 'cable-wrong-port': {
      const cable = plan.cables.find((c) => c.id === fault.cable);
      const other = cable ? cable[fault.end === 'from' ? 'to' : 'from'].part : fault.cable;
      return { part: other, pair: null };
    }
    case 'split-pair':
    case 'reversed-pair':
    case 'open-conductor':
      return { part: cableSet(plan, fault.cable, fault.end), pair: fault.pair };
  }
}

/** The set (or add-on) a cable serves, named by a diagnosis; the part at the faulty end when neither end is one. */
function cableSet(plan: Plan, cable: string, end: 'from' | 'to'): string {
  const c = plan.cables.find((x) => x.id === cable);
  if (!c) return cable;
  const isUnit = (id: string) => plan.sets.some((s) => s.id === id) || plan.addOns.some((a) => a.id === id);
  return [c.to.part, c.from.part].find(isUnit) ?? c[end].part;
}

function partName(plan: Plan, id: string): string {
  if (id === plan.ksu.id || id === 'ksu') return plan.ksu.name;
  return (
    [...plan.sets, ...plan.addOns, ...plan.adapters].find((p) => p.id === id)?.name ??
    plan.cables.find((c) => c.id === id)?.label ??
    id
  );
}

function describeKsuLead(plan: Plan, lead: KsuLead | null): string {
  if (!lead) return 'nothing';
  if (lead.kind === 'buzzer') {
    const station = plan.ksu.stations.find((s) => s.id === lead.station);
    return `the buzzer output of station ${station?.code ?? lead.station}`;
  }
  const what = { 'line-talk': 'talk pair', 'line-a': 'A-lead pair', 'line-lamp': 'lamp pair', 'line-a-lamp': 'A and lamp leads' };
  return `line ${lead.line}'s ${what[lead.kind]}`;
}

/** One sentence for the explanation, named against the healthy plan. */
export function describeFault(plan: Plan, fault: PlantedFault): string {
  switch (fault.kind) {
    case 'lead-left-on':
      return `${partName(plan, fault.part)}: pair ${fault.pair} should have been lifted and was left on its terminals.`;
    case 'lead-wrongly-lifted':
      return `${partName(plan, fault.part)}: pair ${fault.pair} (${fault.conductor === 'both' ? 'both leads' : fault.conductor}) was lifted although it is needed.`;
    case 'cross-connect-wrong':
      return `KSU port ${fault.port}, pair ${fault.pair} was cross-connected to ${describeKsuLead(plan, fault.lead)}.`;
    case 'wrong-set-fitted':
      return `${partName(plan, fault.part)} was fitted as a different set (${fault.template}) from the one planned.`;
    case 'cable-wrong-port':
      return `${partName(plan, fault.cable)} was plugged into ${partName(plan, fault.part)}, port ${fault.port}.`;
    case 'split-pair':
      return `${cableWords(plan, fault.cable)}: at the ${endWords(plan, fault.cable, fault.end)} the ${fault.conductor} of pair ${fault.pair} was terminated on pair ${fault.withPair} and the other way round (split pair).`;
    case 'reversed-pair':
      return `${cableWords(plan, fault.cable)}: at the ${endWords(plan, fault.cable, fault.end)} tip and ring of pair ${fault.pair} were swapped.`;
    case 'open-conductor':
      return `${cableWords(plan, fault.cable)}: the ${fault.conductor} of pair ${fault.pair} was broken near the ${endWords(plan, fault.cable, fault.end)}.`;
  }
}

function cableWords(plan: Plan, cable: string): string {
  const c = plan.cables.find((x) => x.id === cable);
  return c ? `The cable from ${partName(plan, c.from.part)} to ${partName(plan, c.to.part)}` : `Cable ${cable}`;
}

function endWords(plan: Plan, cable: string, end: 'from' | 'to'): string {
  const c = plan.cables.find((x) => x.id === cable);
  return c ? `${partName(plan, c[end].part)} end` : `${end} end`;
}

export function describeRepairStep(plan: Plan, step: RepairStep): string {
  switch (step.kind) {
    case 'lead':
      return step.change.kind === 'lift'
        ? `${partName(plan, step.part)}: lift pair ${step.change.pair} (${step.change.conductor === 'both' ? 'both leads' : step.change.conductor})`
        : `${partName(plan, step.part)}: move pair ${step.change.pair} to spare pair ${step.change.toPair}`;
    case 'restore':
      return `${partName(plan, step.part)}: put pair ${step.pair} back on its terminals`;
    case 'cross-connect':
      return `KSU port ${step.port}, pair ${step.pair}: cross-connect ${describeKsuLead(plan, step.lead)}`;
    case 'replug':
      return `Plug ${partName(plan, step.cable)} into ${partName(plan, step.part)}, port ${step.port}`;
    case 'cable-pair':
      return `${cableWords(plan, step.cable)}: re-terminate pair ${step.pair} at both ends`;
  }
}

/**
 * The repair that undoes the faults, for the puzzle maker to start from: lift what was left on, put back what was
 * lifted, restore the cross-connect entry and the cable end, re-terminate a faulty cable pair; a wrong set gets the
 * engine's cure for it.
 */
export function undoingRepair(plan: Plan, faults: readonly PlantedFault[]): RepairStep[] {
  const healthy = effectiveCrossConnect(plan.ksu);
  return faults.flatMap((fault): RepairStep[] => {
    switch (fault.kind) {
      case 'lead-left-on': {
        const lift = leadOwner(plan, fault.part)?.leadChanges.find((c) => c.kind === 'lift' && c.pair === fault.pair);
        return lift ? [{ kind: 'lead', part: fault.part, change: lift }] : [];
      }
      case 'lead-wrongly-lifted':
        return [{ kind: 'restore', part: fault.part, pair: fault.pair }];
      case 'cross-connect-wrong': {
        const entry = healthy.find((c) => c.port === fault.port && c.pair === fault.pair);
        return [{ kind: 'cross-connect', port: fault.port, pair: fault.pair, lead: entry?.lead ?? null }];
      }
      case 'cable-wrong-port': {
        const cable = plan.cables.find((c) => c.id === fault.cable);
        return cable ? [{ kind: 'replug', cable: fault.cable, end: fault.end, ...cable[fault.end] }] : [];
      }
      case 'split-pair':
      case 'reversed-pair':
      case 'open-conductor':
        return [{ kind: 'cable-pair', cable: fault.cable, pair: fault.pair }];
      case 'wrong-set-fitted': {
        const planted = plantFault(plan, fault);
        if (!planted.ok) return [];
        return cure(planted.plan).changes.flatMap((c): RepairStep[] => [
          { kind: 'lead', part: c.part, change: c.change },
          ...(c.crossConnect ? [{ kind: 'cross-connect' as const, ...c.crossConnect }] : []),
        ]);
      }
    }
  });
}
