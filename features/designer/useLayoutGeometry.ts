import { useEffect, useMemo, useRef, useState } from 'react';
import type { Finding, Layout, OpeningLines } from '../../geometry';
import { createLayoutEngine } from '../../geometry';
import { openChecksPort } from './checksPort';
import type { ChecksClient, ChecksResult, ChecksWords } from './checksProtocol';
import { createChecksClient } from './checksProtocol';

const NO_FINDINGS: readonly Finding[] = [];

/**
 * The lines the canvas draws, from `drawn`: the layout as it was when a
 * drag began (the moving openings follow the pointer as a shift of those
 * lines), otherwise the layout itself. A resize reshapes an opening, so its
 * lines follow every frame; only the resized opening is new work.
 */
function useOpeningLines(drawn: Layout): ReadonlyMap<string, OpeningLines> {
  const engine = useRef(createLayoutEngine()).current;
  return useMemo(() => engine.lines(drawn), [engine, drawn]);
}

/**
 * The findings of the checks for `layout`, answered off the page's thread
 * (checksPort): asked again whenever the layout changes, at most once per
 * frame while dragging; `checked` is false until the answer is about the
 * layout as it is now.
 */
function useLayoutChecks(layout: Layout, words: ChecksWords): { findings: readonly Finding[]; checked: boolean } {
  const [result, setResult] = useState<ChecksResult | null>(null);
  const client = useRef<ChecksClient | null>(null);
  useEffect(() => {
    const opened = createChecksClient(openChecksPort(), setResult, (message) => console.error(`The layout checks failed: ${message}`));
    client.current = opened;
    return () => {
      opened.close();
      client.current = null;
    };
  }, []);
  useEffect(() => {
    client.current?.request(layout, words);
  }, [layout, words]);
  return { findings: result?.findings ?? NO_FINDINGS, checked: result?.layout === layout };
}

export function useLayoutGeometry(
  layout: Layout,
  drawn: Layout,
  words: ChecksWords = {},
): { lines: ReadonlyMap<string, OpeningLines>; findings: readonly Finding[]; checked: boolean } {
  const lines = useOpeningLines(drawn);
  const { findings, checked } = useLayoutChecks(layout, words);
  return { lines, findings, checked };
}
