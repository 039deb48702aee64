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
import { firstCrossing, lastUnitLeadSentence, type TerminalPath } from '../paths';

interface Landing {
  conductor: Conductor;
  /** 'A' / 'L' of line index `on`, or ground. */
  lead: 'A' | 'L' | 'ground';
  on: number;
}

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

/** Landings grouped by the line they land on (index), or by the line count for ground. */
function addLanding(map: Map<number, Landing[]> | null, key: number, x: Landing): Map<number, Landing[]> {
  const out = map ?? new Map<number, Landing[]>();
  const list = out.get(key);
  if (list) list.push(x);
  else out.set(key, [x]);
  return out;
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
    const { nl, facts, finder } = f;
    const { roots, rootT, rootR, rootL, gnd } = facts;
    const d = nl.dense;
    const nLines = nl.lines.length;
    const rootA: number[] = new Array(nLines);
    for (let j = 0; j < nLines; j++) rootA[j] = roots[d[nl.lines[j].a]];
    for (let i = 0; i < nLines; i++) {
      // Hot path (every state of a sweep): nothing allocated until a conductor lands somewhere.
      let byTarget: Map<number, Landing[]> | null = null;
      for (let c = 0; c < 2; c++) {
        const conductor: Conductor = c === 0 ? 'tip' : 'ring';
        const r = c === 0 ? rootT[i] : rootR[i];
        if (c === 1 && r === rootT[i]) continue; // one net: the tip's landing says it
        // On ground, the A-leads of lines in use and shorted lamp leads are ground too: ground says it all.
        if (r === gnd) {
          byTarget = addLanding(byTarget, nLines, { conductor, lead: 'ground', on: -1 });
          continue;
        }
        for (let j = 0; j < nLines; j++) {
          if (j === i) continue;
          if (r === rootA[j]) byTarget = addLanding(byTarget, j, { conductor, lead: 'A', on: j });
          if (r === rootL[j]) byTarget = addLanding(byTarget, j, { conductor, lead: 'L', on: j });
        }
      }
      if (!byTarget) continue;
      const line = nl.lines[i];
      for (const landings of byTarget.values()) {
        const first = landings[0];
        const other = first.lead === 'ground' ? null : nl.lines[first.on];
        const target = first.lead === 'ground' ? nl.gnd : first.lead === 'A' ? other!.a : other!.l;
        const p: TerminalPath | null = pathIn(finder, first.conductor === 'tip' ? line.t : line.r, target);
        const where = landings
          .map((x) => `its ${x.conductor} on ${other ? `line ${other.number}'s ` : ''}${LEAD_WORDS[x.lead]}`)
          .join(' and ');
        const lines = other ? [line.number, other.number] : [line.number];
        const effects = [`line ${line.number} is seized or noisy with nobody on it`];
        if (landings.some((x) => x.lead === 'A'))
          effects.push(`line ${other!.number} looks in use (its A-lead worked with nobody off hook)`);
        if (landings.some((x) => x.lead === 'L'))
          effects.push(`line ${other!.number}'s lamp supply is on it (lamps dark or lit wrongly)`);
        out.push({
          code: 'LINE_ON_CONTROL_LEAD',
          severity: 'fault',
          sets: latchedOn(f, lines).map((s) => s.id),
          lines,
          stations: [],
          message: `Line ${line.number} has ${where}${p ? via(f, p) : ''}: ${effects.join('; ')}.`,
          path: hopsOf(finder, p),
        });
      }
    }
  },
};
