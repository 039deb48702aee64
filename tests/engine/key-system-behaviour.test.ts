/**
 * The trade behaviour the engine must reproduce. Unless a line says otherwise, each expectation is
 * "common practice, no published source" (how multi-line key sets on a shared 25-pair cable behave).
 */
import { describe, expect, it } from 'vitest';
import { evaluate, type Plan, type SimAction, type SimState } from '../../shared/engine/index';
import { LIFT_LAST_THREE_PAIRS, operate, planBuilder, setsOnOneCable } from '../support/plan-builder';

const dynamic = (plan: Plan, state: SimState) =>
  evaluate(plan, state).findings.filter((f) => f.code !== 'PRIVATE_LEAD_SHARED');
const line = (plan: Plan, state: SimState, n: number) =>
  evaluate(plan, state).lines.find((l) => l.line === n)!;
const setObs = (plan: Plan, state: SimState, id: string) =>
  evaluate(plan, state).sets.find((s) => s.set === id)!;

describe('two hands-free wired sets on one cable light each other’s lines', () => {
  const { plan, a, b } = setsOnOneCable(['six-key-hf', 'six-key-hf']);

  it('lights line 1 and line 5 when the line-5 set is lifted', () => {
    const state = operate(plan, [
      { kind: 'press-key', set: a, key: 1 },
      { kind: 'press-key', set: b, key: 5 },
    ]);
    expect(evaluate(plan, state).lines.map((l) => l.lamp)).toEqual(['dark', 'dark', 'dark', 'dark', 'dark']); // both hung up: nothing lit
    const lifted = operate(plan, [{ kind: 'lift-handset', set: b }], state);
    const ev = evaluate(plan, lifted);
    expect(ev.lines[0]).toMatchObject({ aClosed: true, lamp: 'steady' }); // line 1 lit, common practice
    expect(ev.lines[4]).toMatchObject({ aClosed: true, lamp: 'steady' }); // line 5 lit
    expect(ev.lines.slice(1, 4).every((l) => l.lamp === 'dark')).toBe(true);
    expect(ev).toHaveFinding('LINE_LIT_UNATTENDED', { lines: [1] });
    // every set's line-1 lamp shows it
    expect(ev.sets.every((s) => s.keys[0].lamp === 'steady')).toBe(true);
  });
});

describe('with every key of one set released, the other set works normally', () => {
  const { plan, a, b } = setsOnOneCable(['six-key-hf', 'six-key-hf']);

  it('gives one dial tone on an originated call', () => {
    const state = operate(plan, [
      { kind: 'press-key', set: b, key: 2 },
      { kind: 'lift-handset', set: b },
    ]);
    expect(setObs(plan, state, b).tones).toEqual([{ tone: 'dial', line: 2 }]); // one dial tone
    expect(dynamic(plan, state)).toEqual([]);
    expect(setObs(plan, state, a).hears).toEqual([]);
  });

  it('holds and takes the line back', () => {
    const talking = operate(plan, [
      { kind: 'press-key', set: b, key: 2 },
      { kind: 'lift-handset', set: b },
      { kind: 'dial', set: b, digits: '5557788' },
      { kind: 'far-answer', line: 2 },
    ]);
    expect(line(plan, talking, 2)).toMatchObject({ status: 'in-use', far: 'talking' });
    const held = operate(plan, [{ kind: 'press-hold', set: b }], talking);
    expect(line(plan, held, 2)).toMatchObject({
      status: 'held',
      lamp: 'wink',
      loopClosed: true,
      far: 'talking',
    });
    expect(held.sets[b].pressedKey).toBeNull(); // the hold key releases the line keys
    expect(dynamic(plan, held)).toEqual([]);
    const back = operate(plan, [{ kind: 'press-key', set: b, key: 2 }], held);
    expect(line(plan, back, 2)).toMatchObject({ status: 'in-use', lamp: 'steady', far: 'talking' });
    const done = operate(plan, [{ kind: 'hang-up', set: b }], back);
    expect(line(plan, done, 2)).toMatchObject({ status: 'idle', lamp: 'dark', far: 'idle' });
  });

  it('answers an incoming call, holds it and releases it', () => {
    const ringing = operate(plan, [{ kind: 'ring-line', line: 4 }]);
    expect(line(plan, ringing, 4)).toMatchObject({ status: 'ringing', lamp: 'flash' });
    const answered = operate(
      plan,
      [
        { kind: 'press-key', set: b, key: 4 },
        { kind: 'lift-handset', set: b },
      ],
      ringing,
    );
    expect(line(plan, answered, 4)).toMatchObject({ status: 'in-use', lamp: 'steady', far: 'answered' });
    expect(setObs(plan, answered, b).tones).toEqual([{ tone: 'voice', line: 4 }]);
    expect(dynamic(plan, answered)).toEqual([]);
    const held = operate(plan, [{ kind: 'press-hold', set: b }], answered);
    expect(line(plan, held, 4).status).toBe('held');
    const released = operate(
      plan,
      [
        { kind: 'press-key', set: b, key: 4 },
        { kind: 'release-keys', set: b },
      ],
      held,
    );
    expect(line(plan, released, 4)).toMatchObject({ status: 'idle', far: 'idle' });
  });
});

