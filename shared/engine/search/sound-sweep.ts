/**
 * The default sweep: every state, up to the symmetry of interchangeable sets. Sets that are the same part wired to
 * the same nets (same template, lead changes, ringer straps, station and add-ons, every lead on the same static net)
 * can trade places without changing anything the evaluation reads, so only one ordering of their positions is
 * visited and each finding stands for its images under those trades. Argument: ./README.md ("Sound sweep").
 */
import { countWords, getNetlist, type Plan } from './engine-port';
import { proveClean } from './clean-proof';
import { planSweep, sweepEvents, type Planned, type SweepOptions } from './sweep';

/** Largest number of states (mechanical combinations × KSU events) the default sweep visits. */
export const SOUND_STATE_LIMIT = 4_000_000;

/** Interchangeable sets are grouped at most this many at a time (their permutations are listed). */
const MAX_GROUP = 6;

interface NetsOfParts {
  /** Per static net (root terminal): the parts with a terminal on it. */
  partsOn: Map<number, Set<number>>;
  /** Per part (index): its lead edges as [edge index, static net of the cord pin], in edge order. */
  leadsOf: Map<number, [number, number][]>;
}

const partsCache = new WeakMap<Plan, NetsOfParts>();

/** Where each part's terminals and leads land, in one pass over the netlist. */
function netsOfParts(plan: Plan): NetsOfParts {
  let out = partsCache.get(plan);
  if (!out) {
    const nl = getNetlist(plan);
    const partsOn = new Map<number, Set<number>>();
    nl.terminals.forEach((t, i) => {
      const root = nl.staticRoot[i];
      let parts = partsOn.get(root);
      if (!parts) partsOn.set(root, (parts = new Set()));
      parts.add(t.part);
    });
    const leadsOf = new Map<number, [number, number][]>();
    nl.edges.forEach((e, i) => {
      if (e.kind !== 'lead') return;
      const owner = nl.terminals[e.a].part;
      let list = leadsOf.get(owner);
      if (!list) leadsOf.set(owner, (list = []));
      list.push([i, nl.staticRoot[e.b]]);
    });
    out = { partsOn, leadsOf };
    partsCache.set(plan, out);
  }
  return out;
}

/** A description of everything about a set (and the add-ons serving it) that the netlist is built from. */
function partSignature(plan: Plan, setIndex: number): string | null {
  const nl = getNetlist(plan);
  const set = plan.sets[setIndex];
  const info = nl.sets[setIndex];
  const addOns = plan.addOns.filter((a) => a.serves === set.id);
  // Where every lead of the set and its add-ons lands: the static net of the cord pin it is wired to.
  const parts = [info.part, ...addOns.map((a) => nl.partById.get(a.id)?.index ?? -1)];
  if (parts.includes(-1)) return null;
  const { partsOn, leadsOf } = netsOfParts(plan);
  // The lead edges of these parts in edge order, each as (which of the parts, net).
  const leads: [number, number, number][] = [];
  parts.forEach((part, k) => {
    for (const [edge, root] of leadsOf.get(part) ?? []) leads.push([edge, k, root]);
  });
  if (parts.length > 1) leads.sort((x, y) => x[0] - y[0]);
  const landing: number[] = [];
  for (const [, k, root] of leads) {
    // A pin whose net reaches no other part is the set's own: it cannot be traded with another set's.
    if ((partsOn.get(root)?.size ?? 0) < 2) return null;
    landing.push(k, root);
  }
  return JSON.stringify([
    set.template,
    set.station ?? null,
    [...set.ringerLines].sort((a, b) => a - b),
    set.leadChanges,
    addOns.map((a) => [a.template, a.leadChanges]),
    landing,
  ]);
}

/** Groups of interchangeable sets (indices, ascending), each of two to MAX_GROUP sets. */
export function interchangeableSets(plan: Plan): number[][] {
  const bySignature = new Map<string, number[]>();
  plan.sets.forEach((_, i) => {
    const sig = partSignature(plan, i);
    if (sig === null) return;
    bySignature.set(sig, [...(bySignature.get(sig) ?? []), i]);
  });
  const out: number[][] = [];
  for (const members of bySignature.values()) {
    for (let i = 0; i < members.length; i += MAX_GROUP) {
      const chunk = members.slice(i, i + MAX_GROUP);
      if (chunk.length > 1) out.push(chunk);
    }
  }
  return out;
}

