/** Published signal timings the bench plays back. */
import type { Cadence, ToneName } from './evaluation.types';

/**
 * Lamp cadences. wink: Federal Standard 1037C "wink pulsing", 120 per minute with the lamp off 6 % of each period
 * (30 ms off, 470 ms on). flash: 60 per minute, 50 % (common practice, no published source).
 */
export const CADENCES: Readonly<Record<Cadence, { periodMs: number; onMs: number } | null>> = {
  dark: null,
  steady: null,
  flash: { periodMs: 1000, onMs: 500 },
  wink: { periodMs: 500, onMs: 470 },
};

/**
 * Call-progress tones, North American precise tone plan (ITU-T E.300-series Supplement 3).
 * offMs 0 = continuous. 'voice' is the far party talking (no tone).
 */
export const TONES: Readonly<Record<ToneName, { frequencies: number[]; onMs: number; offMs: number }>> = {
  dial: { frequencies: [350, 440], onMs: 0, offMs: 0 },
  ringback: { frequencies: [440, 480], onMs: 2000, offMs: 4000 },
  busy: { frequencies: [480, 620], onMs: 500, offMs: 500 },
  reorder: { frequencies: [480, 620], onMs: 250, offMs: 250 },
  voice: { frequencies: [], onMs: 0, offMs: 0 },
};

const strength: Record<Cadence, number> = { dark: 0, wink: 1, flash: 2, steady: 3 };

/** What a lamp shows when several lamp leads reach it: the most lit one wins. */
export function strongestCadence(a: Cadence, b: Cadence): Cadence {
  return strength[a] >= strength[b] ? a : b;
}
