import type { PageView } from './pageDrawing';

/**
 * What the server needs to draw a signed-in page as this browser would: the
 * window (phone or wide layouts) and how dates are written (locale, time
 * zone). Every page's script writes it to a cookie as it starts (sign-in
 * included), and the server reads it back with the page's next request.
 */
export const VIEW_COOKIE = 'matwright_view';

const MAX_SIDE = 20_000;
const TAG = /^[A-Za-z0-9-]{2,35}$/;
const ZONE = /^[A-Za-z0-9_+\-/]{1,60}$/;

export function viewCookieValue(view: PageView): string {
  return encodeURIComponent([`${view.width}x${view.height}`, view.locale, view.timeZone].join('|'));
}

/** The view a cookie names, or null for anything a browser of ours did not write (the page is then sent undrawn). */
export function parseViewCookie(value: string | undefined): PageView | null {
  if (!value || value.length > 200) return null;
  let text: string;
  try {
    text = decodeURIComponent(value);
  } catch {
    return null;
  }
  const [size, locale, timeZone, ...rest] = text.split('|');
  const sides = /^(\d{1,5})x(\d{1,5})$/.exec(size ?? '');
  if (!sides || rest.length > 0 || !locale || !timeZone || !TAG.test(locale) || !ZONE.test(timeZone)) return null;
  const width = Number(sides[1]);
  const height = Number(sides[2]);
  if (width < 1 || height < 1 || width > MAX_SIDE || height > MAX_SIDE) return null;
  try {
    // Both must be ones this server's Intl knows, or its dates would not match the browser's.
    const [canonical] = Intl.getCanonicalLocales(locale);
    if (!canonical || Intl.DateTimeFormat.supportedLocalesOf([canonical]).length === 0) return null;
    const zone = new Intl.DateTimeFormat('en', { timeZone }).resolvedOptions().timeZone;
    return { width, height, locale: canonical, timeZone: zone };
  } catch {
    return null;
  }
}

