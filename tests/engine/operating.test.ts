/** Operating one installation: keys, hookswitch, hold, ringing and the exchange (common practice, no published source unless noted). */
import { describe, expect, it } from 'vitest';
import {
  actionProblem,
  applyAction,
  COMPLETE_NUMBER_LENGTH,
  evaluate,
  initialState,
  SimStateSchema,
} from '../../shared/engine/index';
import { directoryNumber, operate, planBuilder } from '../support/plan-builder';

function oneSet(template = 'six-key', opts: { ringerLines?: number[] } = {}) {
  const b = planBuilder();
  const ksu = b.ksu({ lines: 5, stations: 1 });
  const set = b.set(template, 'Desk', { station: 'st-21', ringerLines: opts.ringerLines });
  b.cable(ksu.port(1), set.cord);
  return { plan: b.build(), set: set.id };
}

describe('initial state', () => {
  it('has every set on-hook with no key down and every line idle', () => {
    const { plan, set } = oneSet();
    const state = initialState(plan);
    expect(SimStateSchema.parse(state)).toEqual(state);
    expect(state.sets[set]).toEqual({ offHook: false, pressedKey: null, handsFreeOn: false });
    expect(state.lines.map((l) => l.circuit)).toEqual(['idle', 'idle', 'idle', 'idle', 'idle']);
    const ev = evaluate(plan, state);
    expect(ev.lines.every((l) => l.status === 'idle' && l.lamp === 'dark' && !l.loopClosed)).toBe(true);
  });

  it('leaves the state it was given untouched', () => {
    const { plan, set } = oneSet();
    const state = initialState(plan);
    const copy = JSON.parse(JSON.stringify(state));
    applyAction(plan, state, { kind: 'lift-handset', set });
    expect(state).toEqual(copy);
  });
});

describe('line keys', () => {
  it('interlock: pressing one releases the other', () => {
    const { plan, set } = oneSet();
    const state = operate(plan, [
      { kind: 'press-key', set, key: 2 },
      { kind: 'press-key', set, key: 4 },
    ]);
    expect(state.sets[set].pressedKey).toBe(4);
  });

  it('stay latched when the handset is hung up', () => {
    const { plan, set } = oneSet();
    const state = operate(plan, [
      { kind: 'press-key', set, key: 2 },
      { kind: 'lift-handset', set },
      { kind: 'hang-up', set },
    ]);
    expect(state.sets[set].pressedKey).toBe(2);
    expect(evaluate(plan, state).lines[1].status).toBe('idle');
  });

  it('treat the hold key index as the hold key', () => {
    const { plan, set } = oneSet();
    const state = operate(plan, [
      { kind: 'press-key', set, key: 2 },
      { kind: 'lift-handset', set },
      { kind: 'press-key', set, key: 6 },
    ]);
    expect(state.sets[set].pressedKey).toBeNull();
    expect(evaluate(plan, state).lines[1].status).toBe('held');
  });

  it('ignore a key the set does not have', () => {
    const { plan, set } = oneSet();
    expect(operate(plan, [{ kind: 'press-key', set, key: 12 }]).sets[set].pressedKey).toBeNull();
  });
});

describe('lamps', () => {
  it('light steadily while in use, wink on hold, flash while ringing', () => {
    const { plan, set } = oneSet();
    const inUse = operate(plan, [
      { kind: 'press-key', set, key: 1 },
      { kind: 'lift-handset', set },
    ]);
    const held = operate(plan, [{ kind: 'press-hold', set }], inUse);
    const ringing = operate(plan, [{ kind: 'ring-line', line: 3 }], held);
    const ev = evaluate(plan, ringing);
    expect(ev.lines.map((l) => l.lamp)).toEqual(['wink', 'dark', 'flash', 'dark', 'dark']);
    expect(ev.sets[0].keys.map((k) => k.lamp)).toEqual(['wink', 'dark', 'flash', 'dark', 'dark', 'dark']);
    expect(ev.sets[0].keys[0].lines).toEqual([1]);
    expect(evaluate(plan, inUse).sets[0].keys[0].lamp).toBe('steady');
  });
});

