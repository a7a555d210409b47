import { use, useEffect } from 'react';
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

/** The engine to come; React's `use` reads one marked fulfilled at once, without suspending. */
type Prepared = Promise<LayoutEngine>;

/** The engine being prepared for the designer on screen (one at a time), by layout id. */
let current: { key: string; prepared: Prepared } | null = null;

/** The lines of every opening worked out in tasks of about SLICE_MS (one clipper offset at least), the browser free between them. */
function prepareInTurns(layout: Layout): Promise<LayoutEngine> {
  return new Promise((resolve, reject) => {
    const engine = createLayoutEngine();
    const ids = openingsInOrder(layout);
    let steps: WorkSteps<OpeningLines | null> | null = null;
    // A message to ourselves gives the browser a turn without a timer's 4 ms clamp.
    const turns = new MessageChannel();
    turns.port1.onmessage = () => {
      try {
        const start = performance.now();
        while (performance.now() - start < SLICE_MS) {
          steps ??= ids.length > 0 ? engine.prepareLines(layout, ids.shift()!) : null;
          if (!steps) {
            turns.port1.close();
            resolve(engine);
            return;
          }
          if (steps.next().done) steps = null;
        }
        turns.port2.postMessage(null);
      } catch (error) {
        turns.port1.close();
        reject(error);
      }
    };
    turns.port2.postMessage(null);
  });
}

/** All at once, where there is no browser (the server drawing the page). */
function preparedAtOnce(layout: Layout): Prepared {
  const engine = createLayoutEngine();
  for (const id of openingsInOrder(layout)) {
    const steps = engine.prepareLines(layout, id);
    while (!steps.next().done);
  }
  return Object.assign(Promise.resolve(engine), { status: 'fulfilled', value: engine });
}

/**
 * The page's layout engine for the designer of layout `key`, with the lines of
 * every opening of `layout` already worked out. Drawn in the designer's first
 * render, the lines (clipper's offsets of every opening through every mat,
 * run for the first time on the page) were one task of most of a second on a
 * phone; the canvas now finds them remembered. Until they are, the component
 * suspends: the nearest Suspense boundary shows its wheel, or, adopting a page
 * the server drew (where the lines are worked out at once), keeps the
 * server's drawing on screen. Later changes to `layout` (data read again)
 * keep the engine: the designer holds its own state by then; leaving the
 * designer lets the engine go.
 */
export function usePreparedEngine(key: string, layout: Layout): LayoutEngine {
  if (current?.key !== key) {
    current = { key, prepared: typeof document === 'undefined' ? preparedAtOnce(layout) : prepareInTurns(layout) };
  }
  const engine = use(current.prepared);
  useEffect(() => () => {
    if (current?.key === key) current = null;
  }, [key]);
  return engine;
}
