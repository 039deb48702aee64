import { describe, expect, it } from 'vitest';
import { CADENCES, TONES, strongestCadence } from '../../shared/engine/index';

describe('lamp cadences', () => {
  it('winks a held line 120 times a minute, dark 6 % of each period', () => {
    const wink = CADENCES.wink!;
    expect(60_000 / wink.periodMs).toBe(120); // Federal Standard 1037C, "wink pulsing"
    expect(wink.periodMs - wink.onMs).toBe(30); // Federal Standard 1037C, "wink pulsing": 30 ms off
    expect(wink.onMs).toBe(470); // Federal Standard 1037C, "wink pulsing": 470 ms on
    expect((wink.periodMs - wink.onMs) / wink.periodMs).toBeCloseTo(0.06, 5); // Federal Standard 1037C
  });

  it('flashes an incoming call 60 times a minute at half duty', () => {
    expect(CADENCES.flash).toEqual({ periodMs: 1000, onMs: 500 }); // common practice, no published source
  });

  it('has no timing for a dark or a steady lamp, and a lit lamp outshines a winking one', () => {
    expect(CADENCES.dark).toBeNull();
    expect(CADENCES.steady).toBeNull();
    expect(strongestCadence('wink', 'steady')).toBe('steady');
    expect(strongestCadence('dark', 'flash')).toBe('flash');
  });
});

describe('call-progress tones', () => {
  it('uses the precise tone plan frequencies', () => {
    expect(TONES.dial.frequencies).toEqual([350, 440]); // ITU-T E.300-series Supplement 3, North American precise tone plan
    expect(TONES.ringback.frequencies).toEqual([440, 480]); // ITU-T E.300-series Supplement 3
    expect(TONES.busy.frequencies).toEqual([480, 620]); // ITU-T E.300-series Supplement 3
    expect(TONES.reorder.frequencies).toEqual([480, 620]); // ITU-T E.300-series Supplement 3
  });

  it('uses the precise tone plan cadences', () => {
    expect(TONES.dial).toMatchObject({ onMs: 0, offMs: 0 }); // ITU-T E.300-series Supplement 3: continuous
    expect(TONES.ringback).toMatchObject({ onMs: 2000, offMs: 4000 }); // ITU-T E.300-series Supplement 3
    expect(TONES.busy).toMatchObject({ onMs: 500, offMs: 500 }); // ITU-T E.300-series Supplement 3
    expect(TONES.reorder).toMatchObject({ onMs: 250, offMs: 250 }); // ITU-T E.300-series Supplement 3
  });
});