describe('different line keys on the two sets join their lines into a conference', () => {
  const { plan, a, b } = setsOnOneCable(['six-key-hf', 'six-key-hf']);
  const conference: SimAction[] = [
    { kind: 'press-key', set: a, key: 1 },
    { kind: 'press-key', set: b, key: 5 },
    { kind: 'lift-handset', set: b },
  ];

  it('lets the set that goes off-hook hear both lines: two dial tones', () => {
    const state = operate(plan, conference);
    const ev = evaluate(plan, state);
    expect(ev.sets.find((s) => s.set === b)!.tones).toEqual([
      { tone: 'dial', line: 1 },
      { tone: 'dial', line: 5 },
    ]); // two dial tones, common practice
    expect(ev.lines[0].joinedWith).toEqual([5]);
    expect(ev).toHaveFinding('LINES_JOINED', { lines: [1, 5], sets: [a, b] });
    expect(ev).toHaveFinding('SET_HEARS_SEVERAL_LINES', { sets: [b], lines: [1, 5] });
  });

  it('rings the called party on one line and gives busy on the other', () => {
    const state = operate(plan, [...conference, { kind: 'dial', set: b, digits: '5557788' }]);
    const tones = setObs(plan, state, b).tones;
    expect(tones).toEqual([
      { tone: 'ringback', line: 1 },
      { tone: 'busy', line: 5 },
    ]); // the number is engaged by the first line, common practice
  });

  it('treats the same line key on both sets as an ordinary shared line', () => {
    const state = operate(plan, [
      { kind: 'press-key', set: a, key: 3 },
      { kind: 'press-key', set: b, key: 3 },
      { kind: 'lift-handset', set: b },
    ]);
    expect(dynamic(plan, state)).toEqual([]);
    expect(setObs(plan, state, b).tones).toEqual([{ tone: 'dial', line: 3 }]);
    const both = operate(plan, [{ kind: 'lift-handset', set: a }], state);
    expect(dynamic(plan, both)).toEqual([]);
    expect(line(plan, both, 3).setsOn).toEqual([a, b]);
  });
});

describe('a set with no key down breaks into the call in progress', () => {
  const { plan, a, b } = setsOnOneCable(['six-key-hf', 'six-key-hf']);

  it('hears the call on the other set and joins it when it presses another line key', () => {
    const call = operate(plan, [
      { kind: 'press-key', set: a, key: 1 },
      { kind: 'lift-handset', set: a },
      { kind: 'dial', set: a, digits: '5557788' },
      { kind: 'far-answer', line: 1 },
    ]);
    expect(dynamic(plan, call)).toEqual([]);
    const offHook = operate(plan, [{ kind: 'lift-handset', set: b }], call);
    expect(setObs(plan, offHook, b).hears).toEqual([1]);
    expect(evaluate(plan, offHook)).toHaveFinding('BREAK_IN', { sets: [b, a], lines: [1] });
    const pressed = operate(plan, [{ kind: 'press-key', set: b, key: 3 }], offHook);
    const ev = evaluate(plan, pressed);
    expect(ev.sets.find((s) => s.set === b)!.hears).toEqual([1, 3]);
    expect(ev.sets.find((s) => s.set === b)!.tones).toContainEqual({ tone: 'voice', line: 1 }); // hears its parties
    expect(ev).toHaveFinding('BREAK_IN', { sets: [b, a], lines: [1] });
    expect(ev).toHaveFinding('SET_HEARS_UNSELECTED_LINE', { sets: [b], lines: [1] });
  });
});

