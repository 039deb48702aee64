/**
 * The puzzles shipped with Leadbench, in three levels. Every one is checked by `npm run puzzles -- --check`:
 * its faults show at the sets, and its intended repair clears them and keeps the required functions.
 */
import { ShippedPuzzleSchema, type PuzzleLevel, type PuzzleSpecInput, type ShippedPuzzle } from '../puzzle.schema';
import { bakeryCounter, boatyard, dentalReception, freightDesk, surveyOffice } from './installations';

/** A puzzle as written here: its level comes from the list it stands in, its attempt limit from the schema's default unless given. */
type Entry = Omit<PuzzleSpecInput, 'level'> & { slug: string };

// Level 1: one fault, a symptom in the first few states tried.
const LEVEL_1: Entry[] = [
  {
    slug: 'dark-lamp-front-desk',
    title: 'The lamp that never lights',
    statement:
      'At the survey office the front desk says line 1 never lights on her set, even while the drawing room is talking on it. Find the cause and put it right.',
    plan: surveyOffice(),
    faults: [{ kind: 'lead-wrongly-lifted', part: 'front-desk', pair: 3, conductor: 'tip' }],
    repair: [{ kind: 'restore', part: 'front-desk', pair: 3 }],
    explanation:
      "Line 1's lamp lead (L, tip of pair 3) had been lifted at the front desk set, so its lamp had nothing to light it. Putting the lead back on its terminal restores the lamp; the A-lead and talk pair were never affected, which is why calls still worked.",
  },
  {
    slug: 'silent-line-two',
    title: 'Silence on line 2',
    statement:
      'The drawing room can make calls on lines 1 and 3 but hears nothing at all on line 2, although the lamp comes on. The front desk has no trouble.',
    plan: surveyOffice(),
    faults: [{ kind: 'lead-wrongly-lifted', part: 'drawing-room', pair: 4, conductor: 'both' }],
    repair: [{ kind: 'restore', part: 'drawing-room', pair: 4 }],
    explanation:
      "Line 2's talk pair (pair 4) was lifted in the drawing room set. The A-lead on pair 5 still closed, so the line seized and lit, but the handset was never across tip and ring.",
  },
  {
    slug: 'intercom-buzzes-front',
    title: 'Everyone answers 22',
    statement:
      'Dial 21 on the intercom and both sets at the survey office buzz; dial 22 and nobody does. Nothing else is wrong.',
    plan: surveyOffice(),
    faults: [{ kind: 'cross-connect-wrong', port: 2, pair: 18, lead: { kind: 'buzzer', station: 'st-21' } }],
    repair: [{ kind: 'cross-connect', port: 2, pair: 18, lead: { kind: 'buzzer', station: 'st-22' } }],
    explanation:
      "Pair 18 of station port 2 carried station 21's buzzer output instead of station 22's. The drawing room's buzzer follows whatever reaches pair 18 of its cable, so it answered the wrong code.",
  },
  {
    slug: 'two-dial-tones',
    title: 'Two dial tones at the back',
    statement:
      'At the dental practice, when reception takes line 1 and the back office takes line 2, each hears two dial tones. Fix it without losing the reception speaker.',
    plan: dentalReception(),
    faults: [{ kind: 'lead-left-on', part: 'back-office', pair: 23 }],
    repair: [{ kind: 'lead', part: 'back-office', change: { kind: 'lift', pair: 23, conductor: 'both' } }],
    explanation:
      "Both sets bring their common talk pair out on pair 23. Reception needs it for its hands-free add-on; the back office's should have been lifted. With both on, the adapter joined the two sets' talk circuits, and with them whatever lines they had selected.",
  },
  {
    slug: 'drawing-room-never-buzzes',
    title: 'Nobody answers 22',
    statement:
      'At the survey office, dialling 22 on the intercom buzzes nobody. Dialling 21 buzzes the front desk as it should, and calls on every line work from both sets.',
    plan: surveyOffice(),
    faults: [{ kind: 'open-conductor', cable: 'drawing-cord', pair: 18, conductor: 'ring', end: 'to' }],
    repair: [{ kind: 'cable-pair', cable: 'drawing-cord', pair: 18 }],
    explanation:
      "The ring of pair 18 (the buzzer return) was broken in the drawing room's cable near the KSU. Station 22's buzzer output reached the set on one conductor only, so the buzzer had no circuit; everything on the other pairs worked. Re-terminating (or replacing) pair 18 restores it.",
  },
];

