/**
 * What a person at the sets can see and hear: lamps per key, tones in the handset, buzzer, ringer, switches.
 * Nothing about nets, leads, lines reached or findings. Used for the trainee's view and to compare plans by their
 * symptoms in a fixed list of probe states.
 */
import {
  actionProblem,
  applyAction,
  evaluate,
  getTemplate,
  initialState,
  type Cadence,
  type Plan,
  type SimAction,
  type SimState,
  type ToneName,
} from '../engine/index';

export interface SetSighting {
  set: string;
  offHook: boolean;
  pressedKey: number | null;
  handsFreeOn: boolean;
  keys: { index: number; label: string; lamp: Cadence }[];
  /** Tones in the handset, one entry per tone heard (two dial tones are two entries). */
  tones: ToneName[];
  buzzer: boolean;
  ringer: boolean;
  /** Hum or another circuit heard faintly in the handset (a line it hears runs over a split pair). */
  hum: boolean;
}

export interface Sighting {
  sets: SetSighting[];
}

export function sightingOf(plan: Plan, state: SimState): Sighting {
  const evaluation = evaluate(plan, state, { paths: false });
  const noisy = new Set(evaluation.lines.filter((l) => (l.noise?.length ?? 0) > 0).map((l) => l.line));
  return {
    sets: evaluation.sets.map((s) => ({
      set: s.set,
      offHook: s.offHook,
      pressedKey: s.pressedKey,
      handsFreeOn: s.handsFreeOn,
      keys: s.keys.map((k) => ({ index: k.index, label: k.label, lamp: k.lamp })),
      tones: s.tones.map((t) => t.tone).sort(),
      buzzer: s.buzzer,
      ringer: s.ringer,
      hum: s.hears.some((line) => noisy.has(line)),
    })),
  };
}

export interface Probe {
  name: string;
  actions: SimAction[];
}

function lineKeys(plan: Plan, setId: string): { key: number; line: number }[] {
  const set = plan.sets.find((s) => s.id === setId);
  const keys = set ? (getTemplate(set.template)?.keys ?? []) : [];
  const onKsu = new Set(plan.ksu.lines.map((l) => l.number));
  return keys
    .filter((k) => k.kind === 'line' && k.line !== undefined && onKsu.has(k.line))
    .map((k) => ({ key: k.index, line: k.line! }));
}

/**
 * The probe states: every set on every line key (talking and held), hands-free on, every line rung, every station
 * called, and two sets off-hook on different lines. Built from the healthy plan so both plans get the same list.
 */
export function probes(plan: Plan): Probe[] {
  const out: Probe[] = [{ name: 'idle', actions: [] }];
  for (const set of plan.sets) {
    for (const { key } of lineKeys(plan, set.id)) {
      const talk: SimAction[] = [
        { kind: 'press-key', set: set.id, key },
        { kind: 'lift-handset', set: set.id },
      ];
      out.push({ name: `${set.id} key ${key}`, actions: talk });
      out.push({ name: `${set.id} key ${key} held`, actions: [...talk, { kind: 'press-hold', set: set.id }] });
      if (plan.addOns.some((a) => a.serves === set.id))
        out.push({
          name: `${set.id} key ${key} hands-free`,
          actions: [talk[0], { kind: 'hands-free', set: set.id, on: true }],
        });
    }
    if (lineKeys(plan, set.id).length === 0)
      out.push({ name: `${set.id} off-hook`, actions: [{ kind: 'lift-handset', set: set.id }] });
  }
  for (const line of plan.ksu.lines) out.push({ name: `ring ${line.number}`, actions: [{ kind: 'ring-line', line: line.number }] });
  for (const station of plan.ksu.stations)
    out.push({ name: `call ${station.code}`, actions: [{ kind: 'intercom-call', station: station.id }] });
  for (let i = 0; i < plan.sets.length; i++) {
    for (let j = i + 1; j < plan.sets.length; j++) {
      const [a, b] = [lineKeys(plan, plan.sets[i].id), lineKeys(plan, plan.sets[j].id)];
      if (!a.length || b.length < 2) continue;
      out.push({
        name: `${plan.sets[i].id} and ${plan.sets[j].id} on two lines`,
        actions: [
          { kind: 'press-key', set: plan.sets[i].id, key: a[0].key },
          { kind: 'lift-handset', set: plan.sets[i].id },
          { kind: 'press-key', set: plan.sets[j].id, key: b[1].key },
          { kind: 'lift-handset', set: plan.sets[j].id },
        ],
      });
    }
  }
  return out;
}

/** The state after the probe's actions, or null when an action does not fit this plan (a key it lacks). */
export function probeState(plan: Plan, probe: Probe): SimState | null {
  let state = initialState(plan);
  for (const action of probe.actions) {
    if (actionProblem(plan, action)) return null;
    state = applyAction(plan, state, action);
  }
  return state;
}

export function probeSighting(plan: Plan, probe: Probe): string {
  const state = probeState(plan, probe);
  return state ? JSON.stringify(sightingOf(plan, state)) : 'action refused';
}

/** Names of the probes in which what people at the sets see differs between two plans. */
export function differingProbes(reference: Plan, other: Plan, list: Probe[] = probes(reference)): string[] {
  return list.filter((p) => probeSighting(reference, p) !== probeSighting(other, p)).map((p) => p.name);
}