describe('lifting the three last-pair leads in one set cures it', () => {
  const { plan, a, b } = setsOnOneCable(['six-key-hf', 'six-key-hf'], {
    sets: [{ leadChanges: LIFT_LAST_THREE_PAIRS }, {}],
  });

  it('lets both sets work independently on any line keys', () => {
    for (let ka = 1; ka <= 5; ka++) {
      for (let kb = 1; kb <= 5; kb++) {
        const state = operate(plan, [
          { kind: 'press-key', set: a, key: ka },
          { kind: 'press-key', set: b, key: kb },
          { kind: 'lift-handset', set: b },
        ]);
        const ev = evaluate(plan, state);
        expect(ev.findings, `keys ${ka}/${kb}`).toEqual([]);
        expect(ev.lines.filter((l) => l.aClosed).map((l) => l.line)).toEqual([kb]);
        const both = operate(plan, [{ kind: 'lift-handset', set: a }], state);
        expect(evaluate(plan, both).findings).toEqual([]);
      }
    }
  });

  it('takes away the treated set’s hands-free connection', () => {
    const b2 = planBuilder();
    const ksu = b2.ksu({ lines: 5 });
    const set = b2.set('six-key-hf', 'Front', { leadChanges: LIFT_LAST_THREE_PAIRS });
    const unit = b2.addOn(set);
    b2.cable(ksu.port(1), unit.cord);
    b2.cable(unit.jack, set.cord);
    const treated = b2.build();
    const state = operate(treated, [
      { kind: 'press-key', set: set.id, key: 2 },
      { kind: 'hands-free', set: set.id, on: true },
    ]);
    const ev = evaluate(treated, state);
    expect(ev.lines[1].aClosed).toBe(false);
    expect(ev.sets[0].hears).toEqual([]);
  });

  it('works hands-free before the treatment', () => {
    const b2 = planBuilder();
    const ksu = b2.ksu({ lines: 5 });
    const set = b2.set('six-key-hf', 'Front');
    const unit = b2.addOn(set);
    b2.cable(ksu.port(1), unit.cord);
    b2.cable(unit.jack, set.cord);
    const untreated = b2.build();
    const state = operate(untreated, [
      { kind: 'press-key', set: set.id, key: 2 },
      { kind: 'hands-free', set: set.id, on: true },
    ]);
    const ev = evaluate(untreated, state);
    expect(ev.lines[1]).toMatchObject({ aClosed: true, loopClosed: true, far: 'dial-tone' });
    expect(ev.sets[0].hears).toEqual([2]);
    expect(ev.findings).toEqual([]);
  });
});

describe('intercom buzzers on one pair', () => {
  function intercomPlan(movedToSpare: boolean) {
    const b = planBuilder();
    const cc = movedToSpare
      ? [
          { port: 1, pair: 18, lead: { kind: 'buzzer' as const, station: 'st-21' } },
          { port: 1, pair: 17, lead: { kind: 'buzzer' as const, station: 'st-22' } },
        ]
      : [
          { port: 1, pair: 18, lead: { kind: 'buzzer' as const, station: 'st-21' } },
          { port: 1, pair: 18, lead: { kind: 'buzzer' as const, station: 'st-22' } },
        ];
    const ksu = b.ksu({ lines: 2, stations: 2, crossConnect: cc });
    const x = b.set('six-key', 'Office', { station: 'st-21' });
    const y = b.set('six-key', 'Stockroom', {
      station: 'st-22',
      leadChanges: movedToSpare ? [{ kind: 'move', pair: 18, toPair: 17 }] : [],
    });
    const ad = b.adapter();
    b.cable(ksu.port(1), ad.plug);
    b.cable(ad.jack(1), x.cord);
    b.cable(ad.jack(2), y.cord);
    return { plan: b.build(), x: x.id, y: y.id };
  }

  it('buzzes both sets for a call to either station while both buzzers are on pair 18', () => {
    const { plan, x, y } = intercomPlan(false);
    for (const station of ['st-21', 'st-22']) {
      const ev = evaluate(plan, operate(plan, [{ kind: 'intercom-call', station }]));
      expect(ev.sets.map((s) => s.buzzer)).toEqual([true, true]); // both buzz, common practice
      expect(ev).toHaveFinding('INTERCOM_SOUNDS_SEVERAL', { stations: [station], sets: [x, y] });
    }
  });

  it('gives each set its own intercom once one buzzer moves to pair 17, cross-connected to the other station', () => {
    const { plan } = intercomPlan(true);
    const to21 = evaluate(plan, operate(plan, [{ kind: 'intercom-call', station: 'st-21' }]));
    expect(to21.sets.map((s) => s.buzzer)).toEqual([true, false]);
    const to22 = evaluate(plan, operate(plan, [{ kind: 'intercom-call', station: 'st-22' }]));
    expect(to22.sets.map((s) => s.buzzer)).toEqual([false, true]);
    expect(to21.findings).toEqual([]);
    expect(to22.findings).toEqual([]);
    const ended = evaluate(
      plan,
      operate(plan, [{ kind: 'intercom-call', station: 'st-22' }, { kind: 'intercom-end' }]),
    );
    expect(ended.sets.map((s) => s.buzzer)).toEqual([false, false]);
  });
});

