import { describe, expect, it } from 'vitest';
import { cadenceCss } from '@/components/bench/nodes/lamp-cadence';
import { shortcutFor } from '@/composables/bench/use-keyboard-shortcuts';
import { toneIsOn } from '@/composables/bench/use-handset-audio';

const key = (
  k: string,
  mods: Partial<{ ctrlKey: boolean; shiftKey: boolean; metaKey: boolean; altKey: boolean }> = {},
) => ({
  key: k,
  ctrlKey: false,
  metaKey: false,
  shiftKey: false,
  altKey: false,
  ...mods,
});

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

describe('bench shortcuts', () => {
  it('maps the documented keys', () => {
    expect(shortcutFor(key('z', { ctrlKey: true }))).toBe('undo');
    expect(shortcutFor(key('Z', { ctrlKey: true, shiftKey: true }))).toBe('redo');
    expect(shortcutFor(key('y', { ctrlKey: true }))).toBe('redo');
    expect(shortcutFor(key('d', { metaKey: true }))).toBe('duplicate');
    expect(shortcutFor(key('Delete'))).toBe('remove');
    expect(shortcutFor(key('f'))).toBe('fit');
    expect(shortcutFor(key('F2'))).toBe('rename');
    expect(shortcutFor(key('Escape'))).toBe('clear');
    expect(shortcutFor(key('?', { shiftKey: true }))).toBe('help');
    expect(shortcutFor(key('a'))).toBeNull();
    expect(shortcutFor(key('f', { altKey: true }))).toBeNull();
  });
});
