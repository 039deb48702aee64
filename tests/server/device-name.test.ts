import { describe, expect, it } from 'vitest';
import { deviceName } from '../../server/auth/device-name';

describe('deviceName', () => {
  it('names browser, major version and system from common user-agent strings', () => {
    // User-agent strings in the formats the browsers publish (Chromium's, Mozilla's and WebKit's documentation
    // of their UA strings; versions from memory).
    expect(
      deviceName(
        'Mozilla/5.0 (X11; Linux x86_64) AppleWebKit/537.36 (KHTML, like Gecko) Chrome/131.0.0.0 Safari/537.36',
      ),
    ).toBe('Chrome 131 on Linux');
    expect(deviceName('Mozilla/5.0 (Windows NT 10.0; Win64; x64; rv:128.0) Gecko/20100101 Firefox/128.0')).toBe(
      'Firefox 128 on Windows',
    );
    expect(
      deviceName(
        'Mozilla/5.0 (iPhone; CPU iPhone OS 17_5 like Mac OS X) AppleWebKit/605.1.15 (KHTML, like Gecko) Version/17.5 Mobile/15E148 Safari/604.1',
      ),
    ).toBe('Safari 17 on iOS');
  });

  it('shows an unrecognised agent as sent, shortened, and an empty one as unknown', () => {
    expect(deviceName('Bench laptop')).toBe('Bench laptop');
    expect(deviceName('x'.repeat(80))).toBe(`${'x'.repeat(59)}…`);
    expect(deviceName('')).toBe('Unknown browser');
  });
});