describe('ringing and the ringer', () => {
  it('sounds the ringer strapped to the ringing line only', () => {
    const { plan, set } = oneSet('six-key', { ringerLines: [2] });
    expect(evaluate(plan, operate(plan, [{ kind: 'ring-line', line: 2 }])).sets[0].ringer).toBe(true);
    expect(evaluate(plan, operate(plan, [{ kind: 'ring-line', line: 3 }])).sets[0].ringer).toBe(false);
    const answered = operate(plan, [
      { kind: 'ring-line', line: 2 },
      { kind: 'press-key', set, key: 2 },
      { kind: 'lift-handset', set },
    ]);
    expect(evaluate(plan, answered).sets[0].ringer).toBe(false); // going off-hook stops the ringing
    expect(answered.lines[1]).toMatchObject({ ringing: false, circuit: 'in-use' });
  });

  it('stops when the caller gives up', () => {
    const { plan } = oneSet('six-key', { ringerLines: [2] });
    const state = operate(plan, [
      { kind: 'ring-line', line: 2 },
      { kind: 'stop-ringing', line: 2 },
    ]);
    expect(evaluate(plan, state).lines[1]).toMatchObject({ status: 'idle', lamp: 'dark', far: 'idle' });
  });

  it('does not ring a line that is in use', () => {
    const { plan, set } = oneSet();
    const state = operate(plan, [
      { kind: 'press-key', set, key: 2 },
      { kind: 'lift-handset', set },
      { kind: 'ring-line', line: 2 },
    ]);
    expect(state.lines[1].ringing).toBe(false);
  });
});

describe('the exchange', () => {
  const offHookOn = (line: number) => {
    const { plan, set } = oneSet();
    return {
      plan,
      set,
      state: operate(plan, [
        { kind: 'press-key', set, key: line },
        { kind: 'lift-handset', set },
      ]),
    };
  };

  it('gives dial tone, then ringback for a complete number, then the far party', () => {
    const { plan, set, state } = offHookOn(1);
    expect(evaluate(plan, state).sets[0].tones).toEqual([{ tone: 'dial', line: 1 }]);
    const part = operate(plan, [{ kind: 'dial', set, digits: '555' }], state);
    expect(part.lines[0].far).toMatchObject({ phase: 'dialling', digits: '555' });
    expect(evaluate(plan, part).sets[0].tones).toEqual([]); // dial tone stops at the first digit
    expect(COMPLETE_NUMBER_LENGTH).toBe(7); // seven-digit local number, common practice
    const ringing = operate(plan, [{ kind: 'dial', set, digits: '7788' }], part);
    expect(ringing.lines[0].far).toMatchObject({ phase: 'ringback', calledNumber: '5557788' });
    const talking = operate(plan, [{ kind: 'far-answer', line: 1 }], ringing);
    expect(evaluate(plan, talking).sets[0].tones).toEqual([{ tone: 'voice', line: 1 }]);
    const gone = operate(plan, [{ kind: 'far-hang-up', line: 1 }], talking);
    expect(gone.lines[0].far.phase).toBe('dial-tone');
  });

  it('gives reorder for a number starting with 0 and for an incomplete number after a pause', () => {
    const { plan, set, state } = offHookOn(1);
    const zero = operate(plan, [{ kind: 'dial', set, digits: '0' }], state);
    expect(evaluate(plan, zero).sets[0].tones).toEqual([{ tone: 'reorder', line: 1 }]);
    const short = operate(plan, [{ kind: 'dial', set, digits: '55' }, { kind: 'pause' }], state);
    expect(short.lines[0].far.phase).toBe('reorder');
  });

  it('rings one of our own lines dialled by its directory number, and connects when it is answered', () => {
    const b = planBuilder();
    const ksu = b.ksu({ lines: 3 });
    const x = b.set('six-key', 'Desk');
    const y = b.set('six-key', 'Bench');
    b.cable(ksu.port(1), x.cord);
    b.cable(ksu.port(2), y.cord);
    const plan = b.build();
    const calling = operate(plan, [
      { kind: 'press-key', set: x.id, key: 1 },
      { kind: 'lift-handset', set: x.id },
      { kind: 'dial', set: x.id, digits: directoryNumber(3) },
    ]);
    expect(calling.lines[0].far.phase).toBe('ringback');
    expect(evaluate(plan, calling).lines[2].status).toBe('ringing');
    const answered = operate(
      plan,
      [
        { kind: 'press-key', set: y.id, key: 3 },
        { kind: 'lift-handset', set: y.id },
      ],
      calling,
    );
    expect(answered.lines[0].far.phase).toBe('talking');
    expect(answered.lines[2].far.phase).toBe('answered');
    const again = operate(
      plan,
      [
        { kind: 'release-keys', set: x.id },
        { kind: 'press-key', set: x.id, key: 2 },
        { kind: 'dial', set: x.id, digits: directoryNumber(3) },
      ],
      answered,
    );
    expect(again.lines[1].far.phase).toBe('busy');
  });

  it('drops the far party when the set hangs up', () => {
    const { plan, set, state } = offHookOn(2);
    const done = operate(
      plan,
      [
        { kind: 'dial', set, digits: '5557788' },
        { kind: 'hang-up', set },
      ],
      state,
    );
    expect(done.lines[1]).toMatchObject({
      circuit: 'idle',
      far: { phase: 'idle', digits: '', calledNumber: null },
    });
  });
});