describe('a six-key hands-free set and a ten-key set on one cable', () => {
  const conflict = setsOnOneCable(['six-key-hf', 'ten-key'], { lines: 9 });

  it('conflict, because the ten-key set switches leads on pairs 23–25 through its key strip', () => {
    const { plan, a, b } = conflict;
    expect(evaluate(plan, operate(plan, []))).toHaveFinding('PRIVATE_LEAD_SHARED', { sets: [a, b] });
    // Ten-key line 9's A-lead (pair 25 tip) meets the six-key set's A-lead common: lifting the ten-key set on
    // line 9 grounds the six-key set's latched line 2 as well.
    const state = operate(plan, [
      { kind: 'press-key', set: b, key: 9 },
      { kind: 'press-key', set: a, key: 2 },
      { kind: 'lift-handset', set: b },
    ]);
    const ev = evaluate(plan, state);
    expect(ev.lines.filter((l) => l.aClosed).map((l) => l.line)).toEqual([2, 9]); // common practice, no published source
    expect(ev).toHaveFinding('LINE_LIT_UNATTENDED', { lines: [2], sets: [a] });
  });

  it('is cured by lifting the last three pairs in the six-key set', () => {
    const { plan, a, b } = setsOnOneCable(['six-key-hf', 'ten-key'], {
      lines: 9,
      sets: [{ leadChanges: LIFT_LAST_THREE_PAIRS }, {}],
    });
    expect(evaluate(plan, operate(plan, []))).not.toHaveFinding('PRIVATE_LEAD_SHARED');
    for (let kb = 1; kb <= 9; kb++) {
      for (const ka of [1, 3, 5]) {
        const state = operate(plan, [
          { kind: 'press-key', set: b, key: kb },
          { kind: 'press-key', set: a, key: ka },
          { kind: 'lift-handset', set: a },
          { kind: 'lift-handset', set: b },
        ]);
        const ev = evaluate(plan, state);
        expect(ev.findings, `six-key ${ka}, ten-key ${kb}`).toEqual([]);
        expect(ev.sets.find((s) => s.set === b)!.hears).toEqual([kb]);
        expect(ev.sets.find((s) => s.set === a)!.hears).toEqual(ka === kb ? [ka] : [ka]);
      }
    }
  });
});

describe('a six-key hands-free set and a ten-key set, seen on the lamps', () => {
  it('shorts the ten-key set’s line 9 lamp lead to the six-key set’s A1 on pair 25 until the pair is lifted', () => {
    const use9 = (sets: [object, object]) => {
      const { plan, b } = setsOnOneCable(['six-key-hf', 'ten-key'], { lines: 9, sets });
      const state = operate(plan, [
        { kind: 'press-key', set: b, key: 9 },
        { kind: 'lift-handset', set: b },
      ]);
      return evaluate(plan, state)
        .sets.find((s) => s.set === b)!
        .keys.find((k) => k.index === 9)!.lamp;
    };
    expect(use9([{}, {}])).toBe('dark'); // lamp lead grounded: no lamp voltage, common practice
    expect(use9([{ leadChanges: LIFT_LAST_THREE_PAIRS }, {}])).toBe('steady');
  });
});
