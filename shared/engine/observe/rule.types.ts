/** What a finding rule is and the facts of one state it reads (the registry is rules/index.ts). */
import type { CoarseNets } from '../model/coarse-nets';
import type { NetFacts } from '../model/facts';
import type { Netlist } from '../model/netlist';
import type { Mech } from '../model/nets';
import type { LineState, SimState } from '../sim/state.schema';
import type { Finding, FindingCode, LineObservation } from './evaluation.types';
import type { PathFinder } from './paths';

/** The per-line observations the findings read (joinedWith empty when an event alone is asked about). */
export type LineFacts = Pick<LineObservation, 'line' | 'status' | 'aClosed' | 'far' | 'joinedWith'>;

/** One state's facts, shared by every state rule of one evaluation. */
export interface FindingFacts {
  nl: Netlist;
  state: SimState;
  mech: Mech;
  facts: NetFacts;
  /** Per line index: the state's line, if the state names it. */
  lineStates: (LineState | undefined)[];
  lines: LineFacts[];
  /** Per set index: the lines it has selected, and whether it is off-hook or hands-free. */
  selected: number[][];
  active: boolean[];
  /** Per set index: its buzzer sounds (filled only while an intercom call is on). */
  buzzerOn: boolean[];
  /** Traces conductor paths; null when paths are not wanted (sweeps). */
  finder: PathFinder | null;
  /** Only what a KSU event adds to the findings of the sets' positions (see eventFindings). */
  eventsOnly: boolean;
}

/** What a clean proof knows of every state at once (search/clean-proof.ts). */
export interface CoarseFacts {
  /** Nets that the nets of every combination of set positions refine. */
  coarse: CoarseNets;
  /** The KSU's line states and intercom call in each event the sweep opens with (idle first). */
  events: readonly Pick<SimState, 'lines' | 'intercom'>[];
}

/** A finding kind that depends on the state: the sets' positions, a KSU event, or both. */
export interface StateRule<C extends FindingCode = FindingCode> {
  kind: 'state';
  code: C;
  /**
   * position: the sets' positions alone can raise it (the sweep sees it with the KSU idle); event: a KSU event
   * (ringing, hold, intercom) can raise it where the idle KSU does not.
   */
  fires: { position: boolean; event: boolean };
  /**
   * For an event rule: false when this KSU state cannot raise it whatever the sets do (the sweep skips the event);
   * given the nets of the sets' positions (`on`), false when it cannot raise it in them (a cheap test, no facts).
   */
  eventMayAdd?: (
    state: Pick<SimState, 'lines' | 'intercom'>,
    on?: { nl: Netlist; facts: NetFacts },
  ) => boolean;
  /** Listed with the other findings about one set: merged by set, then line, then registry order. */
  bySet?: boolean;
  /**
   * False only when no state whose nets refine the coarse ones can raise it, under any of the events (the clean
   * proof). A rule without it can always fire as far as the proof knows.
   */
  possibleIn?: (c: CoarseFacts) => boolean;
  /**
   * Appends its findings; with facts.eventsOnly, only those the KSU event raises. A bySet rule appends beside each
   * finding its position in the listing to `positions` (finding-memo.ts bySetPosition); other rules leave it.
   */
  find(facts: FindingFacts, out: Finding[], positions: number[]): void;
}

/** A finding kind of the wiring alone: wrong in every state, found once per netlist. */
export interface WiringRule<C extends FindingCode = FindingCode> {
  kind: 'wiring';
  code: C;
  find(nl: Netlist, withPaths: boolean): Finding[];
}

export type Rule<C extends FindingCode = FindingCode> = StateRule<C> | WiringRule<C>;

/** Exactly one rule per finding code, each under its own code; the order is the order findings are listed in. */
export type RuleRegistry = { readonly [C in FindingCode]: Rule<C> };
