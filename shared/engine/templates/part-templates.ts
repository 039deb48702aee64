/**
 * The shipped part templates, as data. The pair plan is written down in ./README.md.
 * Builder helpers below only spell out repeated rows (one line's leads, one key's springs); they hold no behaviour.
 */
import type { ContactSpec, ElementSpec, KeySpec, LeadSpec, PartTemplate } from './template.types';

/** Pairs of line k (k ≤ 5) in the station plan: talk, A-lead, lamp. */
export function standardLinePairs(line: number): { talk: number; a: number; lamp: number } {
  return { talk: 3 * line - 2, a: 3 * line - 1, lamp: 3 * line };
}

/** Our own scheme for lines 6–9 of the ten-key set: talk pair, and a pair with tip = A lead, ring = lamp lead. */
export const TEN_KEY_EXTRA_TALK_PAIRS = [16, 19, 20, 21] as const;
export function tenKeyExtraPairs(line: number): { talk: number; aLamp: number } {
  return { talk: TEN_KEY_EXTRA_TALK_PAIRS[line - 6], aLamp: 22 + (line - 6) };
}

export const BUZZER_PAIR = 18;
export const SPARE_PAIR = 17;
export const HANDS_FREE_PAIRS = { talk: 23, mute: 24, aControl: 25 } as const;

const t = (line: number, lead: 'T' | 'R' | 'A' | 'L'): string => `L${line}.${lead}`;

type LeadSide = Pick<LeadSpec, 'designation' | 'terminal' | 'purpose' | 'role'>;

/** One cable pair's two leads: the tip and the ring conductor, with the pair's scope. */
function pairLeads(pair: number, scope: LeadSpec['scope'], tip: LeadSide, ring: LeadSide): LeadSpec[] {
  return [
    { pair, conductor: 'tip', ...tip, scope },
    { pair, conductor: 'ring', ...ring, scope },
  ];
}

function talkPairLeads(line: number, pair: number): LeadSpec[] {
  const role = `line ${line} talk pair`;
  return pairLeads(
    pair,
    'bus',
    { designation: `L${line} T`, terminal: t(line, 'T'), purpose: `Line ${line} tip`, role },
    { designation: `L${line} R`, terminal: t(line, 'R'), purpose: `Line ${line} ring`, role },
  );
}

const lampLead = (line: number): LeadSide => ({
  designation: `L${line} L`,
  terminal: t(line, 'L'),
  purpose: `Line ${line} lamp lead`,
  role: `line ${line} lamp lead`,
});

function standardLineLeads(line: number): LeadSpec[] {
  const p = standardLinePairs(line);
  return [
    ...talkPairLeads(line, p.talk),
    ...pairLeads(
      p.a,
      'bus',
      {
        designation: `L${line} A`,
        terminal: t(line, 'A'),
        purpose: `Line ${line} A-lead (hold control)`,
        role: `line ${line} A-lead`,
      },
      {
        designation: `L${line} A1`,
        terminal: 'A1',
        purpose: `Line ${line} A1 (A-lead ground)`,
        role: `line ${line} A1`,
      },
    ),
    ...pairLeads(p.lamp, 'bus', lampLead(line), {
      designation: `L${line} LG`,
      terminal: 'LG',
      purpose: `Line ${line} lamp ground`,
      role: `line ${line} lamp ground`,
    }),
  ];
}

function tenKeyExtraLineLeads(line: number): LeadSpec[] {
  const p = tenKeyExtraPairs(line);
  return [
    ...talkPairLeads(line, p.talk),
    ...pairLeads(
      p.aLamp,
      'bus',
      {
        designation: `L${line} A`,
        terminal: t(line, 'A'),
        purpose: `Line ${line} A-lead, switched by line key ${line}`,
        role: `line ${line} A-lead`,
      },
      lampLead(line),
    ),
  ];
}

