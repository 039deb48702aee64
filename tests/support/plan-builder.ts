/**
 * A few-line way to write a plan in tests:
 *   const b = planBuilder();
 *   const ksu = b.ksu({ lines: 5, stations: 2 });
 *   const a = b.set('six-key-hf', 'Front');
 *   const ad = b.adapter();
 *   b.cable(ksu.port(1), ad.plug);
 *   b.cable(ad.jack(1), a.cord);
 *   const plan = b.build();
 * Ids are slugs of the names ("Front" → "front"); directory numbers are 555-01xx for line xx.
 */
import {
  PlanSchema,
  type CrossConnect,
  type LeadChange,
  type Plan,
  type PlanInput,
  type PortRef,
} from '../../shared/engine/document/plan.schema';
import { applyAction, initialState, type SimAction, type SimState } from '../../shared/engine/index';

export interface KsuOptions {
  lines?: number;
  stations?: number;
  ports?: number;
  crossConnect?: CrossConnect[];
  name?: string;
}

export interface SetOptions {
  id?: string;
  station?: string;
  ringerLines?: number[];
  leadChanges?: LeadChange[];
}

export interface KsuHandle {
  id: string;
  /** Intercom station ids, in order: "st-21", "st-22", … */
  stations: string[];
  port(n: number): PortRef;
}
export interface SetHandle {
  id: string;
  cord: PortRef;
}
export interface AddOnHandle {
  id: string;
  cord: PortRef;
  /** The pass-through jack a set can plug into. */
  jack: PortRef;
}
export interface AdapterHandle {
  id: string;
  plug: PortRef;
  jack(n: number): PortRef;
}

export function slug(name: string): string {
  const s = name
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '');
  return /^[a-z]/.test(s) ? s.slice(0, 40) : `p-${s}`.slice(0, 40);
}

export function directoryNumber(line: number): string {
  return `55501${String(line).padStart(2, '0')}`;
}

export function planBuilder(name = 'Test plan') {
  const doc: PlanInput = {
    version: 1,
    name,
    ksu: { id: 'ksu', name: 'KSU', lines: [{ number: 1, directoryNumber: directoryNumber(1) }] },
    sets: [],
    addOns: [],
    adapters: [],
    cables: [],
  };
  const used = new Set<string>(['ksu']);
  const unique = (base: string): string => {
    let id = base;
    for (let n = 2; used.has(id); n++) id = `${base}-${n}`;
    used.add(id);
    return id;
  };
  let x = 0;
  const nextPosition = () => ({ x: (x += 250), y: 0 });

  return {
    ksu(opts: KsuOptions = {}): KsuHandle {
      const lines = opts.lines ?? 5;
      const stationIds = Array.from({ length: opts.stations ?? 0 }, (_, i) => `st-${21 + i}`);
      doc.ksu = {
        id: 'ksu',
        name: opts.name ?? 'KSU',
        lines: Array.from({ length: lines }, (_, i) => ({
          number: i + 1,
          directoryNumber: directoryNumber(i + 1),
        })),
        stations: stationIds.map((id, i) => ({ id, code: String(21 + i) })),
        ports: opts.ports ?? 4,
        crossConnect: opts.crossConnect,
        position: { x: 0, y: 0 },
      };
      return { id: 'ksu', stations: stationIds, port: (n) => ({ part: 'ksu', port: `port-${n}` }) };
    },
    set(template: string, setName: string, opts: SetOptions = {}): SetHandle {
      const id = opts.id ?? unique(slug(setName));
      used.add(id);
      doc.sets!.push({
        id,
        name: setName,
        template,
        station: opts.station,
        ringerLines: opts.ringerLines ?? [],
        leadChanges: opts.leadChanges ?? [],
        position: nextPosition(),
      });
      return { id, cord: { part: id, port: 'cord' } };
    },
    addOn(serves: SetHandle | string, addOnName = 'Hands-free', template = 'hands-free-unit'): AddOnHandle {
      const id = unique(slug(addOnName));
      doc.addOns!.push({
        id,
        name: addOnName,
        template,
        serves: typeof serves === 'string' ? serves : serves.id,
        position: nextPosition(),
      });
      return { id, cord: { part: id, port: 'cord' }, jack: { part: id, port: 'set' } };
    },
    adapter(template = 'bridging-adapter', adapterName = 'Adapter'): AdapterHandle {
      const id = unique(slug(adapterName));
      doc.adapters!.push({ id, name: adapterName, template, position: nextPosition() });
      return { id, plug: { part: id, port: 'plug' }, jack: (n) => ({ part: id, port: `jack-${n}` }) };
    },
    cable(from: PortRef, to: PortRef, id?: string): string {
      const cableId = id ?? unique(`c${doc.cables!.length + 1}`);
      doc.cables!.push({ id: cableId, from, to });
      return cableId;
    },
    /** The raw document, for tests that break it on purpose. */
    input(): PlanInput {
      return structuredClone(doc);
    },
    build(): Plan {
      return PlanSchema.parse(structuredClone(doc));
    },
  };
}

/** Sets on one station cable through one bridging adapter (KSU port 1 → adapter plug → jack n ← set n). */
export function setsOnOneCable(
  templates: [string, string],
  opts: {
    names?: [string, string];
    lines?: number;
    stations?: number;
    sets?: [SetOptions?, SetOptions?];
  } = {},
) {
  const b = planBuilder();
  const ksu = b.ksu({ lines: opts.lines ?? 5, stations: opts.stations ?? 2 });
  const [nameA, nameB] = opts.names ?? ['Front', 'Back'];
  const a = b.set(templates[0], nameA, opts.sets?.[0]);
  const c = b.set(templates[1], nameB, opts.sets?.[1]);
  const ad = b.adapter();
  b.cable(ksu.port(1), ad.plug);
  b.cable(ad.jack(1), a.cord);
  b.cable(ad.jack(2), c.cord);
  return { plan: b.build(), a: a.id, b: c.id, ksu, builder: b };
}

/** The three last-pair lifts that take a hands-free wired set's own circuits off the cable. */
export const LIFT_LAST_THREE_PAIRS: LeadChange[] = [
  { kind: 'lift', pair: 23, conductor: 'both' },
  { kind: 'lift', pair: 24, conductor: 'both' },
  { kind: 'lift', pair: 25, conductor: 'both' },
];

/** Apply actions in order, from the initial state unless one is given. */
export function operate(plan: Plan, actions: SimAction[], from?: SimState): SimState {
  return actions.reduce((state, action) => applyAction(plan, state, action), from ?? initialState(plan));
}