// Level 2: the symptom needs the right state, or the cause is one step removed.
const LEVEL_2: Entry[] = [
  {
    slug: 'line-two-will-not-seize',
    title: 'Line 2 lights only for one',
    statement:
      'At the survey office, when the front desk picks up on line 2 the lamp stays dark on both sets and the exchange gives no dial tone; the drawing room can use line 2 normally.',
    plan: surveyOffice(),
    faults: [{ kind: 'lead-wrongly-lifted', part: 'front-desk', pair: 5, conductor: 'tip' }],
    repair: [{ kind: 'restore', part: 'front-desk', pair: 5 }],
    explanation:
      "The front desk's line 2 A-lead (tip of pair 5) was lifted. Without A reaching ground through the hookswitch, the line circuit never saw the set seize the line: no lamp, and the exchange side stayed idle.",
  },
  {
    slug: 'clerk-set-swapped',
    title: 'The clerk’s new set',
    statement:
      "The freight desk clerk's set was swapped last week. Since then the dispatcher's lamps for lines 6 to 9 misbehave whenever the clerk is on a call. Find out what changed and cure it with lead work only.",
    plan: freightDesk('six-key'),
    faults: [{ kind: 'wrong-set-fitted', part: 'clerk', template: 'six-key-hf' }],
    repair: [
      { kind: 'lead', part: 'clerk', change: { kind: 'lift', pair: 23, conductor: 'both' } },
      { kind: 'lead', part: 'clerk', change: { kind: 'lift', pair: 24, conductor: 'both' } },
      { kind: 'lead', part: 'clerk', change: { kind: 'lift', pair: 25, conductor: 'both' } },
    ],
    explanation:
      "The replacement set is the hands-free option, which brings its own circuits out on pairs 23–25. On this cable those pairs carry the A and lamp leads of lines 7 to 9 for the ten-key set, so the clerk's switching reached the dispatcher's lines. Lifting pairs 23–25 in the clerk's set makes it behave like the set it replaced.",
  },
  {
    slug: 'bakehouse-buzzer',
    title: 'Who is 32?',
    statement:
      'At the corner bakery, dialling 31 buzzes the counter and the bakehouse together, and 32 buzzes nobody.',
    plan: bakeryCounter(),
    faults: [{ kind: 'cross-connect-wrong', port: 1, pair: 17, lead: { kind: 'buzzer', station: 'st-31' } }],
    repair: [{ kind: 'cross-connect', port: 1, pair: 17, lead: { kind: 'buzzer', station: 'st-32' } }],
    explanation:
      "The bakehouse buzzer was correctly moved to spare pair 17, but at the KSU pair 17 of port 1 was strapped to station 31's buzzer output instead of station 32's.",
  },
  {
    slug: 'workshop-on-the-wrong-jack',
    title: 'The workshop answers for the office',
    statement:
      "At the boatyard, calls to intercom 61 buzz the office and the workshop, and 63 buzzes nobody. The workshop's cable was unplugged during painting.",
    plan: boatyard(),
    faults: [{ kind: 'cable-wrong-port', cable: 'workshop-cord', end: 'to', part: 'adapter', port: 'jack-3' }],
    repair: [{ kind: 'replug', cable: 'workshop-cord', end: 'to', part: 'ksu', port: 'port-2' }],
    explanation:
      "The workshop cord went back into the spare jack of the office adapter instead of station port 2. On port 1 its buzzer pair 18 carries station 61, so the workshop buzzed with the office and station 63's output reached nobody.",
  },
  {
    slug: 'counter-lamp-line-one',
    title: 'Line 1 never lights',
    statement:
      'At the corner bakery line 1 works for calls on both sets, but its lamp stays dark on the counter and in the bakehouse, even during a call. Lines 2 and 3 light normally.',
    plan: bakeryCounter(),
    faults: [{ kind: 'reversed-pair', cable: 'counter-cord', pair: 3, end: 'from' }],
    repair: [{ kind: 'cable-pair', cable: 'counter-cord', pair: 3 }],
    explanation:
      "Tip and ring of pair 3 (line 1's lamp lead L and lamp ground LG) were swapped where the counter's cord was terminated. The set's lamps share one lamp ground, so the swap put the KSU's lamp lead for line 1 straight onto ground: no line 1 lamp anywhere on the cable. Re-terminating pair 3 the right way round cures it.",
  },
];