const buzzerLeads: LeadSpec[] = pairLeads(
  BUZZER_PAIR,
  'station',
  { designation: 'BZ', terminal: 'BZ.T', purpose: 'Intercom buzzer', role: 'buzzer pair' },
  { designation: 'BZ R', terminal: 'BZ.R', purpose: 'Intercom buzzer return', role: 'buzzer pair' },
);

const handsFreeSetLeads: LeadSpec[] = [
  ...pairLeads(
    HANDS_FREE_PAIRS.talk,
    'private',
    {
      designation: 'CT',
      terminal: 'CT',
      purpose: 'Common talk tip, as switched by the line keys (for the hands-free add-on)',
      role: 'talk pair',
    },
    {
      designation: 'CR',
      terminal: 'CR',
      purpose: 'Common talk ring, as switched by the line keys (for the hands-free add-on)',
      role: 'talk pair',
    },
  ),
  ...pairLeads(
    HANDS_FREE_PAIRS.mute,
    'private',
    {
      designation: 'MU',
      terminal: 'MU',
      purpose: 'Handset mute lead (for the hands-free add-on)',
      role: 'mute lead',
    },
    {
      designation: 'MR',
      terminal: 'MR',
      purpose: 'Handset mute return (for the hands-free add-on)',
      role: 'mute lead',
    },
  ),
  ...pairLeads(
    HANDS_FREE_PAIRS.aControl,
    'private',
    {
      designation: 'AC',
      terminal: 'AC',
      purpose: 'A-lead common, the A-lead control for the hands-free add-on',
      role: 'A-lead control',
    },
    {
      designation: 'A1',
      terminal: 'A1',
      purpose: 'A1 side of the A-lead control (for the hands-free add-on)',
      role: 'A-lead control',
    },
  ),
];

function lineKeys(lines: number): KeySpec[] {
  const keys: KeySpec[] = [];
  for (let k = 1; k <= lines; k++) keys.push({ index: k, label: `Line ${k}`, kind: 'line', line: k });
  keys.push({ index: lines + 1, label: 'Hold', kind: 'hold' });
  return keys;
}

/** A latched line key closes three springs: talk tip, talk ring and A-lead, each from the set's commons. */
function lineKeySprings(lines: number): ContactSpec[] {
  const out: ContactSpec[] = [];
  for (let k = 1; k <= lines; k++) {
    const when = { key: k };
    out.push({ a: 'CT', b: t(k, 'T'), when, label: `Line key ${k}, tip spring` });
    out.push({ a: 'CR', b: t(k, 'R'), when, label: `Line key ${k}, ring spring` });
    out.push({ a: 'AC', b: t(k, 'A'), when, label: `Line key ${k}, A-lead spring` });
  }
  return out;
}

const setCommonContacts: ContactSpec[] = [
  { a: 'NT', b: 'CT', when: 'offHook', label: 'Hookswitch, talk tip' },
  { a: 'NR', b: 'CR', when: 'offHook', label: 'Hookswitch, talk ring' },
  { a: 'AC', b: 'AH', when: 'offHook', label: 'Hookswitch, A-lead' },
  { a: 'AH', b: 'A1', when: 'notHoldPressed', label: 'Hold key break contact' },
];

function setElements(lines: number): ElementSpec[] {
  const out: ElementSpec[] = [{ kind: 'network', a: 'NT', b: 'NR', label: 'Speech network' }];
  for (let k = 1; k <= lines; k++)
    out.push({ kind: 'lamp', a: t(k, 'L'), b: 'LG', key: k, label: `Line ${k} lamp` });
  out.push({ kind: 'buzzer', a: 'BZ.T', b: 'BZ.R', label: 'Intercom buzzer' });
  return out;
}

function straps(lines: number): { line: number; tip: string; ring: string }[] {
  return Array.from({ length: lines }, (_, i) => ({ line: i + 1, tip: t(i + 1, 'T'), ring: t(i + 1, 'R') }));
}

const setPorts = [{ name: 'cord', gender: 'plug' as const, label: 'Mounting cord' }];

