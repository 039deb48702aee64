/**
 * Line conductors on control leads (A-lead, lamp lead, ground) and ringing carried over joined talk pairs.
 * Trade facts: common practice, no published source (a key system's A-lead grounded = line in use, the lamp lead
 * lights a lamp against LG, ringing current crosses any ringer bridged across the pair it reaches). Pair colours and
 * pins: ICEA S-80-576 and USOC RJ21X. Pair plan of lines 6–9 and of the hands-free leads: templates/README.md.
 */
import { describe, expect, it } from 'vitest';
import {
  applyCure,
  cure,
  evaluate,
  findingKey,
  sweep,
  type Finding,
  type SimAction,
} from '../../shared/engine/index';
import { LIFT_LAST_THREE_PAIRS, operate, setsOnOneCable } from '../support/plan-builder';

/** A hands-free wired six-key set beside a ten-key set on a nine-line KSU (pairs 23–25 carry lines 7–9's A and L). */
const sixAndTen = (hf = 'six-key-hf') =>
  setsOnOneCable([hf, 'ten-key'], { names: ['Desk', 'Manager'], lines: 9, stations: 1 });

const codes = (fs: Finding[]) => fs.map((f) => f.code);

describe('LINE_ON_CONTROL_LEAD', () => {
  it("names the line whose talk pair a set's line key puts on another line's A-lead and lamp lead, with the path", () => {
    const { plan, a } = sixAndTen();
    const ev = evaluate(plan, operate(plan, [{ kind: 'press-key', set: a, key: 1 }]));
    // Line key 1 joins CT/CR (pair 23) to line 1's talk pair; pair 23 carries line 7's A (tip) and L (ring).
    expect(ev).toHaveFinding('LINE_ON_CONTROL_LEAD', { lines: [1, 7], sets: [a], severity: 'fault' });
    const f = ev.findings.find((x) => x.code === 'LINE_ON_CONTROL_LEAD' && x.lines.includes(7))!;
    expect(f.message).toContain("tip on line 7's A-lead");
    expect(f.message).toContain("ring on line 7's lamp lead");
    expect(f.message).toContain("through Desk's talk pair (CT) on pair 23 (violet-green)"); // ICEA S-80-576
    expect(f.path[0].text).toContain('line 1 tip');
    expect(f.path[f.path.length - 1].text).toContain('line 7 A-lead');
    const pair23 = f.path.filter((h) => h.pair === 23 && h.pin !== undefined);
    expect(pair23.length).toBeGreaterThan(0);
    expect(pair23.every((h) => h.colour === 'violet-green' && h.pin === 48)).toBe(true); // ICEA S-80-576; RJ21X tip 23+25
  });

  it('names a line put on ground when the other set grounds the A-lead its pair lands on', () => {
    const { plan, a, b } = sixAndTen();
    const ev = evaluate(
      plan,
      operate(plan, [
        { kind: 'press-key', set: a, key: 1 },
        { kind: 'press-key', set: b, key: 7 },
        { kind: 'lift-handset', set: b },
      ]),
    );
    // The ten-key set off-hook on line 7 grounds line 7's A-lead (A to A1): line 1's tip, on it, is on ground.
    expect(ev).toHaveFinding('LINE_ON_CONTROL_LEAD', { lines: [1] });
    const f = ev.findings.find((x) => x.code === 'LINE_ON_CONTROL_LEAD' && x.lines.length === 1)!;
    expect(f.message).toContain('tip on ground');
    expect(f.path[f.path.length - 1].text).toContain('ground');
  });

  it('is not raised for the same keys on a set without the hands-free wiring, nor with the set idle', () => {
    const plain = sixAndTen('six-key');
    const pressed = operate(plain.plan, [{ kind: 'press-key', set: plain.a, key: 1 }]);
    expect(codes(evaluate(plain.plan, pressed).findings)).not.toContain('LINE_ON_CONTROL_LEAD');
    const wired = sixAndTen();
    expect(codes(evaluate(wired.plan, operate(wired.plan, [])).findings)).not.toContain(
      'LINE_ON_CONTROL_LEAD',
    );
  });

  it('is not raised on a five-line KSU, where pairs 22–25 carry nothing from the KSU', () => {
    const { plan, a } = setsOnOneCable(['six-key-hf', 'six-key'], { lines: 5 });
    const ev = evaluate(plan, operate(plan, [{ kind: 'press-key', set: a, key: 1 }]));
    expect(codes(ev.findings)).not.toContain('LINE_ON_CONTROL_LEAD');
  });

  it('is cleared by the cure (lifting the hands-free pairs) and reported by the sweep', () => {
    const { plan, a } = sixAndTen();
    const before = sweep(plan);
    expect(before.complete).toBe(true);
    expect(before.findings.some((f) => f.finding.code === 'LINE_ON_CONTROL_LEAD')).toBe(true);
    const result = cure(plan);
    expect(result.ok).toBe(true);
    expect(result.changes.some((c) => c.part === a && c.change.kind === 'lift')).toBe(true);
    const after = sweep(applyCure(plan, result));
    expect(after.findings.filter((f) => f.finding.code === 'LINE_ON_CONTROL_LEAD')).toEqual([]);
  });
});

