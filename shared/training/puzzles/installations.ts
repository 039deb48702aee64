/**
 * Healthy installations the shipped puzzles plant their faults in, made with one small builder.
 * All premises, names and numbers are invented.
 */
import {
  BUZZER_PAIR,
  HANDS_FREE_PAIRS,
  SPARE_PAIR,
  standardCrossConnect,
  type AddOn,
  type Cable,
  type CrossConnect,
  type KeySet,
  type LeadChange,
  type Plan,
  type Station,
} from '../../engine/index';

/** The station port that sets share through the installation's bridging adapter. */
const SHARED_PORT = 1;

type SetInput = Omit<KeySet, 'ringerLines' | 'leadChanges'> &
  Partial<Pick<KeySet, 'ringerLines' | 'leadChanges'>> & {
    /**
     * A second set on the shared cable: its buzzer lead moved from pair 18 to the spare pair, where the KSU
     * straps its station's buzzer output on the shared port.
     */
    buzzerOnSparePair?: boolean;
  };

interface InstallationInput {
  name: string;
  description: string;
  lines: string[];
  /** First three digits of the lines' directory numbers; the line number is added. */
  exchange: string;
  stations: Station[];
  ports: number;
  sets: SetInput[];
  addOns?: AddOn[];
  /** Template of the bridging adapter plugged into the shared port by 'station-cable', if sets share one. */
  adapter?: 'bridging-adapter' | 'bridging-adapter-4';
  /** Cables besides the station cable. */
  cables: Cable[];
  handsFreeSets?: string[];
}

const cable = (id: string, from: string, fromPort: string, to: string, toPort: string): Cable => ({
  id,
  from: { part: from, port: fromPort },
  to: { part: to, port: toPort },
});
const station = (code: string, label: string): Station => ({ id: `st-${code}`, code, label });
const movedBuzzer = (): LeadChange => ({ kind: 'move', pair: BUZZER_PAIR, toPair: SPARE_PAIR });
/** A hands-free set used without its add-on: its private pairs lifted. */
const privatePairsLifted = (): LeadChange[] =>
  Object.values(HANDS_FREE_PAIRS).map((pair) => ({ kind: 'lift', pair, conductor: 'both' }));

export function installation(input: InstallationInput): Plan {
  const ksu = {
    id: 'ksu',
    name: 'Key service unit',
    lines: input.lines.map((label, i) => ({
      number: i + 1,
      label,
      directoryNumber: `${input.exchange}01${String(i + 1).padStart(2, '0')}`,
    })),
    stations: input.stations,
    ports: input.ports,
    position: { x: 0, y: 0 },
  };
  const extra: CrossConnect[] = input.sets.flatMap((s) =>
    s.buzzerOnSparePair && s.station
      ? [{ port: SHARED_PORT, pair: SPARE_PAIR, lead: { kind: 'buzzer', station: s.station } }]
      : [],
  );
  const crossConnect = extra.length
    ? [
        ...standardCrossConnect(ksu).filter((c) => !extra.some((e) => e.port === c.port && e.pair === c.pair)),
        ...extra,
      ].sort((a, b) => a.port - b.port || a.pair - b.pair)
    : undefined;
  return {
    version: 1,
    name: input.name,
    description: input.description,
    ksu: crossConnect ? { ...ksu, crossConnect } : ksu,
    sets: input.sets.map(({ buzzerOnSparePair, leadChanges = [], ...s }, i) => ({
      ringerLines: [],
      leadChanges: buzzerOnSparePair ? [movedBuzzer(), ...leadChanges] : leadChanges,
      position: { x: 520, y: -160 + i * 200 },
      ...s,
    })),
    addOns: input.addOns ?? [],
    adapters: input.adapter
      ? [{ id: 'adapter', name: 'Bridging adapter', template: input.adapter, position: { x: 260, y: 0 } }]
      : [],
    cables: input.adapter
      ? [cable('station-cable', 'adapter', 'plug', 'ksu', `port-${SHARED_PORT}`), ...input.cables]
      : input.cables,
    required: { allLinesOnEverySet: true, intercomPerStation: true, handsFreeSets: input.handsFreeSets ?? [] },
  };
}

/** Two six-key sets, each on its own KSU port, each answering its own station. */
export const surveyOffice = (): Plan =>
  installation({
    name: 'Survey office',
    description: 'A land survey office: the front desk and the drawing room, each on its own station cable.',
    lines: ['Main', 'Field crews', 'Fax'],
    exchange: '555',
    stations: [station('21', 'Front desk'), station('22', 'Drawing room'), station('23', 'Store')],
    ports: 3,
    sets: [
      { id: 'front-desk', name: 'Front desk', template: 'six-key', station: 'st-21', ringerLines: [1, 2] },
      { id: 'drawing-room', name: 'Drawing room', template: 'six-key', station: 'st-22', ringerLines: [3] },
    ],
    cables: [
      cable('front-cord', 'front-desk', 'cord', 'ksu', 'port-1'),
      cable('drawing-cord', 'drawing-room', 'cord', 'ksu', 'port-2'),
    ],
  });

