/**
 * A line's tip or ring on ground, or on another line's A-lead or lamp lead, through some set's leads (a lead one
 * set switches landing on a pair another set or the KSU uses for an A-lead or lamp): the line is seized or noisy
 * with no set on it, the other line looks busy, its lamp supply is shorted or lights the wrong lamps
 * (common practice, no published source).
 */
import { fixedNet } from '../../model/coarse-nets';
import type { Conductor } from '../../document/plan.schema';
import { describeVia, hopsOf, latchedOn, pathIn } from '../rule-helpers';
import type { FindingFacts, StateRule } from '../rule.types';
import type { Finding } from '../evaluation.types';
import { listId, memoFinding } from '../finding-memo';
import { firstCrossing, lastUnitLeadSentence, type TerminalPath } from '../paths';

/**
 * Line i's landings on one target (a line index, or the line count for ground), one bit each: bit 2c + k for
 * conductor c (tip 0, ring 1) on lead k (the A-lead, or ground, 0; the lamp lead 1), listed in bit order.
 */
const TIP_BITS = 0b0011;
const RING_BITS = 0b1100;
const CONDUCTORS: readonly Conductor[] = ['tip', 'ring'];

const LEAD_WORDS = { A: 'A-lead', L: 'lamp lead', ground: 'ground' } as const;

/**
 * Where the line leaves its proper leads: the crossing between two sets, or else the lead by which the path leaves
 * the last set for the cord (the pair that lands on the other lead at the KSU).
 */
function via(f: FindingFacts, p: TerminalPath): string {
  if (firstCrossing(f.nl, p)) return describeVia(f, p);
  const lead = lastUnitLeadSentence(f.nl, p);
  return lead ? `, through ${lead}` : '';
}

/** Per target: line i's landings on it (the bits above), kept between calls (evaluation is synchronous). */
let landingBuffer = new Uint8Array(0);
/** Per line index: the root of its A-lead; per root: `stamp` when some line's A-lead or lamp lead is on it. */
let rootABuffer = new Int32Array(0);
let controlMarks = new Int32Array(0);
let stamp = 0;

/** The finding for line i's landings `bits` on `target`, made once for what it says (finding-memo.ts). */
function landingFinding(f: FindingFacts, i: number, target: number, bits: number): Finding {
  const { nl, finder } = f;
  const nLines = nl.lines.length;
  const line = nl.lines[i];
  const other = target === nLines ? null : nl.lines[target];
  const first = 31 - Math.clz32(bits & -bits);
  const firstLead = first & 1 ? 'L' : other ? 'A' : 'ground';
  const end = other ? (firstLead === 'A' ? other.a : other.l) : nl.gnd;
  const p: TerminalPath | null = pathIn(finder, first < 2 ? line.t : line.r, end);
  const lines = other ? [line.number, other.number] : [line.number];
  const latched = latchedOn(f, lines);
  const latchedId = listId(
    nl,
    latched.map((s) => s.index),
  );
  // what the finding says: the line, the target and the landings on it, the sets latched on them, the path
  const key = ((latchedId * (nLines + 1) + target) * nLines + i) * 16 + bits;
  return memoFinding(nl, 'LINE_ON_CONTROL_LEAD', key, p, () => {
    const where: string[] = [];
    for (let b = 0; b < 4; b++) {
      if (!(bits & (1 << b))) continue;
      const lead = b & 1 ? 'L' : other ? 'A' : 'ground';
      where.push(`its ${CONDUCTORS[b >> 1]} on ${other ? `line ${other.number}'s ` : ''}${LEAD_WORDS[lead]}`);
    }
    const effects = [`line ${line.number} is seized or noisy with nobody on it`];
    if (other && bits & 0b0101)
      effects.push(`line ${other.number} looks in use (its A-lead worked with nobody off hook)`);
    if (other && bits & 0b1010)
      effects.push(`line ${other.number}'s lamp supply is on it (lamps dark or lit wrongly)`);
    return {
      code: 'LINE_ON_CONTROL_LEAD',
      severity: 'fault',
      sets: latched.map((s) => s.id),
      lines,
      stations: [],
      message: `Line ${line.number} has ${where.join(' and ')}${p ? via(f, p) : ''}: ${effects.join('; ')}.`,
      path: hopsOf(finder, p),
    };
  });
}

export const lineOnControlLead: StateRule<'LINE_ON_CONTROL_LEAD'> = {
  kind: 'state',
  code: 'LINE_ON_CONTROL_LEAD',
  fires: { position: true, event: false },
  // A conductor on ground or on another line's A-lead or lamp lead in a state is on its coarse net.
  possibleIn({ coarse }) {
    const { nl } = coarse;
    const gnd = fixedNet(coarse, nl.gnd);
    const a = nl.lines.map((l) => fixedNet(coarse, l.a));
    const lamp = nl.lines.map((l) => fixedNet(coarse, l.l));
    return nl.lines.some((l, i) =>
      [fixedNet(coarse, l.t), fixedNet(coarse, l.r)].some(
        (r) => r === gnd || nl.lines.some((_, j) => j !== i && (r === a[j] || r === lamp[j])),
      ),
    );
  },
  find(f, out) {
    const { nl, facts } = f;
    const { roots, rootT, rootR, rootL, gnd } = facts;
    const d = nl.dense;
    const nLines = nl.lines.length;
    if (landingBuffer.length < nLines + 1) {
      landingBuffer = new Uint8Array(nLines + 1);
      rootABuffer = new Int32Array(nLines + 1);
    }
    if (controlMarks.length < roots.length) controlMarks = new Int32Array(roots.length);
    if (++stamp >= 0x7fffffff) {
      controlMarks.fill(0);
      stamp = 1;
    }
    const landings = landingBuffer;
    const rootA = rootABuffer;
    const marks = controlMarks;
    for (let j = 0; j < nLines; j++) {
      const ra = (rootA[j] = roots[d[nl.lines[j].a]]);
      marks[ra] = stamp;
      marks[rootL[j]] = stamp;
    }
    for (let i = 0; i < nLines; i++) {
      // Hot path (every state of a sweep): nothing allocated until a conductor lands somewhere.
      let any = false;
      for (let c = 0; c < 2; c++) {
        const r = c === 0 ? rootT[i] : rootR[i];
        if (c === 1 && r === rootT[i]) continue; // one net: the tip's landing says it
        // On ground, the A-leads of lines in use and shorted lamp leads are ground too: ground says it all.
        if (r === gnd) {
          if (!any) landings.fill(0, 0, nLines + 1);
          any = true;
          landings[nLines] |= 1 << (2 * c);
          continue;
        }
        if (marks[r] !== stamp) continue; // on no line's A-lead or lamp lead
        for (let j = 0; j < nLines; j++) {
          if (j === i) continue;
          const onA = r === rootA[j];
          const onL = r === rootL[j];
          if (!onA && !onL) continue;
          if (!any) landings.fill(0, 0, nLines + 1);
          any = true;
          landings[j] |= ((onA ? 1 : 0) | (onL ? 2 : 0)) << (2 * c);
        }
      }
      if (!any) continue;
      // in the order the targets are first met: the tip's (by line, or ground), then those of the ring alone
      for (let t = 0; t <= nLines; t++)
        if (landings[t] & TIP_BITS) out.push(landingFinding(f, i, t, landings[t]));
      for (let t = 0; t <= nLines; t++)
        if (landings[t] & RING_BITS && !(landings[t] & TIP_BITS))
          out.push(landingFinding(f, i, t, landings[t]));
    }
  },
};
