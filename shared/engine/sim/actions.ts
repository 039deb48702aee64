/**
 * Operating the installation: a user action gives a new state. The line circuits follow their A-leads and loops
 * (settle), the exchange follows the loops and the digits dialled.
 */
import type { Plan } from '../document/plan.schema';
import { getNetlist, type Netlist } from '../model/netlist';
import { createMech, fillMech } from '../model/nets';
import { computeFacts, selectedLines } from '../model/facts';
import type { FarState, LineState, SetState, SimAction, SimState } from './state.schema';

/** Digits that make a complete outside number when no line's directory number matches first. */
export const COMPLETE_NUMBER_LENGTH = 7;

const idleFar = (): FarState => ({ phase: 'idle', digits: '', calledNumber: null });

export function initialState(plan: Plan): SimState {
  const sets: Record<string, SetState> = {};
  for (const s of plan.sets) sets[s.id] = { offHook: false, pressedKey: null, handsFreeOn: false };
  return {
    sets,
    lines: plan.ksu.lines.map((l) => ({ line: l.number, circuit: 'idle', ringing: false, far: idleFar() })),
    intercom: { calling: null },
  };
}

/** Without the fields left undefined, as a JSON round trip would have it. */
function definedOnly<T extends object>(x: T): T {
  for (const k of Object.keys(x) as (keyof T)[]) if (x[k] === undefined) delete x[k];
  return x;
}

/** A line state the action may change, as its own copy (a line state holds plain values and its far end's). */
function copyLineState(s: LineState): LineState {
  return definedOnly({ ...s, far: s.far && definedOnly({ ...s.far }) });
}

/** A state completed with defaults for every set and line of the plan (for states written by hand). */
export function normaliseState(plan: Plan, state: SimState): SimState {
  const base = initialState(plan);
  for (const id of Object.keys(base.sets)) {
    const s = state.sets[id];
    if (s)
      base.sets[id] = {
        offHook: !!s.offHook,
        pressedKey: s.pressedKey ?? null,
        handsFreeOn: !!s.handsFreeOn,
      };
  }
  base.lines = base.lines.map((l) => {
    const s = state.lines.find((x) => x.line === l.line);
    return s ? copyLineState(s) : l;
  });
  base.intercom = { calling: state.intercom?.calling ?? null };
  return base;
}

function lineState(state: SimState, line: number): LineState | undefined {
  return state.lines.find((l) => l.line === line);
}

/** Bring the line circuits and the exchange in line with the nets. holdBy: set whose hold key is down. */
function settle(nl: Netlist, state: SimState, holdBy = -1): void {
  const mech = fillMech(nl, state, createMech(nl), holdBy);
  const facts = computeFacts(nl, mech);
  const holderLines = holdBy >= 0 ? selectedLines(nl, holdBy, mech) : [];
  nl.lines.forEach((info, i) => {
    const ls = lineState(state, info.number);
    if (!ls) return;
    const a = facts.aClosed[i];
    const loop = facts.networkLoop[i];
    if (ls.ringing && loop) answer(state, ls);
    if (a) {
      ls.circuit = 'in-use';
      delete ls.heldWithoutSelection;
    } else if (ls.circuit === 'in-use') {
      if (loop) {
        ls.circuit = 'held';
        if (!holderLines.includes(info.number)) ls.heldWithoutSelection = true;
      } else {
        ls.circuit = 'idle';
      }
    }
    const exchangeLoop = loop || ls.circuit === 'held';
    if (!exchangeLoop && ls.far.phase !== 'idle' && ls.far.phase !== 'incoming') ls.far = idleFar();
    if (exchangeLoop && ls.far.phase === 'idle') ls.far = { ...idleFar(), phase: 'dial-tone' };
  });
}

function answer(state: SimState, ls: LineState): void {
  ls.ringing = false;
  const own = ls.far.calledNumber;
  ls.far = { phase: 'answered', digits: '', calledNumber: own };
  // A call from one of our own lines: its caller stops hearing ringback.
  for (const other of state.lines) {
    if (other !== ls && other.far.phase === 'ringback' && own !== null && other.far.calledNumber === own) {
      other.far.phase = 'talking';
    }
  }
}

