import type { Layout } from './layoutSchema';
import type { LengthRounding } from './units';
import { formatLength } from './units';

/**
 * How findings name openings and lengths: each opening by the piece it shows
 * (the caller's names, e.g. "Home jersey"), or "opening 3" by its place in
 * the layout; lengths in the shop's rounding (3/16", 4.5 mm). The exact
 * decimal stays in each finding's `measured` and `required`.
 */
export interface FindingWords {
  /** Changes whenever any word would: part of every remembered finding's key. */
  readonly key: string;
  readonly opening: (openingId: string) => string;
  readonly length: (inches: number) => string;
}

export interface FindingWordsOptions {
  /** Names of the pieces the openings show, by opening id. */
  readonly openingNames?: ReadonlyMap<string, string>;
  /** The shop's rounding for lengths in messages; 1/16 in unless given. */
  readonly rounding?: LengthRounding;
}

export function findingWords(layout: Pick<Layout, 'openings'>, options: FindingWordsOptions = {}): FindingWords {
  const rounding = options.rounding ?? '1/16';
  const names = options.openingNames ?? new Map<string, string>();
  const places = new Map<string, number>();
  layout.openings.forEach((o, i) => places.set(o.id, i + 1));
  const opening = (id: string) => {
    const name = names.get(id)?.trim();
    return name ? `opening "${name}"` : `opening ${places.get(id) ?? '?'}`;
  };
  const nameKey = [...names].map(([id, name]) => `${id}=${name}`).join(';');
  const placeKey = layout.openings.map((o) => o.id).join(',');
  return { key: `${rounding}|${nameKey}|${placeKey}`, opening, length: (v) => formatLength(v, rounding) };
}

export function matWords(matIndex: number): string {
  return `mat ${matIndex + 1}`;
}

/** "Opening 3" at the start of a sentence. */
export function capitalised(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}
