/** Shapes of the part templates. Templates are data: the model reads them, it never asks which template it has. */
import type { Conductor } from '../document/plan.schema';

export type PartKind = 'set' | 'add-on' | 'adapter' | 'ksu';
export type PortGender = 'plug' | 'jack';

export interface PortSpec {
  name: string;
  gender: PortGender;
  label: string;
}

export interface KeySpec {
  /** 1-based position on the key strip. */
  index: number;
  label: string;
  kind: 'line' | 'hold';
  line?: number;
}

/**
 * 'bus' leads are meant to be paralleled with every set on the cable (line T/R, A/A1, L/LG);
 * 'station' leads are meant to reach one KSU output (the buzzer);
 * 'private' leads bring the set's own circuit out for its own add-on only.
 */
export type LeadScope = 'bus' | 'station' | 'private';

export interface LeadSpec {
  pair: number;
  conductor: Conductor;
  /** Trade designation, e.g. "L1 T", "L2 A1", "CT". */
  designation: string;
  /** Internal terminal the lead is soldered to. */
  terminal: string;
  purpose: string;
  /** Short noun phrase for sentences, e.g. "talk pair", "A-lead control". */
  role: string;
  scope: LeadScope;
}

export type ElementKind = 'network' | 'lamp' | 'buzzer' | 'ringer';

/** A two-terminal load. */
export interface ElementSpec {
  kind: ElementKind;
  a: string;
  b: string;
  /** For a lamp: the key it lights. */
  key?: number;
  label: string;
  /**
   * Present when part of a speech network works one way round only (a line-powered tone dial): its `a` terminal
   * must meet the line's tip. `fails` names, as a noun phrase, what stops working when tip and ring reach it
   * reversed; talk itself still works.
   */
  polarised?: { fails: string };
}

/** The mechanical condition that closes a contact. */
export type ContactCondition = { key: number } | 'offHook' | 'notHoldPressed' | 'handsFreeOn';

export interface ContactSpec {
  a: string;
  b: string;
  when: ContactCondition;
  label: string;
}

export interface PartTemplate {
  id: string;
  kind: PartKind;
  title: string;
  description: string;
  ports: PortSpec[];
  /** Port whose pins the leads land on (a set's or add-on's mounting cord). */
  leadPort?: string;
  /** Groups of ports whose pins are paralleled pin for pin inside the part. */
  bridges?: string[][];
  keys?: KeySpec[];
  leads: LeadSpec[];
  elements: ElementSpec[];
  contacts: ContactSpec[];
  /** Where a ringer can be strapped for each line. */
  ringerStraps?: { line: number; tip: string; ring: string }[];
  /** Lines a set without line keys is always on. */
  fixedLines?: number[];
  /** True when the set brings its own circuits out for a hands-free add-on. */
  handsFreeWiring?: boolean;
}
