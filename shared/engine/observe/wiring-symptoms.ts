/**
 * Symptoms of cable wiring faults that the nets alone do not show (common practice, no published source):
 * - a polarised speech network (template field `polarised`, e.g. a line-powered tone dial) reached with tip and
 *   ring reversed: talk still works, the polarised part does not. A reversed lamp pair needs nothing here: a
 *   set's lamps share one lamp ground, so the reversal grounds the lamp lead and the nets already show it dark;
 * - a line in use whose conductors run over a split pair hums and picks up the circuit of the other pair.
 * Breaks, exchanged and joined conductors need nothing here: the netlist already carries them.
 */
import { pinOf } from '../document/cable-code';
import type { NetFacts } from '../model/facts';
import { terminalId, type ElementInfo, type Netlist } from '../model/netlist';
import { splitPins, wiringFaultWords } from '../model/cable-faults';
import type { Evaluation } from './evaluation.types';
import type { PartTemplate } from '../templates/template.types';

interface Polarised {
  element: ElementInfo;
  fails: string;
}

interface Split {
  cable: string;
  words: string;
  /** Terminals of the from-end pins of each of the two pairs. */
  pins: number[][];
}

interface WiringLayout {
  polarised: Polarised[];
  splits: Split[];
}

const layouts = new WeakMap<Netlist, WiringLayout>();

/** Templates with a polarised element (most have none, and their elements need no look-up). */
const polarisedTemplates = new WeakMap<PartTemplate, boolean>();

function hasPolarised(tpl: PartTemplate): boolean {
  let has = polarisedTemplates.get(tpl);
  if (has === undefined) polarisedTemplates.set(tpl, (has = tpl.elements.some((x) => !!x.polarised)));
  return has;
}

function layoutOf(nl: Netlist): WiringLayout {
  let layout = layouts.get(nl);
  if (layout) return layout;
  const polarised: Polarised[] = [];
  for (const e of nl.elements) {
    if (e.owner < 0) continue;
    const tpl = nl.parts[e.part].template;
    if (!tpl || !hasPolarised(tpl)) continue;
    const [a, b] = [nl.terminals[e.a].name, nl.terminals[e.b].name];
    const spec = tpl.elements.find((x) => x.kind === e.kind && x.a === a && x.b === b);
    if (spec?.polarised) polarised.push({ element: e, fails: spec.polarised.fails });
  }
  const splits: Split[] = [];
  for (const c of nl.plan.cables) {
    const from = nl.partById.get(c.from.part);
    if (!from) continue;
    for (const { fault, pins } of splitPins(c)) {
      const terms = (pair: number) =>
        pins
          .filter((pin) => pin === pinOf(pair, 'tip') || pin === pinOf(pair, 'ring'))
          .map((pin) => terminalId(nl, from.index, `${c.from.port}:${pin}`))
          .filter((t) => t >= 0);
      if (fault.kind !== 'split-pair') continue;
      splits.push({
        cable: c.label || c.id,
        words: wiringFaultWords(fault),
        pins: [terms(fault.pair), terms(fault.withPair)],
      });
    }
  }
  layout = { polarised, splits };
  layouts.set(nl, layout);
  return layout;
}

/** The evaluation with the polarity and crosstalk symptoms added (the same object when there are none). */
export function withWiringSymptoms(nl: Netlist, facts: NetFacts, ev: Evaluation): Evaluation {
  const { polarised, splits } = layoutOf(nl);
  if (!polarised.length && !splits.length) return ev;
  const { roots, rootT, rootR } = facts;
  const root = (t: number) => (nl.dense[t] >= 0 ? roots[nl.dense[t]] : -1 - t);
  // Observations may be kept from an earlier evaluation (observations.ts): what changes here is a copy.
  const copiedSets = new Set<number>();
  const note = (owner: number, text: string) => {
    if (!copiedSets.has(owner)) {
      copiedSets.add(owner);
      const obs = ev.sets[owner];
      ev.sets[owner] = { ...obs, ...(obs.notes ? { notes: [...obs.notes] } : {}) };
    }
    (ev.sets[owner].notes ??= []).push(text);
  };

  for (const { element: e, fails } of polarised) {
    const ra = root(e.a);
    const rb = root(e.b);
    if (ra === rb) continue;
    if (e.kind !== 'network') continue;
    for (const i of facts.hears[e.owner]) {
      if (ra === rootR[i] && rb === rootT[i])
        note(
          e.owner,
          `On line ${nl.lines[i].number} ${fails} does not work: tip and ring reach it reversed.`,
        );
    }
  }

  for (const split of splits) {
    // The circuits (lines) each pair of the split carries in this state.
    const linesOn = split.pins.map((terms) => {
      const rs = new Set(terms.map(root));
      return ev.lines.filter((_, i) => rs.has(rootT[i]) || rs.has(rootR[i])).map((l) => l.line);
    });
    const inUse = (n: number) => ev.lines.find((l) => l.line === n)?.status === 'in-use';
    for (const [side, lines] of linesOn.entries()) {
      const others = linesOn[1 - side].filter((n) => inUse(n) && !lines.includes(n));
      for (const n of lines) {
        if (!inUse(n)) continue;
        const obs = ev.lines.find((l) => l.line === n)!;
        const heard = others.length ? `, and line ${others.join(' and ')} is heard faintly` : '';
        const text = `Hum on line ${n}${heard}: in cable ${split.cable} ${split.words}.`;
        if (!obs.noise?.includes(text)) (obs.noise ??= []).push(text);
      }
    }
  }
  return ev;
}
