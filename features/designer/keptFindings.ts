import type { Finding } from '../../geometry';

/**
 * `next`, or `previous` when every finding in it says the same thing at the
 * same place. Each answer of the checks arrives as new objects (copied from
 * the worker), and while an opening is dragged most answers repeat the last
 * one: keeping the same list lets the panels and the canvas's marks, which
 * are memoised on it, skip drawing again. Any difference (a message, a
 * measure, a place, a finding more or less) gives `next`.
 */
export function findingsKept(previous: readonly Finding[], next: readonly Finding[]): readonly Finding[] {
  if (previous === next) return previous;
  if (previous.length !== next.length) return next;
  return JSON.stringify(previous) === JSON.stringify(next) ? previous : next;
}