// Level 3: two faults, or a fault that shows only in a combined state.
const LEVEL_3: Entry[] = [
  {
    slug: 'back-office-two-faults',
    title: 'Crossed talk and a dead buzzer',
    statement:
      'At the dental practice two things went wrong after a rewiring: reception and the back office sometimes hear each other’s lines, and the back office never buzzes on the intercom.',
    plan: dentalReception(),
    faults: [
      { kind: 'lead-left-on', part: 'back-office', pair: 23 },
      { kind: 'cross-connect-wrong', port: 1, pair: 17, lead: null },
    ],
    repair: [
      { kind: 'lead', part: 'back-office', change: { kind: 'lift', pair: 23, conductor: 'both' } },
      { kind: 'cross-connect', port: 1, pair: 17, lead: { kind: 'buzzer', station: 'st-42' } },
    ],
    explanation:
      "Two faults: the back office's common talk pair 23 was left on, joining its talk circuit to reception's through the adapter; and at the KSU nothing was cross-connected to pair 17, where the back office buzzer had been moved.",
  },
  {
    slug: 'speaker-will-not-hold',
    title: 'The wrong pair lifted',
    statement:
      'Reception complains that the speaker no longer reaches the line, and that the back office can be heard on reception’s lines.',
    plan: dentalReception(),
    faults: [
      { kind: 'lead-wrongly-lifted', part: 'reception', pair: 23, conductor: 'both' },
      { kind: 'lead-left-on', part: 'back-office', pair: 23 },
    ],
    repair: [
      { kind: 'restore', part: 'reception', pair: 23 },
      { kind: 'lead', part: 'back-office', change: { kind: 'lift', pair: 23, conductor: 'both' } },
    ],
    explanation:
      "Pair 23 was lifted in the wrong set: reception's, which its add-on needs to reach the line, while the back office's common talk pair 23 was left on and joined its talk circuit to the shared cable.",
  },
  {
    slug: 'clerk-private-pair',
    title: 'Line 9 lights by itself',
    statement:
      "At the freight desk, line 9 on the dispatcher's set lights whenever the clerk lifts the handset, whichever line the clerk uses.",
    attemptLimit: 2,
    plan: freightDesk('six-key-hf'),
    faults: [{ kind: 'lead-left-on', part: 'clerk', pair: 25 }],
    repair: [{ kind: 'lead', part: 'clerk', change: { kind: 'lift', pair: 25, conductor: 'both' } }],
    explanation:
      "The clerk's hands-free set brings its A-lead control out on pair 25, where this cable carries line 9's A-lead. Left on, the clerk's hookswitch grounded line 9's A-lead and the line circuit lit it.",
  },
  {
    slug: 'boatyard-two-faults',
    title: 'A busy morning at the boatyard',
    statement:
      'After painting, the workshop buzzes with the office and the chandlery has no lamp on line 2. Find every cause.',
    plan: boatyard(),
    faults: [
      { kind: 'cable-wrong-port', cable: 'workshop-cord', end: 'to', part: 'adapter', port: 'jack-3' },
      { kind: 'lead-wrongly-lifted', part: 'chandlery', pair: 6, conductor: 'tip' },
    ],
    repair: [
      { kind: 'replug', cable: 'workshop-cord', end: 'to', part: 'ksu', port: 'port-2' },
      { kind: 'restore', part: 'chandlery', pair: 6 },
    ],
    explanation:
      "The workshop cord sat in the office adapter instead of station port 2, and the chandlery's line 2 lamp lead (tip of pair 6) was lifted.",
  },
  {
    slug: 'bakery-crossed-and-dark',
    title: 'Crossed at the counter',
    statement:
      'At the corner bakery the bakehouse never buzzes, and the counter has no talk on line 3.',
    plan: bakeryCounter(),
    faults: [
      { kind: 'cross-connect-wrong', port: 1, pair: 17, lead: null },
      { kind: 'lead-wrongly-lifted', part: 'counter', pair: 7, conductor: 'ring' },
    ],
    repair: [
      { kind: 'cross-connect', port: 1, pair: 17, lead: { kind: 'buzzer', station: 'st-32' } },
      { kind: 'restore', part: 'counter', pair: 7 },
    ],
    explanation:
      "Station 32's buzzer output was missing from pair 17 at the KSU, and the ring lead of line 3's talk pair (pair 7) had been lifted at the counter.",
  },
  {
    slug: 'front-desk-split-pair',
    title: 'Two dead lines at the front desk',
    statement:
      'At the survey office the front desk gets no dial tone on line 1 or line 2, though both lamps come on when she takes them. The drawing room uses both lines normally; the front desk cord was re-made last week.',
    attemptLimit: 2,
    plan: surveyOffice(),
    faults: [{ kind: 'split-pair', cable: 'front-cord', pair: 1, withPair: 4, conductor: 'tip', end: 'from' }],
    repair: [{ kind: 'cable-pair', cable: 'front-cord', pair: 1 }],
    explanation:
      "When the front desk cord was re-made, the tip of pair 1 (line 1) and the tip of pair 4 (line 2) were exchanged at the set end: a split pair. Each line's loop at the front desk ran from one line's tip to the other line's ring, so neither gave dial tone there, while the A-leads on pairs 2 and 5 still lit the lamps; with both lines in use the two circuits also hum into each other. Re-terminating pairs 1 and 4 on their own colours cures it.",
  },
];

const inLevel = (level: PuzzleLevel, entries: Entry[]): ShippedPuzzle[] =>
  entries.map((p) => ShippedPuzzleSchema.parse({ ...p, level }));

export const SHIPPED_PUZZLES: readonly ShippedPuzzle[] = [
  ...inLevel(1, LEVEL_1),
  ...inLevel(2, LEVEL_2),
  ...inLevel(3, LEVEL_3),
];
