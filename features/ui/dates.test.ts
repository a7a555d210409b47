import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { calendarDayText, dayText, momentText, weekdayText } from './dates';

// The reference throughout is the JavaScript runtime's own Date#toLocale*String (ICU),
// which is what the screens wrote before and what a browser writes.
const moments = ['2026-12-03T14:05:09.000Z', '2026-01-01T00:30:00.000Z', '2027-06-30T23:59:59.000Z'];

describe('dates in the browser (no server drawing)', () => {
  it('writes a moment as toLocaleDateString() and toLocaleString() do', () => {
    for (const iso of moments) {
      expect(dayText(iso)).toBe(new Date(iso).toLocaleDateString());
      expect(momentText(iso)).toBe(new Date(iso).toLocaleString());
      expect(weekdayText(iso)).toBe(new Date(iso).toLocaleDateString(undefined, { weekday: 'short', month: 'short', day: 'numeric' }));
    }
  });

  it('writes a calendar day as that day, whatever the clock zone', () => {
    expect(calendarDayText('2026-12-05', false)).toBe(new Date(2026, 11, 5, 12).toLocaleDateString(undefined, { weekday: 'short', month: 'short', day: 'numeric' }));
    expect(calendarDayText('2027-01-01', true)).toBe(new Date(2027, 0, 1, 12).toLocaleDateString(undefined, { weekday: 'short', month: 'short', day: 'numeric', year: 'numeric' }));
  });
});

describe('dates on the server, drawing a page for a browser', () => {
  const view = { width: 390, height: 844, locale: 'en-GB', timeZone: 'Asia/Kolkata' };
  beforeEach(() => {
    process.env.EXPO_SERVER = '1';
    globalThis.__matwrightPageDrawing = { apiOrigin: 'http://127.0.0.1:1', cookie: '', view };
  });
  afterEach(() => {
    delete process.env.EXPO_SERVER;
    globalThis.__matwrightPageDrawing = undefined;
  });

  it("writes moments in the visitor's locale and zone, not the server's", () => {
    for (const iso of moments) {
      expect(dayText(iso)).toBe(new Date(iso).toLocaleDateString('en-GB', { timeZone: 'Asia/Kolkata' }));
      expect(momentText(iso)).toBe(new Date(iso).toLocaleString('en-GB', { timeZone: 'Asia/Kolkata' }));
    }
    // 23:59:59 UTC on 30 June is already 1 July in Kolkata (UTC+5:30).
    expect(dayText('2027-06-30T23:59:59.000Z')).toBe('01/07/2027');
  });

  it('keeps a calendar day on its day in any zone', () => {
    globalThis.__matwrightPageDrawing = { apiOrigin: 'http://127.0.0.1:1', cookie: '', view: { ...view, timeZone: 'Pacific/Kiritimati' } };
    expect(calendarDayText('2026-12-05', false)).toBe('Sat 5 Dec');
  });
});
