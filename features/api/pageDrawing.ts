/**
 * A signed-in page drawn on the server with its data (server/pages). The
 * server's drawing thread sets one of these before drawing a page and clears
 * it after; the app's code in the drawing bundle reads it to reach the API as
 * the visitor (their cookie, the server's own address) and to hand back the
 * reads the page was drawn with. In the browser there is none.
 */
export interface PageDrawing {
  /** The server's own address, where the drawing thread reads the API ("http://127.0.0.1:8080"). */
  readonly apiOrigin: string;
  /** The visitor's Cookie header, so every read answers as it would to them. */
  readonly cookie: string;
  /** The visitor's window and the locale and time zone their browser formats dates in (features/ui/pageView.ts). */
  readonly view: PageView;
  /** Set by the app once the page's query cache exists: reads the queries the last drawing asked for and still lacks. */
  readPending?: () => Promise<number>;
  /** Set by the app: the first failed read's message, or false (a page with a failed read is not drawn with data). */
  anyFailed?: () => string | false;
  /** Set by the app: the reads, as the browser's cache takes them back (TanStack Query's dehydrated state). */
  reads?: () => unknown;
}

/** What a browser draws a page for, beyond the page's data: its window and how it writes dates. */
export interface PageView {
  readonly width: number;
  readonly height: number;
  /** A BCP 47 tag ("en-GB"). */
  readonly locale: string;
  /** An IANA zone ("Europe/Lisbon"). */
  readonly timeZone: string;
}

declare global {
  // eslint-disable-next-line no-var
  var __matwrightPageDrawing: PageDrawing | undefined;
}

/** The drawing under way, only ever in the server's drawing bundle. */
export function currentPageDrawing(): PageDrawing | undefined {
  return process.env.EXPO_SERVER ? globalThis.__matwrightPageDrawing : undefined;
}

/** The id of the JSON block in a server-drawn page that carries the reads it was drawn with. */
export const FIRST_READS_ID = 'matwright-first-reads';