function dialOnto(plan: Plan, state: SimState, ls: LineState, digits: string): void {
  for (const digit of digits) {
    if (ls.far.phase === 'dial-tone') ls.far = { phase: 'dialling', digits: '', calledNumber: null };
    if (ls.far.phase !== 'dialling') return;
    ls.far.digits += digit;
    const number = ls.far.digits;
    if (number.startsWith('0')) {
      ls.far.phase = 'reorder';
      return;
    }
    const ownLine = plan.ksu.lines.find((l) => l.directoryNumber === number);
    if (!ownLine && number.length < COMPLETE_NUMBER_LENGTH) continue;
    ls.far.calledNumber = number;
    const engaged = state.lines.some(
      (o) => o !== ls && o.far.calledNumber === number && ['ringback', 'talking'].includes(o.far.phase),
    );
    if (engaged) {
      ls.far.phase = 'busy';
      return;
    }
    if (ownLine) {
      const target = lineState(state, ownLine.number);
      if (
        !target ||
        target === ls ||
        target.circuit !== 'idle' ||
        target.ringing ||
        target.far.phase !== 'idle'
      ) {
        ls.far.phase = 'busy';
        return;
      }
      target.ringing = true;
      target.far = { phase: 'incoming', digits: '', calledNumber: number };
    }
    ls.far.phase = 'ringback';
    return;
  }
}

export function applyAction(plan: Plan, state: SimState, action: SimAction): SimState {
  const nl = getNetlist(plan);
  const next = normaliseState(plan, state);
  const setOf = (id: string): SetState | undefined => next.sets[id];
  switch (action.kind) {
    case 'lift-handset':
    case 'hang-up': {
      const s = setOf(action.set);
      if (s) s.offHook = action.kind === 'lift-handset';
      break;
    }
    case 'press-key': {
      const info = nl.setById.get(action.set);
      const s = setOf(action.set);
      if (!info || !s) break;
      if (action.key === info.holdKey)
        return applyAction(plan, state, { kind: 'press-hold', set: action.set });
      if ((info.keyLine[action.key] ?? 0) > 0) s.pressedKey = action.key;
      break;
    }
    case 'press-hold': {
      const info = nl.setById.get(action.set);
      const s = setOf(action.set);
      if (!info || !s) break;
      // The hold key opens the A-lead while the line key is still down, then releases every key.
      settle(nl, next, info.index);
      s.pressedKey = null;
      break;
    }
    case 'release-keys': {
      const s = setOf(action.set);
      if (s) s.pressedKey = null;
      break;
    }
    case 'hands-free': {
      const s = setOf(action.set);
      if (s) s.handsFreeOn = action.on;
      break;
    }
    case 'dial': {
      const info = nl.setById.get(action.set);
      if (!info) break;
      settle(nl, next);
      const mech = fillMech(nl, next, createMech(nl));
      const facts = computeFacts(nl, mech);
      for (const i of facts.hears[info.index]) {
        const ls = lineState(next, nl.lines[i].number);
        if (ls) dialOnto(plan, next, ls, action.digits);
      }
      break;
    }
    case 'pause':
      for (const ls of next.lines) if (ls.far.phase === 'dialling') ls.far.phase = 'reorder';
      break;
    case 'ring-line': {
      const ls = lineState(next, action.line);
      if (ls && ls.circuit === 'idle' && ls.far.phase === 'idle') {
        ls.ringing = true;
        ls.far = { ...idleFar(), phase: 'incoming' };
      }
      break;
    }
    case 'stop-ringing': {
      const ls = lineState(next, action.line);
      if (ls?.ringing) {
        ls.ringing = false;
        ls.far = idleFar();
      }
      break;
    }
    case 'far-answer': {
      const ls = lineState(next, action.line);
      if (ls?.far.phase === 'ringback') ls.far.phase = 'talking';
      break;
    }
    case 'far-hang-up': {
      const ls = lineState(next, action.line);
      if (!ls) break;
      ls.ringing = false;
      ls.far = idleFar();
      if (ls.circuit === 'held') {
        ls.circuit = 'idle';
        delete ls.heldWithoutSelection;
      }
      break;
    }
    case 'intercom-call':
      next.intercom.calling = plan.ksu.stations.some((s) => s.id === action.station) ? action.station : null;
      break;
    case 'intercom-end':
      next.intercom.calling = null;
      break;
  }
  settle(nl, next);
  return next;
}

/** The state after each action in turn. */
export function applyActions(plan: Plan, state: SimState, actions: readonly SimAction[]): SimState {
  let s = state;
  for (const a of actions) s = applyAction(plan, s, a);
  return s;
}
