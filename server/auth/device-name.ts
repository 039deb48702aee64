/**
 * A short, human name for the browser behind a session ("Chrome 156 on Linux"), so that the account page lists
 * devices a person recognises instead of raw user-agent strings. The raw string stays on the entry for a tooltip.
 */
import Bowser from 'bowser';

export function deviceName(userAgent: string): string {
  if (!userAgent.trim()) return 'Unknown browser';
  const parsed = Bowser.parse(userAgent);
  // Something that names no known browser (a script, a test client) is shown as sent, shortened.
  if (!parsed.browser.name) return userAgent.length > 60 ? `${userAgent.slice(0, 59)}…` : userAgent;
  const major = parsed.browser.version?.split('.')[0];
  const browser = [parsed.browser.name, major].filter(Boolean).join(' ');
  const os = parsed.os.name;
  return os ? `${browser} on ${os}` : browser;
}
