import { startTransition, useEffect, useState } from 'react';
import type { Layout, LayoutEngine, OpeningLines, WorkSteps } from '../../geometry';
import { createLayoutEngine } from '../../geometry/engine';

/**
 * How long one task may work before the browser gets a turn, ms. Lighthouse
 * counts a task as blocking past 50 ms on a phone four times slower than this
 * machine: 8 ms here leaves room for the one offset that runs over.
 */
const SLICE_MS = 8;

/** Openings with fewer points first: the first offsets also pay for clipper's first run, cheaper on a small shape. */
function openingsInOrder(layout: Layout): string[] {
  const size = (o: Layout['openings'][number]) => (o.shape.kind === 'polygon' || o.shape.kind === 'outline' ? o.shape.points.length : 1) * o.depth;
  return [...layout.openings].sort((a, b) => size(a) - size(b)).map((o) => o.id);
}

function preparedAtOnce(layout: Layout): LayoutEngine {
  const engine = createLayoutEngine();
  for (const id of openingsInOrder(layout)) {
    const steps = engine.prepareLines(layout, id);
    while (!steps.next().done);
  }
  return engine;
}

/**
 * The page's layout engine for the designer of layout `key`, handed over once
 * the lines of every opening of `layout` are worked out, in tasks of about
 * SLICE_MS (one clipper offset at least). Drawn in the designer's first
 * render, the lines (clipper's offsets of every opening through every mat,
 * run for the first time on the page) were one task of most of a second on a
 * phone; the canvas then finds them remembered.
 * Null until then (and while there is no layout). Later changes to `layout`
 * (data read again) keep the engine: the designer holds its own state by then.
 * On the server (drawing the page for a visitor) there is no one to give turns
 * to: the lines are worked out at once, and the designer drawn with them.
 */
export function usePreparedEngine(key: string, layout: Layout | null): LayoutEngine | null {
  const [prepared, setPrepared] = useState<{ key: string; engine: LayoutEngine } | null>(() =>
    typeof document === 'undefined' && layout ? { key, engine: preparedAtOnce(layout) } : null,
  );
  const ready = prepared?.key === key ? prepared.engine : null;
  useEffect(() => {
    if (ready || !layout) return;
    const engine = createLayoutEngine();
    const ids = openingsInOrder(layout);
    let current: WorkSteps<OpeningLines | null> | null = null;
    // A message to ourselves gives the browser a turn without a timer's 4 ms clamp.
    const turns = new MessageChannel();
    turns.port1.onmessage = () => {
      const start = performance.now();
      while (performance.now() - start < SLICE_MS) {
        current ??= ids.length > 0 ? engine.prepareLines(layout, ids.shift()!) : null;
        if (!current) {
          turns.port1.close();
          // A transition, so React draws the designer in short slices rather than one task.
          startTransition(() => setPrepared({ key, engine }));
          return;
        }
        if (current.next().done) current = null;
      }
      turns.port2.postMessage(null);
    };
    turns.port2.postMessage(null);
    return () => turns.port1.close();
  }, [ready, key, layout]);
  return ready;
}
