import { createHash } from 'node:crypto';
import { sql } from 'drizzle-orm';
import { checkedOutline, MAX_OPENINGS, type BoardPoint, type Layout } from '../../geometry';
import { HttpError } from '../errors';

/**
 * A draft keeps its long point lists (traced garments, polygons) beside the
 * document rather than inside it. The document names each list by the
 * SHA-256 of its JSON (base64url, 43 characters); the lists sit in a second
 * column keyed by that name. The designer saves every few seconds while a
 * framer works, and an outline of thousands of points rarely changes between
 * two saves: a save that keeps an outline sends its name only, the server
 * checks it against what it already holds, and Postgres keeps the column of
 * lists as it was instead of writing it again.
 *
 * Only drafts are stored this way. A frozen version holds its whole document.
 */

/** A shape whose points are kept beside the document: `{ kind, pointsRef }`. */
export const POINTS_REF = /^[A-Za-z0-9_-]{43}$/;

/** The name of a list of points: SHA-256 of its JSON, base64url. */
export function outlineRef(pointsJson: string): string {
  return createHash('sha256').update(pointsJson).digest('base64url');
}

/** The names already worked out for lists this process has checked. */
const refOfList = new WeakMap<readonly BoardPoint[], string>();

/** A draft split for storage: the document with names for lists, and the lists. */
export interface StoredDraft {
  /** The document's JSON with every outline and polygon as `{ kind, pointsRef }`. */
  readonly draftJson: string;
  /** Every name the document uses, each once. */
  readonly refs: readonly string[];
  /** Lists not among `known`: a JSON object of name → points. "{}" when there are none. */
  readonly addedJson: string;
  /** Which list each opening's shape uses, for the designer's next save. */
  readonly outlineRefs: Readonly<Record<string, string>>;
}

/** Splits a parsed layout for storage; lists named in `known` are already stored and not sent again. */
export function splitDraft(layout: Layout, known: ReadonlySet<string> = new Set()): StoredDraft {
  const added: string[] = [];
  const addedRefs = new Set<string>();
  const refs = new Set<string>();
  const outlineRefs: Record<string, string> = {};
  const openings = layout.openings.map((opening) => {
    const { shape } = opening;
    if (!('points' in shape)) return opening;
    let ref = refOfList.get(shape.points);
    let json: string | undefined;
    if (!ref) {
      json = JSON.stringify(shape.points);
      ref = outlineRef(json);
      refOfList.set(shape.points, ref);
    }
    refs.add(ref);
    outlineRefs[opening.id] = ref;
    if (!known.has(ref) && !addedRefs.has(ref)) {
      addedRefs.add(ref);
      added.push(`${JSON.stringify(ref)}:${json ?? JSON.stringify(shape.points)}`);
    }
    return { ...opening, shape: { kind: shape.kind, pointsRef: ref } };
  });
  return { draftJson: JSON.stringify({ ...layout, openings }), refs: [...refs], addedJson: `{${added.join(',')}}`, outlineRefs };
}

/** A new layout's draft columns for an insert: the document with its point lists named, and the lists. */
export function draftColumns(layout: Layout) {
  const stored = splitDraft(layout);
  return { draft: sql`${stored.draftJson}::jsonb`, draftOutlines: sql`${stored.addedJson}::jsonb` };
}

function openingsOf(document: unknown): unknown[] | null {
  const openings = (document as { openings?: unknown } | null)?.openings;
  return Array.isArray(openings) ? openings : null;
}

function refOf(shape: unknown): string | null {
  const ref = (shape as { pointsRef?: unknown } | null)?.pointsRef;
  return typeof ref === 'string' ? ref : null;
}

/** Which list each opening of a stored draft uses. */
export function outlineRefsOf(draft: unknown): Record<string, string> {
  const refs: Record<string, string> = {};
  for (const opening of openingsOf(draft) ?? []) {
    const o = opening as { id?: unknown; shape?: unknown } | null;
    const ref = refOf(o?.shape);
    if (ref && typeof o?.id === 'string') refs[o.id] = ref;
  }
  return refs;
}

/**
 * A stored draft as one whole document: each `{ kind, pointsRef }` given its
 * points back. A draft stored before lists were kept apart has none and is
 * returned as it is. A name with no list stays as it is, and the layout's
 * parse then says the shape has no points.
 */
