import type { Layout } from '../../geometry';

/**
 * The names findings give openings: the label of the piece each shows
 * ("Home jersey"); the checks call the rest "opening 3" by their place.
 * Kept as a string key so the checks' engine is rebuilt only when a name
 * really changes.
 */
export function openingNamesKey(layout: Pick<Layout, 'openings'>, pieces: readonly { id: string; label: string }[]): string {
  const labels = new Map(pieces.map((p) => [p.id, p.label]));
  const pairs: [string, string][] = [];
  for (const opening of layout.openings) {
    const label = opening.pieceId ? labels.get(opening.pieceId) : undefined;
    if (label) pairs.push([opening.id, label]);
  }
  return JSON.stringify(pairs);
}

export function openingNamesFromKey(key: string): ReadonlyMap<string, string> {
  return new Map(JSON.parse(key) as [string, string][]);
}