describe('hands-free add-on', () => {
  it('puts the served set on its latched line with the handset on-hook', () => {
    const b = planBuilder();
    const ksu = b.ksu({ lines: 3 });
    const set = b.set('six-key-hf', 'Desk');
    const unit = b.addOn(set);
    b.cable(ksu.port(1), unit.cord);
    b.cable(unit.jack, set.cord);
    const plan = b.build();
    const on = operate(plan, [
      { kind: 'press-key', set: set.id, key: 3 },
      { kind: 'hands-free', set: set.id, on: true },
    ]);
    const ev = evaluate(plan, on);
    expect(ev.lines[2]).toMatchObject({ status: 'in-use', loopClosed: true, setsOn: [set.id] });
    expect(ev.sets[0]).toMatchObject({ handsFreeOn: true, hears: [3] });
    const off = operate(plan, [{ kind: 'hands-free', set: set.id, on: false }], on);
    expect(evaluate(plan, off).lines[2].status).toBe('idle');
    // The served set's hold key opens the add-on's A-lead control, so a hands-free call holds too.
    const held = operate(plan, [{ kind: 'press-hold', set: set.id }], on);
    expect(evaluate(plan, held).lines[2]).toMatchObject({ status: 'held', lamp: 'wink' });
    expect(held.sets[set.id]).toMatchObject({ pressedKey: null, handsFreeOn: true });
  });
});

describe('single-line set', () => {
  it('seizes line 1 with its hookswitch alone', () => {
    const b = planBuilder();
    const ksu = b.ksu({ lines: 2 });
    const set = b.set('single-line', 'Hall');
    b.cable(ksu.port(1), set.cord);
    const plan = b.build();
    const ev = evaluate(plan, operate(plan, [{ kind: 'lift-handset', set: set.id }]));
    expect(ev.lines[0]).toMatchObject({ status: 'in-use', far: 'dial-tone', setsOn: [set.id] });
    expect(ev.sets[0].keys).toEqual([]);
    expect(ev.findings).toEqual([]);
  });
});

describe('actionProblem', () => {
  it('explains actions the plan cannot take and accepts the rest', () => {
    const { plan, set } = oneSet();
    expect(actionProblem(plan, { kind: 'lift-handset', set: 'ghost' })).toBe(
      'There is no key set "ghost" in this plan.',
    );
    expect(actionProblem(plan, { kind: 'press-key', set, key: 9 })).toBe('Desk has no key 9.');
    expect(actionProblem(plan, { kind: 'hands-free', set, on: true })).toBe('Desk has no hands-free add-on.');
    expect(actionProblem(plan, { kind: 'ring-line', line: 8 })).toBe('The KSU has no line 8.');
    expect(actionProblem(plan, { kind: 'intercom-call', station: 'st-40' })).toBe(
      'The KSU has no intercom station "st-40".',
    );
    expect(actionProblem(plan, { kind: 'press-key', set, key: 6 })).toBeNull();
    expect(actionProblem(plan, { kind: 'dial', set, digits: '21' })).toBeNull();
  });
});

describe('odd input', () => {
  it('evaluates a plan with unknown parts and ports without throwing, ignoring what it cannot place', () => {
    const b = planBuilder();
    const ksu = b.ksu({ lines: 2 });
    const x = b.set('six-key', 'Desk');
    b.set('no-such-set', 'Mystery');
    b.cable(ksu.port(1), x.cord);
    b.cable(ksu.port(9), { part: 'ghost', port: 'cord' });
    const plan = b.build();
    const state = operate(plan, [
      { kind: 'press-key', set: x.id, key: 1 },
      { kind: 'lift-handset', set: x.id },
      { kind: 'lift-handset', set: 'ghost' },
      { kind: 'ring-line', line: 7 },
      { kind: 'intercom-call', station: 'nowhere' },
    ]);
    const ev = evaluate(plan, state);
    expect(ev.lines[0]).toMatchObject({ status: 'in-use', setsOn: [x.id] });
    expect(ev.sets.map((s) => s.set)).toEqual([x.id, 'mystery']);
    expect(ev.sets[1].keys).toEqual([]);
    expect(state.intercom.calling).toBeNull();
  });

  it('evaluates a state written by hand with sets and lines missing', () => {
    const { plan, set } = oneSet();
    const ev = evaluate(plan, {
      sets: { [set]: { offHook: true, pressedKey: 3, handsFreeOn: false } },
      lines: [],
      intercom: { calling: null },
    });
    expect(ev.lines[2]).toMatchObject({ aClosed: true, loopClosed: true, far: 'idle' });
  });
});