export function joinDraft(draft: unknown, lists: unknown): unknown {
  const openings = openingsOf(draft);
  if (!openings || typeof lists !== 'object' || lists === null) return draft;
  const byRef = lists as Record<string, unknown>;
  let changed = false;
  const joined = openings.map((opening) => {
    const o = opening as { shape?: Record<string, unknown> } | null;
    const ref = refOf(o?.shape);
    if (!ref || !Object.hasOwn(byRef, ref)) return opening;
    changed = true;
    const { pointsRef: _name, ...shape } = o!.shape!;
    return { ...o, shape: { ...shape, points: byRef[ref] } };
  });
  return changed ? { ...(draft as object), openings: joined } : draft;
}

/**
 * The names a draft save's text uses, found without parsing it (a large text
 * is parsed on a compute thread): JSON escapes every quote inside a string,
 * so `"pointsRef":"…"` with bare quotes is only ever a key and its value.
 */
export function refsInText(text: string): string[] {
  const found = new Set<string>();
  for (const match of text.matchAll(/"pointsRef"\s*:\s*"([^"\\]*)"/g)) {
    const ref = match[1]!;
    if (!POINTS_REF.test(ref)) {
      throw new HttpError(400, 'invalid_layout', 'The layout is not valid; nothing was saved', { document: 'pointsRef names a kept outline by the name the server gave it' });
    }
    found.add(ref);
    if (found.size > MAX_OPENINGS) throw new HttpError(400, 'invalid_layout', 'The layout is not valid; nothing was saved', { document: `A layout may name at most ${MAX_OPENINGS} kept outlines` });
  }
  return [...found];
}

/**
 * A draft save's document with each named list put back, so the layout's
 * parse checks the whole document. Lists are taken from `lists` (already
 * checked); a name not there is refused in words the designer acts on by
 * sending the points again.
 */
export function withListsPutBack(document: unknown, lists: ReadonlyMap<string, readonly BoardPoint[]>): unknown {
  const openings = openingsOf(document);
  if (!openings) return document;
  let changed = false;
  const resolved = openings.map((opening) => {
    const o = opening as { shape?: Record<string, unknown> } | null;
    const ref = refOf(o?.shape);
    if (ref === null || o!.shape!.points !== undefined) return opening;
    const points = lists.get(ref);
    if (!points) throw unknownOutline();
    changed = true;
    const { pointsRef: _name, ...shape } = o!.shape!;
    return { ...o, shape: { ...shape, points } };
  });
  return changed ? { ...(document as object), openings: resolved } : document;
}

export function unknownOutline(): HttpError {
  return new HttpError(
    422, 'outline_unknown',
    'This layout names a traced outline the server does not hold for it; the designer sends the whole outline again.',
  );
}

/** Marks checked lists with their names, so splitting them again costs no hashing. */
export function rememberRef(points: readonly BoardPoint[], ref: string): void {
  refOfList.set(points, ref);
}

/**
 * Lists recently kept by this process, per shop and name, already checked:
 * a save that keeps an outline is checked without reading it from Postgres.
 * Bounded by points held; the oldest go first.
 */
export class OutlineCache {
  private readonly entries = new Map<string, readonly BoardPoint[]>();
  private points = 0;

  constructor(private readonly maxPoints = 1_000_000) {}

  get(shopId: string, ref: string): readonly BoardPoint[] | undefined {
    const key = `${shopId}:${ref}`;
    const found = this.entries.get(key);
    if (found) {
      this.entries.delete(key);
      this.entries.set(key, found);
    }
    return found;
  }

  /** Checks a list read from storage and keeps it; null when it is not a valid outline or not the list named. */
  admit(shopId: string, ref: string, value: unknown): readonly BoardPoint[] | null {
    const points = checkedOutline(value);
    if (!points || outlineRef(JSON.stringify(points)) !== ref) return null;
    rememberRef(points, ref);
    const key = `${shopId}:${ref}`;
    if (!this.entries.has(key)) {
      this.entries.set(key, points);
      this.points += points.length;
    }
    for (const [oldest, list] of this.entries) {
      if (this.points <= this.maxPoints) break;
      this.entries.delete(oldest);
      this.points -= list.length;
    }
    return points;
  }
}
