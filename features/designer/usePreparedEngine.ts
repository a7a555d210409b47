import { useEffect, useState } from 'react';
import type { Layout, LayoutEngine } from '../../geometry';
import { createLayoutEngine } from '../../geometry';

/** Openings with fewer points first: the first outlines offset also pay for clipper's first run, so a small one takes that cost. */
function openingsInOrder(layout: Layout): string[] {
  const size = (o: Layout['openings'][number]) => (o.shape.kind === 'polygon' || o.shape.kind === 'outline' ? o.shape.points.length : 1) * o.depth;
  return [...layout.openings].sort((a, b) => size(a) - size(b)).map((o) => o.id);
}

/**
 * The page's layout engine for the designer of layout `key`, handed over once
 * the lines of every opening of `layout` are worked out, one opening per task.
 * Drawn in the designer's first render, the lines (clipper's offsets of every
 * opening through every mat, run for the first time on the page) were one
 * task of most of a second on a phone; the canvas then finds them remembered.
 * Null until then (and while there is no layout). Later changes to `layout`
 * (data read again) keep the engine: the designer holds its own state by then.
 */
export function usePreparedEngine(key: string, layout: Layout | null): LayoutEngine | null {
  const [prepared, setPrepared] = useState<{ key: string; engine: LayoutEngine } | null>(null);
  const ready = prepared?.key === key ? prepared.engine : null;
  useEffect(() => {
    if (ready || !layout) return;
    const engine = createLayoutEngine();
    const ids = openingsInOrder(layout);
    // A message to ourselves gives the browser a turn between openings without a timer's 4 ms clamp.
    const turns = new MessageChannel();
    let next = 0;
    turns.port1.onmessage = () => {
      if (next < ids.length) {
        engine.prepareLines(layout, ids[next]!);
        next += 1;
        turns.port2.postMessage(null);
        return;
      }
      turns.port1.close();
      setPrepared({ key, engine });
    };
    turns.port2.postMessage(null);
    return () => turns.port1.close();
  }, [ready, key, layout]);
  return ready;
}
