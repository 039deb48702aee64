import { describe, expect, it } from 'vitest';
import { dayText, momentText } from '../../src/formats/dates';

// Expected strings: CLDR's English (en-US) medium date and short time patterns as the runtime's Intl formats them
// ("MMM d, y", "h:mm a"; from memory of CLDR, checked against Node's Intl). Noon UTC falls on the same day in
// every time zone within ±11 h, and the time is read back with the runtime's own formatter.
describe('dates', () => {
  const at = '2026-12-04T12:00:00.000Z';

  it('writes a day in the medium style', () => {
    expect(dayText(at, 'en-US')).toBe('Dec 4, 2026');
    expect(dayText(new Date(at), 'en-US')).toBe('Dec 4, 2026');
  });

  it('writes a moment as the day and a short time', () => {
    const time = new Date(at).toLocaleTimeString('en-US', { timeStyle: 'short' });
    expect(time).toMatch(/^\d{1,2}:\d{2}\s?[AP]M$/);
    expect(momentText(at, 'en-US')).toBe(`Dec 4, 2026, ${time}`);
  });
});
