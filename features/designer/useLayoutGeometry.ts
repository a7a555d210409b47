import { useMemo, useRef } from 'react';
import type { Finding, Layout, LayoutEngineOptions, OpeningLines } from '../../geometry';
import { createLayoutEngine } from '../../geometry';

/**
 * The lines the canvas draws and the findings of the checks, each from its
 * own engine so their memories do not push each other out. Lines follow
 * every frame of a drag (only the dragged opening's placement is new work);
 * the checks wait until the drag ends and then reuse everything unchanged.
 */
export function useLayoutGeometry(
  layout: Layout,
  dragging: boolean,
  words: Pick<LayoutEngineOptions, 'openingNames' | 'rounding'> = {},
): { lines: ReadonlyMap<string, OpeningLines>; findings: readonly Finding[] } {
  const linesEngine = useRef(createLayoutEngine()).current;
  const checksEngine = useMemo(() => createLayoutEngine(words), [words]);
  const lastFindings = useRef<readonly Finding[]>([]);
  const lines = useMemo(() => linesEngine.lines(layout), [linesEngine, layout]);
  const findings = useMemo(() => {
    if (dragging) return lastFindings.current;
    lastFindings.current = checksEngine.check(layout);
    return lastFindings.current;
  }, [checksEngine, layout, dragging]);
  return { lines, findings };
}