describe('RINGING_OVER_JOINED_LINES', () => {
  const joined = () =>
    setsOnOneCable(['six-key-hf', 'six-key-hf'], {
      names: ['Front counter', 'Workroom'],
      sets: [{ ringerLines: [1] }, { ringerLines: [5] }],
    });
  const join = (a: string, b: string): SimAction[] => [
    { kind: 'press-key', set: a, key: 1 },
    { kind: 'press-key', set: b, key: 5 },
  ];

  it("rings line 5's ringers and flashes its lamps when line 1 rings with the two talk pairs joined", () => {
    const { plan, a, b } = joined();
    const ev = evaluate(plan, operate(plan, [...join(a, b), { kind: 'ring-line', line: 1 }]));
    const line5 = ev.lines.find((l) => l.line === 5)!;
    expect(line5.status).toBe('ringing');
    expect(line5.lamp).toBe('flash'); // the line circuit flashes an incoming line's lamps (common practice)
    expect(line5.far).toBe('idle'); // nobody calls line 5
    expect(ev.sets.find((s) => s.set === b)!.ringer).toBe(true);
    const key5 = ev.sets.find((s) => s.set === a)!.keys.find((k) => k.lines.includes(5))!;
    expect(key5.lamp).toBe('flash');
    expect(ev).toHaveFinding('RINGING_OVER_JOINED_LINES', { lines: [1, 5], sets: [a, b], severity: 'fault' });
    const f = ev.findings.find((x) => x.code === 'RINGING_OVER_JOINED_LINES')!;
    expect(f.message).toContain('Ringing on line 1 also reaches line 5');
    expect(f.message).toContain('ringer of Workroom rings');
    expect(f.path[0].text).toContain('line 1 tip');
    expect(f.path[f.path.length - 1].text).toContain('line 5 tip');
  });

  it('leaves line 5 idle and dark when line 1 rings with nothing joined, and raises nothing without ringing', () => {
    const { plan, a, b } = joined();
    const alone = evaluate(plan, operate(plan, [{ kind: 'ring-line', line: 1 }]));
    expect(alone.lines.find((l) => l.line === 5)).toMatchObject({ status: 'idle', lamp: 'dark' });
    expect(alone.sets.find((s) => s.set === b)!.ringer).toBe(false);
    expect(alone.sets.find((s) => s.set === a)!.ringer).toBe(true); // strapped to line 1
    const quiet = evaluate(plan, operate(plan, join(a, b)));
    expect(codes(quiet.findings)).toContain('LINES_JOINED');
    expect(codes(quiet.findings)).not.toContain('RINGING_OVER_JOINED_LINES');
    expect(quiet.lines.find((l) => l.line === 5)!.status).toBe('idle');
  });

  it('is reported by the sweep with the ringing event, the fast sweep agreeing with the exact one', () => {
    const { plan } = joined();
    const fast = sweep(plan);
    const hit = fast.findings.find(
      (f) => f.finding.code === 'RINGING_OVER_JOINED_LINES' && f.finding.lines.join() === '1,5',
    )!;
    expect(hit.event.ringing).toBe(1);
    expect(hit.actions).toContainEqual({ kind: 'ring-line', line: 1 });
    const replayed = evaluate(plan, hit.state).findings.map(findingKey);
    expect(replayed).toContain(findingKey(hit.finding));
    const exact = sweep(plan, { exact: true });
    const keys = (r: typeof fast) => r.findings.map((f) => findingKey(f.finding)).sort();
    expect(keys(fast)).toEqual(keys(exact));
  });

  it('is cleared by lifting the hands-free pairs of one set, which the cure finds', () => {
    const { plan } = joined();
    const result = cure(plan);
    expect(result.ok).toBe(true);
    const after = sweep(applyCure(plan, result));
    expect(after.findings.filter((f) => f.finding.code === 'RINGING_OVER_JOINED_LINES')).toEqual([]);
    const lifted = setsOnOneCable(['six-key-hf', 'six-key-hf'], {
      sets: [{ ringerLines: [1] }, { ringerLines: [5], leadChanges: LIFT_LAST_THREE_PAIRS }],
    });
    const rung = sweep(lifted.plan).findings.map((f) => f.finding.code);
    expect(rung).not.toContain('RINGING_OVER_JOINED_LINES');
  });
});
