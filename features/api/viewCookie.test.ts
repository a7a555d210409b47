import { describe, expect, it } from 'vitest';
import { parseViewCookie, viewCookieValue } from './viewCookie';

describe('the view cookie', () => {
  it('reads back what it writes, for zones and locales the runtime knows', () => {
    for (const view of [
      { width: 390, height: 844, locale: 'en-US', timeZone: 'America/New_York' },
      { width: 1280, height: 800, locale: 'en-GB', timeZone: 'Europe/Lisbon' },
      { width: 412, height: 823, locale: 'pt-BR', timeZone: 'UTC' },
    ]) {
      expect(parseViewCookie(viewCookieValue(view))).toEqual(view);
    }
  });

  it('gives the canonical spellings (Intl.getCanonicalLocales, DateTimeFormat#resolvedOptions) so the server formats as the browser does', () => {
    const view = parseViewCookie(viewCookieValue({ width: 390, height: 844, locale: 'EN-gb', timeZone: 'America/New_York' }));
    expect(view?.locale).toBe(Intl.getCanonicalLocales('EN-gb')[0]);
  });

  it('refuses anything a browser of ours did not write, so the page goes undrawn', () => {
    const bad = [
      undefined,
      '',
      'garbage',
      '%E0%A4%A', // a broken escape
      encodeURIComponent('0x844|en-US|UTC'),
      encodeURIComponent('390x0|en-US|UTC'),
      encodeURIComponent('99999x844|en-US|UTC'),
      encodeURIComponent('390x844|en-US'),
      encodeURIComponent('390x844|en-US|UTC|extra'),
      encodeURIComponent('390x844|en-US|Mars/Olympus_Mons'),
      encodeURIComponent('390x844|<script>|UTC'),
      encodeURIComponent(`390x844|en-US|${'A'.repeat(300)}`),
    ];
    for (const value of bad) expect(parseViewCookie(value), String(value)).toBeNull();
  });
});
