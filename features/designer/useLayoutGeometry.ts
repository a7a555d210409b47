import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import type { Finding, Layout, LayoutEngine, OpeningLines } from '../../geometry';
import { openChecksPort } from './checksPort';
import type { ChecksClient, ChecksResult, ChecksWords } from './checksProtocol';
import { createChecksClient } from './checksProtocol';
import { findingsKept } from './keptFindings';

const NO_FINDINGS: readonly Finding[] = [];

/**
 * While dragging, the checks are asked about the layout at most this often.
 * On a phone or a busy two-core machine a worker checking every frame takes
 * the core the page's own drawing needs; ten times a second still follows
 * the pointer, and letting go asks at once.
 */
export const DRAG_CHECK_INTERVAL_MS = 100;

/**
 * The lines the canvas draws, from `drawn`: the layout as it was when a
 * drag began (the moving openings follow the pointer as a shift of those
 * lines), otherwise the layout itself. A resize reshapes an opening, so its
 * lines follow every frame; only the resized opening is new work.
 */
function useOpeningLines(engine: LayoutEngine, drawn: Layout): ReadonlyMap<string, OpeningLines> {
  return useMemo(() => engine.lines(drawn), [engine, drawn]);
}

/**
 * The findings of the checks for `layout`, answered off the page's thread
 * (checksPort): asked again whenever the layout changes, and while
 * `dragging` at most every DRAG_CHECK_INTERVAL_MS (the latest layout when
 * the time comes); `checkMoving` asks the same way about the layouts a drag
 * passes through, which only the canvas draws, and at once about the one it
 * is let go at. `checked` is false until
 * the answer is about the layout as it is now.
 */
function useLayoutChecks(layout: Layout, words: ChecksWords, dragging: boolean): { findings: readonly Finding[]; checked: boolean; checkMoving: (layout: Layout, letGo: boolean) => void } {
  const [result, setResult] = useState<ChecksResult | null>(null);
  const client = useRef<ChecksClient | null>(null);
  const asked = useRef<{ at: number; layout: Layout | null; words: ChecksWords | null }>({ at: -Infinity, layout: null, words: null });
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  useEffect(() => {
    const keep = (next: ChecksResult) => setResult((previous) => (previous ? { ...next, findings: findingsKept(previous.findings, next.findings) } : next));
    const opened = createChecksClient(openChecksPort(), keep, (message) => console.error(`The layout checks failed: ${message}`));
    client.current = opened;
    return () => {
      if (timer.current) clearTimeout(timer.current);
      opened.close();
      client.current = null;
      asked.current = { at: -Infinity, layout: null, words: null };
    };
  }, []);
  const schedule = useCallback((next: Layout, nextWords: ChecksWords, moving: boolean) => {
    if (timer.current) clearTimeout(timer.current);
    timer.current = null;
    if (asked.current.layout === next && asked.current.words === nextWords) return;
    const ask = () => {
      timer.current = null;
      asked.current = { at: performance.now(), layout: next, words: nextWords };
      client.current?.request(next, nextWords);
    };
    const wait = moving ? DRAG_CHECK_INTERVAL_MS - (performance.now() - asked.current.at) : 0;
    if (wait > 0) timer.current = setTimeout(ask, wait);
    else ask();
  }, []);
  useEffect(() => schedule(layout, words, dragging), [schedule, layout, words, dragging]);
  const wordsNow = useRef(words);
  wordsNow.current = words;
  const checkMoving = useCallback((moved: Layout, letGo: boolean) => schedule(moved, wordsNow.current, !letGo), [schedule]);
  return { findings: result?.findings ?? NO_FINDINGS, checked: result?.layout === layout, checkMoving };
}

export function useLayoutGeometry(
  engine: LayoutEngine,
  layout: Layout,
  drawn: Layout,
  dragging: boolean,
  words: ChecksWords = {},
): { lines: ReadonlyMap<string, OpeningLines>; findings: readonly Finding[]; checked: boolean; checkMoving: (layout: Layout, letGo: boolean) => void } {
  const lines = useOpeningLines(engine, drawn);
  const { findings, checked, checkMoving } = useLayoutChecks(layout, words, dragging);
  return { lines, findings, checked, checkMoving };
}
