import { Dimensions } from 'react-native';
import { currentPageDrawing, type PageView } from '../api/pageDrawing';
import { VIEW_COOKIE, viewCookieValue } from '../api/viewCookie';

let browserLocale: { locale: string; timeZone: string } | undefined;

/** This browser's view, as its screens see it. */
export function currentView(): PageView {
  const { width, height } = Dimensions.get('window');
  // Asked once: the first answer loads the browser's locale data, and neither changes on a page.
  browserLocale ??= new Intl.DateTimeFormat().resolvedOptions();
  return { width: Math.round(width), height: Math.round(height), locale: browserLocale.locale, timeZone: browserLocale.timeZone };
}

/** Writes this browser's view to its cookie (for a year; the next page's request carries it). */
export function rememberView(): void {
  document.cookie = `${VIEW_COOKIE}=${viewCookieValue(currentView())}; Path=/; Max-Age=31536000; SameSite=Lax`;
}

/**
 * On the server: the window the screens read while a page is drawn, the
 * visitor's when drawing for one, else none (the build's pre-rendering, which
 * draws the phone layout). A no-op in the browser's script.
 */
export function applyServerWindow(): void {
  if (!process.env.EXPO_SERVER) return;
  const view = currentPageDrawing()?.view;
  const window = { width: view?.width ?? 0, height: view?.height ?? 0, scale: 1, fontScale: 1 };
  Dimensions.set({ window, screen: window });
}