function binomial(n: number, k: number): number {
  let r = 1;
  for (let i = 1; i <= k; i++) r = (r * (n - k + i)) / i;
  return Math.round(r);
}

function permutations(xs: readonly number[]): number[][] {
  if (xs.length <= 1) return [xs.slice()];
  const out: number[][] = [];
  xs.forEach((x, i) => {
    for (const rest of permutations([...xs.slice(0, i), ...xs.slice(i + 1)])) out.push([x, ...rest]);
  });
  return out;
}

/** The default sweep's plan: every combination up to interchangeable sets, or the reduced sweep, marked partial. */
export function planSoundSweep(plan: Plan, opts: Pick<SweepOptions, 'events'> = {}): Planned {
  const exhaustive = planSweep(plan, { ...opts, strategy: 'exhaustive' });
  const { moves } = exhaustive;
  const n = moves.length;
  const groups = interchangeableSets(plan);
  // previous[i]: the group member before set i (its position index may not be smaller), or -1.
  const previous = new Array<number>(n).fill(-1);
  for (const g of groups) for (let k = 1; k < g.length; k++) previous[g[k]] = g[k - 1];
  const inGroup = new Set(groups.flat());
  let combinations = groups.reduce((p, g) => p * binomial(moves[g[0]].length + g.length - 1, g.length), 1);
  for (let i = 0; i < n; i++) if (!inGroup.has(i)) combinations *= moves[i].length;
  const events = sweepEvents(plan, opts.events).length;
  const ids = plan.sets.map((s) => s.id);
  const reduction = {
    symmetric: groups.map((g) => g.map((i) => ids[i])),
    exhaustiveCombinations: exhaustive.combinations,
  };

  if (combinations * events > SOUND_STATE_LIMIT) {
    // No state can show a state rule's finding: the idle state alone gives the wiring findings, complete.
    const proof = proveClean(plan, opts);
    if (proof.proven) {
      return {
        ...exhaustive,
        events: exhaustive.events.slice(0, 1),
        forEach: (visit) => void visit(new Array<number>(n).fill(0)),
        combinations: 1,
        withoutEvents: 0,
        total: 1,
        reduction,
        cleanProof: proof.words,
      };
    }
    const reduced = planSweep(plan, { ...opts, strategy: 'reduced' });
    return {
      ...reduced,
      reduction,
      incompleteReason:
        `Too large for a complete sweep: ${countWords(combinations)} combinations of set positions × ${events} ` +
        `KSU events (after trading interchangeable sets) is more than ${countWords(SOUND_STATE_LIMIT)} ` +
        'states. Shown: each set alone in every position with every event, and every two sets on one station port ' +
        `together; faults needing other sets together may be missing. ${proof.reason}`,
    };
  }

  const forEach = (visit: (combo: readonly number[]) => boolean): void => {
    const combo = new Array<number>(n).fill(0);
    const fill = (i: number): boolean => {
      if (i === n) return visit(combo);
      const from = previous[i] >= 0 ? combo[previous[i]] : 0;
      for (let m = from; m < moves[i].length; m++) {
        combo[i] = m;
        if (!fill(i + 1)) return false;
      }
      combo[i] = 0;
      return true;
    };
    fill(0);
  };

  // Every permutation within each group, as a map of set indices (identity first).
  let perms: number[][] = [Array.from({ length: n }, (_, i) => i)];
  for (const g of groups) {
    const next: number[][] = [];
    for (const base of perms) {
      for (const order of permutations(g)) {
        const p = base.slice();
        g.forEach((member, k) => (p[member] = order[k]));
        next.push(p);
      }
    }
    perms = next;
  }
  const images = (combo: readonly number[]) =>
    perms.map((perm) => {
      const image = new Array<number>(n);
      for (let i = 0; i < n; i++) image[perm[i]] = combo[i];
      return { combo: image, perm };
    });

  return {
    ...exhaustive,
    combinations,
    total: combinations * events,
    forEach,
    images: groups.length > 0 ? images : undefined,
    reduction,
  };
}
