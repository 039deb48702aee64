/**
 * What the Bench plays, as plain data: every sound is a voice with partials (frequency and share of its level),
 * a level in dB below the loudest source, a cadence and an optional amplitude modulation. No Web Audio here, so
 * the plan can be tested directly; use-handset-audio.ts turns voices into oscillators.
 *
 * Tones come from the engine's TONES table. Each line circuit has its own tone source, as real line circuits
 * do: a slightly different oscillator frequency and a slightly different level per line, so two lines heard on
 * one handset beat slowly against each other and sound as two.
 */
import { TONES, type ToneName } from '@shared/engine';

export interface Cadence {
  /** Sounding time of one period; 0 means steady. */
  onMs: number;
  offMs: number;
}

export interface VoicePartial {
  frequency: number;
  /** Share of the voice's level, 0..1. */
  share: number;
  /** Oscillator shape: sine for tones, square for the buzzer's rasp. */
  shape: 'sine' | 'square';
}

export interface Voice {
  key: string;
  partials: VoicePartial[];
  /** No partials but a talking stand-in (band-limited noise at a syllable rate). */
  murmur: boolean;
  /** Level below the loudest source, in dB (0 or negative). */
  levelDb: number;
  cadence: Cadence;
  /** Amplitude modulation of the whole voice, Hz (a bell struck at the ringing frequency); 0 for none. */
  modulationHz: number;
}

/** Each further line circuit's oscillators run this much faster (0.25 %): 350 Hz on line 2 is 350.9 Hz. */
export const LINE_DETUNE = 0.0025;
/** Each further line circuit sounds this much quieter, up to LINE_LEVEL_STEPS steps. */
export const LINE_STEP_DB = 2;
export const LINE_LEVEL_STEPS = 3;

/** Ringing: the bell struck at the ringing frequency, in the usual ringing cadence. */
export const RINGING = { frequencyHz: 20, cadence: { onMs: 2000, offMs: 4000 } } as const;
/** Two bell partials of our own sound design (no standard defines a set's bell). */
const BELL_PARTIALS = [1100, 1480];
/** The intercom buzzer: a rasp around 160 Hz (our own sound design). */
const BUZZER_HZ = 160;

/** The click of a line seized: a short burst, loud enough to be heard over a tone. */
export const SEIZE_CLICK = { durationMs: 12, levelDb: -3 } as const;

export function dbToGain(db: number): number {
  return 10 ** (db / 20);
}

/** Whether a voice of this cadence is sounding `elapsedMs` after it started. */
export function isSounding(cadence: Cadence, elapsedMs: number): boolean {
  if (!cadence.onMs || !cadence.offMs) return true;
  return elapsedMs % (cadence.onMs + cadence.offMs) < cadence.onMs;
}

/** The tone source of one line circuit: its frequency factor and its level. */
export function lineSource(line: number): { factor: number; levelDb: number } {
  const step = Math.max(0, line - 1);
  return { factor: 1 + step * LINE_DETUNE, levelDb: -LINE_STEP_DB * Math.min(step, LINE_LEVEL_STEPS) };
}

export function toneVoice(tone: ToneName, line: number): Voice {
  const spec = TONES[tone];
  const source = lineSource(line);
  const share = 1 / Math.max(1, spec.frequencies.length);
  return {
    key: `${tone}@${line}`,
    partials: spec.frequencies.map((f) => ({ frequency: f * source.factor, share, shape: 'sine' })),
    murmur: spec.frequencies.length === 0,
    levelDb: source.levelDb,
    cadence: { onMs: spec.onMs, offMs: spec.offMs },
    modulationHz: 0,
  };
}

export function ringerVoice(): Voice {
  return {
    key: 'ringer',
    partials: BELL_PARTIALS.map((frequency) => ({ frequency, share: 0.5, shape: 'sine' })),
    murmur: false,
    levelDb: 0,
    cadence: RINGING.cadence,
    modulationHz: RINGING.frequencyHz,
  };
}

export function buzzerVoice(): Voice {
  return {
    key: 'buzzer',
    partials: [{ frequency: BUZZER_HZ, share: 1, shape: 'square' }],
    murmur: false,
    levelDb: -6,
    cadence: { onMs: 0, offMs: 0 },
    modulationHz: 0,
  };
}

/** The slowest beat between two voices heard together: the smallest gap between any of their partials, Hz. */
export function slowestBeatHz(a: Voice, b: Voice): number {
  let slowest = Infinity;
  for (const p of a.partials) {
    for (const q of b.partials) slowest = Math.min(slowest, Math.abs(p.frequency - q.frequency));
  }
  return slowest;
}

/** What a set sounds: the tones its handset hears (off hook), its ringer and its buzzer. */
export function setVoices(
  tones: readonly { tone: ToneName; line: number }[],
  alerts: { ringer?: boolean; buzzer?: boolean } = {},
): Voice[] {
  const voices = new Map<string, Voice>();
  for (const t of tones) {
    const voice = toneVoice(t.tone, t.line);
    voices.set(voice.key, voice);
  }
  if (alerts.ringer) voices.set('ringer', ringerVoice());
  if (alerts.buzzer) voices.set('buzzer', buzzerVoice());
  return [...voices.values()].sort((x, y) => x.key.localeCompare(y.key));
}

/** Lines the handset newly reaches: each one is heard as the click of a line seized. */
export function newlySeized(before: readonly number[], after: readonly number[]): number[] {
  return after.filter((line) => !before.includes(line));
}