/** Two six-key sets sharing one station cable; the second set's buzzer moved to spare pair 17. */
export const bakeryCounter = (): Plan =>
  installation({
    name: 'Corner bakery',
    description: 'The shop counter and the bakehouse share one station cable through a bridging adapter.',
    lines: ['Shop', 'Orders', 'Owner'],
    exchange: '556',
    stations: [station('31', 'Counter'), station('32', 'Bakehouse')],
    ports: 1,
    sets: [
      { id: 'counter', name: 'Counter', template: 'six-key', station: 'st-31', ringerLines: [1, 2] },
      { id: 'bakehouse', name: 'Bakehouse', template: 'six-key', station: 'st-32', ringerLines: [2], buzzerOnSparePair: true },
    ],
    adapter: 'bridging-adapter',
    cables: [
      cable('counter-cord', 'counter', 'cord', 'adapter', 'jack-1'),
      cable('bakehouse-cord', 'bakehouse', 'cord', 'adapter', 'jack-2'),
    ],
  });

/**
 * Two six-key sets wired for hands-free on one cable: the reception set keeps its add-on, the back office
 * set has its private pairs 23–25 lifted and its buzzer on spare pair 17.
 */
export const dentalReception = (): Plan =>
  installation({
    name: 'Dental practice',
    description:
      'Reception has a hands-free add-on; the back office set is the same model, so its private pairs were lifted.',
    lines: ['Appointments', 'Surgery', 'Laboratory', 'Billing'],
    exchange: '557',
    stations: [station('41', 'Reception'), station('42', 'Back office')],
    ports: 1,
    sets: [
      { id: 'reception', name: 'Reception', template: 'six-key-hf', station: 'st-41', ringerLines: [1] },
      {
        id: 'back-office',
        name: 'Back office',
        template: 'six-key-hf',
        station: 'st-42',
        ringerLines: [4],
        buzzerOnSparePair: true,
        leadChanges: privatePairsLifted(),
      },
    ],
    addOns: [
      { id: 'reception-speaker', name: 'Reception speaker', template: 'hands-free-unit', serves: 'reception', leadChanges: [], position: { x: 260, y: -200 } },
    ],
    adapter: 'bridging-adapter',
    cables: [
      cable('speaker-cord', 'reception-speaker', 'cord', 'adapter', 'jack-1'),
      cable('reception-cord', 'reception', 'cord', 'reception-speaker', 'set'),
      cable('back-cord', 'back-office', 'cord', 'adapter', 'jack-2'),
    ],
    handsFreeSets: ['reception'],
  });

/** A ten-key set and a six-key set on one cable of a nine-line KSU. */
export const freightDesk = (template: 'six-key' | 'six-key-hf' = 'six-key'): Plan =>
  installation({
    name: 'Freight forwarding desk',
    description: 'The dispatcher has a ten-key set for all nine lines; the clerk beside her has a six-key set.',
    lines: ['Dispatch', 'Harbour', 'Rail', 'Road', 'Customs', 'Night', 'Agents', 'Claims', 'Manager'],
    exchange: '558',
    stations: [station('51', 'Dispatcher'), station('52', 'Clerk')],
    ports: 1,
    sets: [
      { id: 'dispatcher', name: 'Dispatcher', template: 'ten-key', station: 'st-51', ringerLines: [1, 6] },
      {
        id: 'clerk',
        name: 'Clerk',
        template,
        station: 'st-52',
        ringerLines: [2],
        buzzerOnSparePair: true,
        leadChanges: template === 'six-key-hf' ? privatePairsLifted() : [],
      },
    ],
    adapter: 'bridging-adapter',
    cables: [
      cable('dispatcher-cord', 'dispatcher', 'cord', 'adapter', 'jack-1'),
      cable('clerk-cord', 'clerk', 'cord', 'adapter', 'jack-2'),
    ],
  });

/** Three six-key sets: two share port 1 through a four-jack adapter, the workshop has port 2 to itself. */
export const boatyard = (): Plan =>
  installation({
    name: 'Boatyard',
    description: 'Office and chandlery share a cable through a four-jack adapter; the workshop has its own port.',
    lines: ['Yard', 'Chandlery', 'Moorings'],
    exchange: '559',
    stations: [station('61', 'Office'), station('63', 'Workshop'), station('62', 'Chandlery')],
    ports: 2,
    sets: [
      { id: 'office', name: 'Office', template: 'six-key', station: 'st-61', ringerLines: [1] },
      { id: 'chandlery', name: 'Chandlery', template: 'six-key', station: 'st-62', ringerLines: [2], buzzerOnSparePair: true },
      { id: 'workshop', name: 'Workshop', template: 'six-key', station: 'st-63', ringerLines: [3] },
    ],
    adapter: 'bridging-adapter-4',
    cables: [
      cable('office-cord', 'office', 'cord', 'adapter', 'jack-1'),
      cable('chandlery-cord', 'chandlery', 'cord', 'adapter', 'jack-2'),
      cable('workshop-cord', 'workshop', 'cord', 'ksu', 'port-2'),
    ],
  });