function sixKey(handsFree: boolean): PartTemplate {
  const leads = [1, 2, 3, 4, 5].flatMap(standardLineLeads).concat(buzzerLeads);
  return {
    id: handsFree ? 'six-key-hf' : 'six-key',
    kind: 'set',
    title: handsFree
      ? 'Six-key set, five lines and hold, wired for hands-free'
      : 'Six-key set, five lines and hold',
    description: handsFree
      ? 'Five line keys and a hold key. Its common talk pair, mute lead and A-lead control are brought out on pairs 23–25 for a hands-free add-on.'
      : 'Five line keys and a hold key. Pairs 17 and 19–25 are spare.',
    ports: setPorts,
    leadPort: 'cord',
    keys: lineKeys(5),
    leads: handsFree ? leads.concat(handsFreeSetLeads) : leads,
    elements: setElements(5),
    contacts: [...lineKeySprings(5), ...setCommonContacts],
    ringerStraps: straps(5),
    handsFreeWiring: handsFree,
  };
}

function tenKey(): PartTemplate {
  const leads = [1, 2, 3, 4, 5]
    .flatMap(standardLineLeads)
    .concat([6, 7, 8, 9].flatMap(tenKeyExtraLineLeads), buzzerLeads);
  return {
    id: 'ten-key',
    kind: 'set',
    title: 'Ten-key set, nine lines and hold',
    description:
      'Nine line keys and a hold key. Lines 6–9 use pairs 16 and 19–21 for talk and pairs 22–25 for A-lead (tip) and lamp lead (ring).',
    ports: setPorts,
    leadPort: 'cord',
    keys: lineKeys(9),
    leads,
    elements: setElements(9),
    contacts: [...lineKeySprings(9), ...setCommonContacts],
    ringerStraps: straps(9),
  };
}

const singleLine: PartTemplate = {
  id: 'single-line',
  kind: 'set',
  title: 'Single-line set',
  description:
    'No line keys: always on the line wired to pair 1; its hookswitch closes the A-lead on pair 2.',
  ports: setPorts,
  leadPort: 'cord',
  keys: [],
  leads: standardLineLeads(1).slice(0, 4),
  // Its tone dial is powered from the line and dials only with tip and ring the right way round.
  elements: [
    {
      kind: 'network',
      a: 'NT',
      b: 'NR',
      label: 'Speech network',
      polarised: { fails: 'its tone dial' },
    },
  ],
  contacts: [
    { a: 'NT', b: t(1, 'T'), when: 'offHook', label: 'Hookswitch, tip' },
    { a: 'NR', b: t(1, 'R'), when: 'offHook', label: 'Hookswitch, ring' },
    { a: t(1, 'A'), b: 'A1', when: 'offHook', label: 'Hookswitch, A-lead' },
  ],
  ringerStraps: straps(1),
  fixedLines: [1],
};

