/**
 * Per-state connectivity: union the closed contacts over the static components. This is the hot path of
 * sweeps, so it allocates nothing: the result lives in the netlist's scratch buffer until the next call.
 */
import {
  COND_HANDS_FREE,
  COND_KEY,
  COND_NOT_HOLD,
  COND_OFF_HOOK,
  type ContactInfo,
  type Netlist,
} from './netlist';

/** The mechanical state of every set, indexed like netlist.sets. pressedKey 0 = no key latched. */
export interface Mech {
  offHook: Uint8Array;
  pressedKey: Int32Array;
  holdDown: Uint8Array;
  handsFreeOn: Uint8Array;
}

export function createMech(nl: Netlist): Mech {
  const n = nl.sets.length;
  return {
    offHook: new Uint8Array(n),
    pressedKey: new Int32Array(n),
    holdDown: new Uint8Array(n),
    handsFreeOn: new Uint8Array(n),
  };
}

/** What the model reads of an operating state: each set's hookswitch, latched key and hands-free switch, by set id. */
export interface SetPositions {
  sets: Readonly<
    Record<string, { offHook?: boolean; pressedKey?: number | null; handsFreeOn?: boolean } | undefined>
  >;
}

/** Copy a state's set positions into a Mech. holdBy: index of a set whose hold key is held down, or -1. */
export function fillMech(nl: Netlist, state: SetPositions, mech: Mech, holdBy = -1): Mech {
  for (const s of nl.sets) {
    const st = state.sets[s.id];
    mech.offHook[s.index] = st?.offHook ? 1 : 0;
    const key = st?.pressedKey ?? 0;
    mech.pressedKey[s.index] = key > 0 && key < s.keyLine.length && s.keyLine[key] > 0 ? key : 0;
    mech.holdDown[s.index] = s.index === holdBy ? 1 : 0;
    mech.handsFreeOn[s.index] = st?.handsFreeOn ? 1 : 0;
  }
  return mech;
}

export function contactClosed(cond: number, mechIndex: number, key: number, mech: Mech): boolean {
  if (mechIndex < 0) return false;
  switch (cond) {
    case COND_KEY:
      return mech.pressedKey[mechIndex] === key;
    case COND_OFF_HOOK:
      return mech.offHook[mechIndex] === 1;
    case COND_NOT_HOLD:
      return mech.holdDown[mechIndex] === 0;
    case COND_HANDS_FREE:
      return mech.handsFreeOn[mechIndex] === 1;
    default:
      return false;
  }
}

export function isContactClosed(c: ContactInfo, mech: Mech): boolean {
  return contactClosed(c.cond, c.mech, c.key, mech);
}

/**
 * Returns root[d] for every dense component d: two terminals are on one net in this state exactly when
 * root[nl.dense[t1]] === root[nl.dense[t2]]. The array is reused by the next call.
 */
export function evaluateNets(nl: Netlist, mech: Mech): Int32Array {
  // The conditions as local constants: a hot loop reads them as immediates, not as imported bindings.
  const KEY = COND_KEY;
  const OFF_HOOK = COND_OFF_HOOK;
  const NOT_HOLD = COND_NOT_HOLD;
  const HANDS_FREE = COND_HANDS_FREE;
  const { offHook, pressedKey, holdDown, handsFreeOn } = mech;
  const parent = nl.work;
  const m = nl.denseCount;
  for (let i = 0; i < m; i++) parent[i] = i;
  const { ca, cb, cond, mech: owner, key, count } = nl.hot;
  for (let i = 0; i < count; i++) {
    // contactClosed, inlined
    const o = owner[i];
    if (o < 0) continue;
    const c = cond[i];
    if (
      c === KEY
        ? pressedKey[o] !== key[i]
        : c === OFF_HOOK
          ? offHook[o] !== 1
          : c === NOT_HOLD
            ? holdDown[o] !== 0
            : c !== HANDS_FREE || handsFreeOn[o] !== 1
    )
      continue;
    let a = ca[i];
    while (parent[a] !== a) a = parent[a] = parent[parent[a]];
    let b = cb[i];
    while (parent[b] !== b) b = parent[b] = parent[parent[b]];
    if (a !== b) parent[a] = b;
  }
  for (let i = 0; i < m; i++) {
    let r = i;
    while (parent[r] !== r) r = parent[r];
    parent[i] = r;
  }
  return parent;
}
