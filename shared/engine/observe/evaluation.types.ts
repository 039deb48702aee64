/** What the engine reports for one plan in one state. */
import type { FarPhase } from '../sim/state.schema';

export type Cadence = 'dark' | 'steady' | 'flash' | 'wink';
export type ToneName = 'dial' | 'ringback' | 'busy' | 'reorder' | 'voice';
export type LineStatus = 'idle' | 'in-use' | 'held' | 'ringing';

export interface LineObservation {
  line: number;
  status: LineStatus;
  aClosed: boolean;
  loopClosed: boolean;
  /** Sets whose handset or hands-free network is bridged across this line. */
  setsOn: string[];
  lamp: Cadence;
  far: FarPhase;
  joinedWith: number[];
  /** What a user hears on the line besides the call (crosstalk over a split pair); absent when nothing. */
  noise?: string[];
}

export interface KeyObservation {
  index: number;
  label: string;
  lamp: Cadence;
  /** Lines whose lamp leads reach this key's lamp. */
  lines: number[];
}

export interface SetObservation {
  set: string;
  offHook: boolean;
  pressedKey: number | null;
  handsFreeOn: boolean;
  keys: KeyObservation[];
  hears: number[];
  tones: { tone: ToneName; line: number }[];
  buzzer: boolean;
  ringer: boolean;
  /** What does not work one way round on this set (tip and ring reversed); absent when nothing. */
  notes?: string[];
}

export interface StationObservation {
  station: string;
  code: string;
  calling: boolean;
  /** Sets whose buzzer sounds for this station (only while it is being called). */
  buzzing: string[];
  /** Sets assigned to this station. */
  assigned: string[];
}

/** Every kind of finding, declared once; FindingCode is derived from it. */
export const FINDING_CODES = [
  'LINES_JOINED',
  'SET_HEARS_SEVERAL_LINES',
  'SET_HEARS_UNSELECTED_LINE',
  'LINE_LIT_UNATTENDED',
  'BREAK_IN',
  'INTERCOM_SOUNDS_SEVERAL',
  'PRIVATE_LEAD_SHARED',
  'LINE_ON_CONTROL_LEAD',
  'RINGING_OVER_JOINED_LINES',
] as const;

export type FindingCode = (typeof FINDING_CODES)[number];

/** Short names of the finding kinds, for lists, filters and work sheets. */
export const FINDING_TITLES: Readonly<Record<FindingCode, string>> = {
  LINES_JOINED: 'Lines joined',
  SET_HEARS_SEVERAL_LINES: 'Set hears several lines',
  SET_HEARS_UNSELECTED_LINE: 'Set hears a line it did not select',
  LINE_LIT_UNATTENDED: 'Line lit with nobody on it',
  BREAK_IN: 'Break-in on a call',
  INTERCOM_SOUNDS_SEVERAL: 'Intercom call buzzes several sets',
  PRIVATE_LEAD_SHARED: "Set's private leads shared",
  LINE_ON_CONTROL_LEAD: 'Line on a lamp lead, A-lead or ground',
  RINGING_OVER_JOINED_LINES: 'Ringing reaches a joined line',
};

/** One step along a conductor path. */
export interface Hop {
  part: string;
  partName: string;
  terminal?: string;
  designation?: string;
  pair?: number;
  conductor?: 'tip' | 'ring';
  colour?: string;
  pin?: number;
  port?: string;
  cable?: string;
  text: string;
}

export interface Finding {
  code: FindingCode;
  severity: 'fault' | 'warning';
  sets: string[];
  lines: number[];
  stations: string[];
  message: string;
  path: Hop[];
}

export interface Evaluation {
  lines: LineObservation[];
  sets: SetObservation[];
  stations: StationObservation[];
  findings: Finding[];
}