const handsFreeAddOn: PartTemplate = {
  id: 'hands-free-unit',
  kind: 'add-on',
  title: 'Hands-free add-on',
  description:
    'Loudspeaker and microphone unit. Its plug passes every pin through to its jack; its on/off switch puts its own speech network on pairs 23–25 and closes the served set’s A-lead common to A1.',
  ports: [
    { name: 'cord', gender: 'plug', label: 'Cord' },
    { name: 'set', gender: 'jack', label: 'Set jack' },
  ],
  leadPort: 'cord',
  bridges: [['cord', 'set']],
  leads: [
    {
      pair: 23,
      conductor: 'tip',
      designation: 'CT',
      terminal: 'CT',
      purpose: 'Served set’s common talk tip',
      role: 'talk pair',
      scope: 'private',
    },
    {
      pair: 23,
      conductor: 'ring',
      designation: 'CR',
      terminal: 'CR',
      purpose: 'Served set’s common talk ring',
      role: 'talk pair',
      scope: 'private',
    },
    {
      pair: 24,
      conductor: 'tip',
      designation: 'MU',
      terminal: 'MU',
      purpose: 'Served set’s handset mute lead',
      role: 'mute lead',
      scope: 'private',
    },
    {
      pair: 24,
      conductor: 'ring',
      designation: 'MR',
      terminal: 'MR',
      purpose: 'Served set’s handset mute return',
      role: 'mute lead',
      scope: 'private',
    },
    {
      pair: 25,
      conductor: 'tip',
      designation: 'AC',
      terminal: 'AC',
      purpose: 'Served set’s A-lead common',
      role: 'A-lead control',
      scope: 'private',
    },
    {
      pair: 25,
      conductor: 'ring',
      designation: 'A1',
      terminal: 'A1',
      purpose: 'A1 side of the served set’s A-lead control',
      role: 'A-lead control',
      scope: 'private',
    },
  ],
  elements: [{ kind: 'network', a: 'HT', b: 'HR', label: 'Hands-free speech network' }],
  contacts: [
    { a: 'HT', b: 'CT', when: 'handsFreeOn', label: 'On/off switch, talk tip' },
    { a: 'HR', b: 'CR', when: 'handsFreeOn', label: 'On/off switch, talk ring' },
    { a: 'MU', b: 'MR', when: 'handsFreeOn', label: 'On/off switch, handset mute' },
    { a: 'AC', b: 'AX', when: 'handsFreeOn', label: 'On/off switch, A-lead control' },
    // The served set's hold key opens the control loop, so a hands-free call can be held like a handset call.
    {
      a: 'AX',
      b: 'A1',
      when: 'notHoldPressed',
      label: 'A-lead control, opened by the served set’s hold key',
    },
  ],
};

const bridgingAdapter: PartTemplate = {
  id: 'bridging-adapter',
  kind: 'adapter',
  title: 'Bridging adapter, two jacks and one plug',
  description: 'Parallels every pin of its plug and both jacks, so two sets share one station cable.',
  ports: [
    { name: 'plug', gender: 'plug', label: 'Plug' },
    { name: 'jack-1', gender: 'jack', label: 'Jack 1' },
    { name: 'jack-2', gender: 'jack', label: 'Jack 2' },
  ],
  bridges: [['plug', 'jack-1', 'jack-2']],
  leads: [],
  elements: [],
  contacts: [],
};

const bridgingAdapterFour: PartTemplate = {
  id: 'bridging-adapter-4',
  kind: 'adapter',
  title: 'Bridging adapter, four jacks and one plug',
  description: 'Parallels every pin of its plug and four jacks.',
  ports: [
    { name: 'plug', gender: 'plug', label: 'Plug' },
    ...[1, 2, 3, 4].map((n) => ({ name: `jack-${n}`, gender: 'jack' as const, label: `Jack ${n}` })),
  ],
  bridges: [['plug', 'jack-1', 'jack-2', 'jack-3', 'jack-4']],
  leads: [],
  elements: [],
  contacts: [],
};

/** The KSU's ports and circuits depend on the plan (lines, stations, ports); the model builds them. */
const ksu: PartTemplate = {
  id: 'ksu',
  kind: 'ksu',
  title: 'Key service unit',
  description:
    'One line circuit per outside line (talk pair, A-lead sensing with hold bridge, lamp drive) and an intercom with one buzzer output per station. Station ports are jacks; A1 and LG are one internal ground.',
  ports: [],
  leads: [],
  elements: [],
  contacts: [],
};

export const TEMPLATES: readonly PartTemplate[] = [
  singleLine,
  sixKey(false),
  sixKey(true),
  tenKey(),
  handsFreeAddOn,
  bridgingAdapter,
  bridgingAdapterFour,
  ksu,
];

const byId = new Map(TEMPLATES.map((tpl) => [tpl.id, tpl]));

export function getTemplate(id: string): PartTemplate | undefined {
  return byId.get(id);
}

/** KSU station port names: "port-1" … */
export function ksuPortName(port: number): string {
  return `port-${port}`;
}
