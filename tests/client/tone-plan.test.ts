import { describe, expect, it } from 'vitest';
import {
  buzzerVoice,
  isSounding,
  lineSource,
  newlySeized,
  ringerVoice,
  setVoices,
  slowestBeatHz,
  toneVoice,
} from '@/composables/bench/tone-plan';

const frequencies = (voice: { partials: { frequency: number }[] }) => voice.partials.map((p) => p.frequency);

describe('tone plan', () => {
  it('plays dial tone on line 1 at the precise-tone frequencies, steady', () => {
    const dial = toneVoice('dial', 1);
    // Dial tone 350 + 440 Hz, continuous (North American precise tone plan; ITU-T E.180 Supplement 2 lists it).
    expect(frequencies(dial)).toEqual([350, 440]);
    expect(isSounding(dial.cadence, 0)).toBe(true);
    expect(isSounding(dial.cadence, 61_000)).toBe(true);
  });

  it('gates busy tone 0.5 s on, 0.5 s off', () => {
    const busy = toneVoice('busy', 1);
    // Busy 480 + 620 Hz, 0.5 s on / 0.5 s off (precise tone plan; ITU-T E.180 Supplement 2).
    expect(frequencies(busy)).toEqual([480, 620]);
    expect(isSounding(busy.cadence, 400)).toBe(true);
    expect(isSounding(busy.cadence, 600)).toBe(false);
    expect(isSounding(busy.cadence, 1_100)).toBe(true);
  });

  it('makes two lines of dial tone sound as two sources: another level and a slow beat', () => {
    const one = toneVoice('dial', 1);
    const two = toneVoice('dial', 2);
    // Two independent line circuits never run at exactly one frequency or level (common practice, no
    // published source). A level step of 1 dB or more is heard (a just-noticeable difference of about 1 dB,
    // from memory); beats slower than a few hertz are heard as a waxing and waning, not as roughness (from memory).
    expect(Math.abs(one.levelDb - two.levelDb)).toBeGreaterThanOrEqual(1);
    const beat = slowestBeatHz(one, two);
    expect(beat).toBeGreaterThan(0.3);
    expect(beat).toBeLessThan(3);
    // Each stays within the precise-tone plan's ±0.5 % frequency tolerance (from memory).
    frequencies(two).forEach((f, i) =>
      expect(Math.abs(f / frequencies(one)[i]! - 1)).toBeLessThanOrEqual(0.005),
    );
  });

  it('keeps every line distinct from the next, and quieter lines never fall silent', () => {
    for (let line = 1; line < 8; line += 1) {
      expect(lineSource(line + 1).factor).toBeGreaterThan(lineSource(line).factor);
      expect(lineSource(line + 1).levelDb).toBeGreaterThan(-12);
    }
  });

  it('rings the set in the ringing cadence, the bell struck at the ringing frequency', () => {
    const ringer = ringerVoice();
    // Ringing 2 s on, 4 s off at 20 Hz (common practice in North America, from memory).
    expect(ringer.cadence).toEqual({ onMs: 2000, offMs: 4000 });
    expect(ringer.modulationHz).toBe(20);
    expect(isSounding(ringer.cadence, 1_900)).toBe(true);
    expect(isSounding(ringer.cadence, 2_100)).toBe(false);
    expect(isSounding(ringer.cadence, 5_900)).toBe(false);
    expect(isSounding(ringer.cadence, 6_100)).toBe(true);
  });

  it('adds the ringer and the buzzer to what the set sounds, each once', () => {
    const voices = setVoices(
      [
        { tone: 'dial', line: 1 },
        { tone: 'dial', line: 1 },
        { tone: 'dial', line: 2 },
      ],
      { ringer: true, buzzer: true },
    );
    expect(voices.map((v) => v.key)).toEqual(['buzzer', 'dial@1', 'dial@2', 'ringer']);
    // The buzzer is a rasp, not a tone of the tone plan: it cannot be mistaken for dial tone.
    expect(buzzerVoice().partials[0]!.shape).toBe('square');
    expect(setVoices([], {})).toEqual([]);
  });

  it('clicks for each line newly seized, not for lines already held', () => {
    expect(newlySeized([], [1])).toEqual([1]);
    expect(newlySeized([1], [1, 3])).toEqual([3]);
    expect(newlySeized([1, 3], [1])).toEqual([]);
  });
});
