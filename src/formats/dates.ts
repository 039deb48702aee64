/**
 * Dates as the screens write them: one style ("Dec 4, 2026", "Dec 4, 2026, 5:00 PM" in an English locale), in the
 * reader's own locale and time zone. The printed work sheet spells the month out, as a signed record does.
 */
const DAY: Intl.DateTimeFormatOptions = { dateStyle: 'medium' };
const MOMENT: Intl.DateTimeFormatOptions = { dateStyle: 'medium', timeStyle: 'short' };

/** The day of an instant given as an ISO string or a Date. */
export function dayText(at: string | Date, locale?: string): string {
  return new Date(at).toLocaleDateString(locale, DAY);
}

/** The day and time of an instant given as an ISO string or a Date. */
export function momentText(at: string | Date, locale?: string): string {
  return new Date(at).toLocaleString(locale, MOMENT);
}
