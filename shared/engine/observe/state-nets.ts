/** The nets of one mechanical state (sets' hookswitch, keys, hands-free switch): reusable across line states. */
import type { Plan } from '../document/plan.schema';
import { computeFacts, type NetFacts } from '../model/facts';
import { getNetlist, type Netlist } from '../model/netlist';
import { createMech, fillMech, type Mech } from '../model/nets';
import type { SimState } from '../sim/state.schema';

export interface StateNets {
  readonly mech: Mech;
  readonly facts: NetFacts;
}

export function computeNets(plan: Plan, state: SimState): StateNets {
  const nl = getNetlist(plan);
  const mech = fillMech(nl, state, createMech(nl));
  const facts = computeFacts(nl, mech);
  return { mech, facts: { ...facts, roots: facts.roots.slice() } };
}

/** A mechanical state buffer for computeNetsInto. */
export function createMechFor(plan: Plan): Mech {
  return createMech(getNetlist(plan));
}

/**
 * computeNets into a caller's buffer (from createMechFor), for loops that drop one state's nets before computing
 * the next (the sweep): the result's mech is that buffer, overwritten by the next call.
 */
export function computeNetsInto(plan: Plan, state: SimState, mech: Mech): StateNets {
  const nl = getNetlist(plan);
  fillMech(nl, state, mech);
  const facts = computeFacts(nl, mech);
  return { mech, facts: { ...facts, roots: facts.roots.slice() } };
}

const scratchMechs = new WeakMap<Netlist, Mech>();

/**
 * The nets of one state in the netlist's own buffers, for an evaluation that reads them before it returns and
 * keeps nothing of them (evaluate): the next call overwrites them.
 */
export function computeNetsScratch(plan: Plan, state: SimState): StateNets {
  const nl = getNetlist(plan);
  let mech = scratchMechs.get(nl);
  if (!mech) scratchMechs.set(nl, (mech = createMech(nl)));
  fillMech(nl, state, mech);
  return { mech, facts: computeFacts(nl, mech) };
}
