import { currentPageDrawing } from '../api/pageDrawing';

/**
 * Dates as the reader's browser writes them. In the browser that is the
 * browser's own locale and time zone; on the server, drawing a page for a
 * browser, it is that browser's (features/ui/pageView.ts), so the text the
 * server draws is the text the browser would, and React adopts it as is.
 * Formatters are built once per locale, zone and style (building one costs
 * about a millisecond on a phone, once per row of a list otherwise).
 */

type Style = 'day' | 'moment' | 'weekday' | 'weekdayYear';

const STYLES: Record<Style, Intl.DateTimeFormatOptions> = {
  // As toLocaleDateString() and toLocaleString() write them with no options.
  day: { year: 'numeric', month: 'numeric', day: 'numeric' },
  moment: { year: 'numeric', month: 'numeric', day: 'numeric', hour: 'numeric', minute: 'numeric', second: 'numeric' },
  weekday: { weekday: 'short', month: 'short', day: 'numeric' },
  weekdayYear: { weekday: 'short', month: 'short', day: 'numeric', year: 'numeric' },
};

const built = new Map<string, Intl.DateTimeFormat>();

function formatter(style: Style, calendarDay: boolean): Intl.DateTimeFormat {
  const view = currentPageDrawing()?.view;
  // A calendar day (a due date) is the same day wherever it is read: it is written in UTC, where it is stored.
  const timeZone = calendarDay ? 'UTC' : view?.timeZone;
  const key = `${view?.locale ?? ''}|${timeZone ?? ''}|${style}`;
  let format = built.get(key);
  if (!format) {
    format = new Intl.DateTimeFormat(view?.locale, { ...STYLES[style], timeZone });
    built.set(key, format);
  }
  return format;
}

const instant = (value: string | number | Date) => (value instanceof Date ? value : new Date(value));

/** A moment's date, "12/3/2026" (as toLocaleDateString() writes it). */
export function dayText(value: string | number | Date): string {
  return formatter('day', false).format(instant(value));
}

/** A moment's date and time, "12/3/2026, 2:05:09 PM" (as toLocaleString() writes it). */
export function momentText(value: string | number | Date): string {
  return formatter('moment', false).format(instant(value));
}

/** A moment's day as people say it, "Thu, Dec 3". */
export function weekdayText(value: string | number | Date): string {
  return formatter('weekday', false).format(instant(value));
}

/** A calendar day (YYYY-MM-DD) as people say it, "Sat, Dec 5", with the year when asked. */
export function calendarDayText(isoDate: string, withYear: boolean): string {
  const [year, month, day] = isoDate.split('-').map(Number) as [number, number, number];
  return formatter(withYear ? 'weekdayYear' : 'weekday', true).format(new Date(Date.UTC(year, month - 1, day, 12)));
}
