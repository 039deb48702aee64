/**
 * Clean proof: that no state of a plan (any combination of set positions with any KSU event the sweep visits) shows
 * a finding of a state rule, without visiting the states. Over coarse nets that every state's nets refine
 * (model/coarse-nets.ts), each state rule says whether it could fire (`possibleIn`). Argument: ./README.md
 * ("Clean proof").
 */
import {
  applyActions,
  buildCoarseNets,
  countWords,
  evaluate,
  FINDING_TITLES,
  getNetlist,
  initialState,
  RULES,
  type CoarsePosition,
  type Plan,
  type StateRule,
} from './engine-port';
import { eventActions, setMoves, sweepEvents, type SweepOptions } from './sweep';

export type CleanProof = { proven: true; words: string } | { proven: false; reason: string };

const STATE_RULES = Object.values(RULES).filter((r): r is StateRule => r.kind === 'state');

/** Every position the sweep puts each set in, as the coarse nets read it (a key that is no line key reads as none). */
export function coarsePositions(plan: Plan): CoarsePosition[][] {
  const nl = getNetlist(plan);
  return plan.sets.map((_, i) =>
    setMoves(plan, i).map((m) => {
      const key = m.key ?? 0;
      const valid = key > 0 && key < nl.sets[i].keyLine.length && nl.sets[i].keyLine[key] > 0;
      return { offHook: m.offHook, pressedKey: valid ? key : 0, handsFreeOn: m.handsFree };
    }),
  );
}

/** Whether no state of the plan can show a state rule's finding, and in words why (or why it could not say). */
export function proveClean(plan: Plan, opts: Pick<SweepOptions, 'events'> = {}): CleanProof {
  const nl = getNetlist(plan);
  const positions = coarsePositions(plan);
  const start = initialState(plan);
  const events = sweepEvents(plan, opts.events).map((e) => applyActions(plan, start, eventActions(plan, e)));
  const coarse = buildCoarseNets(nl, positions);
  const possible: string[] = [];
  for (const rule of STATE_RULES) {
    if (!rule.possibleIn || rule.possibleIn({ coarse, events })) possible.push(FINDING_TITLES[rule.code]);
  }
  if (possible.length)
    return { proven: false, reason: `The clean proof could not rule out: ${possible.join('; ')}.` };
  // The idle state is one of the states: a finding there would contradict the proof, so never call it clean.
  const idle = evaluate(plan, start, { paths: false }).findings.filter((f) => RULES[f.code].kind === 'state');
  if (idle.length) return { proven: false, reason: `The idle state shows ${FINDING_TITLES[idle[0].code]}.` };
  const combinations = positions.reduce((p, ps) => p * ps.length, 1);
  return {
    proven: true,
    words:
      `Complete by proof, without visiting each state: in none of the ${countWords(combinations)} combinations ` +
      `of the ${plan.sets.length} sets' positions, with any of the ${events.length} KSU events, can the wiring ` +
      'join two lines, put a line on ground or on a control lead, let a set hear a line it has not selected, ' +
      'light a line nobody is on, or ring or buzz the wrong sets. Only wiring findings (wrong in every state) remain.',
  };
}
