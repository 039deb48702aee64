import { describe, expect, it } from 'vitest';
import { cadenceCss } from '@/components/bench/nodes/lamp-cadence';
import { toneIsOn } from '@/composables/bench/use-handset-audio';

describe('lamp cadence CSS', () => {
  it('takes period and lit share from the engine cadences', () => {
    const css = cadenceCss();
    // flash: 60 per minute at 50 % (common practice, no published source) → 1000 ms period, dark from 50 %.
    expect(css).toContain('@keyframes lb-lamp-flash { 0% { opacity: 1; } 50.00% { opacity: 0.12; }');
    expect(css).toContain('lb-lamp-flash 1000ms step-end infinite');
    // wink: 120 per minute, 470 ms on / 30 ms off (Federal Standard 1037C "wink pulsing") → dark from 94 %.
    expect(css).toContain('94.00% { opacity: 0.12; }');
    expect(css).toContain('lb-lamp-wink 500ms step-end infinite');
    expect(css).not.toContain('lb-lamp-steady');
  });
});

describe('handset tone cadence', () => {
  it('gates busy and ringback by their on/off times and leaves dial tone steady', () => {
    // Busy 0.5 s on, 0.5 s off; ringback 2 s on, 4 s off; dial tone continuous (North American precise tone plan).
    expect(toneIsOn('busy', 100)).toBe(true);
    expect(toneIsOn('busy', 600)).toBe(false);
    expect(toneIsOn('busy', 1100)).toBe(true);
    expect(toneIsOn('ringback', 1900)).toBe(true);
    expect(toneIsOn('ringback', 2100)).toBe(false);
    expect(toneIsOn('ringback', 6100)).toBe(true);
    expect(toneIsOn('dial', 123_456)).toBe(true);
  });
});
