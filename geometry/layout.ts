import type { Layout, Opening } from './layoutSchema';
import { DEFAULT_REVEAL_IN, LAYOUT_SCHEMA_VERSION, MAX_MATS, MAX_OPENINGS, layoutSchema } from './layoutSchema';

export interface LayoutIssue {
  readonly path: string;
  readonly message: string;
}

export type LayoutParseResult =
  | { readonly ok: true; readonly layout: Layout; readonly repairs: readonly string[] }
  | { readonly ok: false; readonly issues: readonly LayoutIssue[] };

type Document = Record<string, unknown>;

interface MigrationStep {
  readonly from: number;
  /** Lifts a document of version `from` to `from + 1`; never mutates its input. */
  readonly up: (document: Document) => Document;
}

/**
 * Version 1 stored one `reveal` number per opening, shown under every lower
 * mat; version 2 stores a `reveals` array so each lower mat can differ.
 */
const revealsPerMat: MigrationStep = {
  from: 1,
  up: (document) => ({
    ...document,
    schemaVersion: 2,
    openings: asArray(document.openings).map((opening) => {
      if (!isDocument(opening)) return opening;
      const { reveal, ...rest } = opening;
      const depth = typeof rest.depth === 'number' && rest.depth > 1 ? Math.floor(rest.depth) : 1;
      const value = typeof reveal === 'number' ? reveal : DEFAULT_REVEAL_IN;
      return { ...rest, reveals: Array.from({ length: depth - 1 }, () => value) };
    }),
  }),
};

const MIGRATIONS: readonly MigrationStep[] = [revealsPerMat];

function isDocument(value: unknown): value is Document {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

function asArray(value: unknown): unknown[] {
  return Array.isArray(value) ? value : [];
}

function migrate(input: Document): { document: Document } | { issue: LayoutIssue } {
  let document = input;
  const stated = document.schemaVersion;
  if (typeof stated !== 'number' || !Number.isInteger(stated) || stated < 1) {
    return { issue: { path: 'schemaVersion', message: 'The layout has no readable schema version.' } };
  }
  let version = stated;
  if (version > LAYOUT_SCHEMA_VERSION) {
    return { issue: { path: 'schemaVersion', message: `The layout was saved by a newer Matwright (version ${version}).` } };
  }
  while (version < LAYOUT_SCHEMA_VERSION) {
    const step = MIGRATIONS.find((m) => m.from === version);
    if (!step) return { issue: { path: 'schemaVersion', message: `No way to read layout version ${version}.` } };
    document = step.up(document);
    version = document.schemaVersion as number;
  }
  return { document };
}

/**
 * Gives every repeated id a fresh one ("a", "a" becomes "a", "a-2") in one
 * pass: each base id remembers the next number to try, so 16 000 copies of
 * one id cost 16 000 steps, not 16 000 squared. Repairs beyond the first few
 * are summed up in one line rather than listed.
 */
export function withUniqueIds<T extends { id: string }>(items: readonly T[], label: string, repairs: string[]): T[] {
  const seen = new Set<string>(items.map((item) => item.id));
  const firstTaken = new Set<string>();
  const nextNumber = new Map<string, number>();
  let renamed = 0;
  const result = items.map((item) => {
    if (!firstTaken.has(item.id)) {
      firstTaken.add(item.id);
      return item;
    }
    let n = nextNumber.get(item.id) ?? 2;
    while (seen.has(`${item.id}-${n}`)) n++;
    const id = `${item.id}-${n}`;
    nextNumber.set(item.id, n + 1);
    seen.add(id);
    firstTaken.add(id);
    renamed++;
    if (renamed <= LISTED_REPAIRS) repairs.push(`A second ${label} "${item.id}" was renamed "${id}".`);
    return { ...item, id };
  });
  if (renamed > LISTED_REPAIRS) repairs.push(`${renamed - LISTED_REPAIRS} more repeated ${label}s were renamed the same way.`);
  return result;
}

/** Repairs listed one by one; the rest are counted. */
const LISTED_REPAIRS = 20;

function repairOpening(opening: Opening, matCount: number, repairs: string[]): Opening {
  let { depth, reveals } = opening;
  if (depth > matCount) {
    repairs.push(`Opening "${opening.id}" cut ${depth} mats but the stack has ${matCount}; it now cuts ${matCount}.`);
    depth = matCount;
  }
  if (reveals.length < depth - 1) {
    const missing = depth - 1 - reveals.length;
    repairs.push(`Opening "${opening.id}" was missing ${missing} reveal(s); each was set to 1/4 in.`);
    reveals = [...reveals, ...Array.from({ length: missing }, () => DEFAULT_REVEAL_IN)];
  } else if (reveals.length > depth - 1) {
    repairs.push(`Opening "${opening.id}" had reveals for mats it does not cut; the extra ones were dropped.`);
    reveals = reveals.slice(0, depth - 1);
  }
  return depth === opening.depth && reveals === opening.reveals ? opening : { ...opening, depth, reveals };
}

/**
 * The counts the schema limits, checked before any element is parsed, so
 * 16 000 openings are refused without validating each one first.
 */
function countLimitIssue(document: Document): LayoutIssue | null {
  const openings = asArray(document.openings);
  if (openings.length > MAX_OPENINGS) return { path: 'openings', message: `A layout may have at most ${MAX_OPENINGS} openings; this one has ${openings.length}` };
  const mats = asArray(document.mats);
  if (mats.length > MAX_MATS) return { path: 'mats', message: `A stack may have at most ${MAX_MATS} mats; this one has ${mats.length}` };
  return null;
}

/**
 * The one way a stored or imported layout comes in: lift older versions,
 * validate, then repair what can be repaired without guessing (depths beyond
 * the stack, missing reveals, repeated ids, swapped bridge limits), listing
 * each repair in plain words.
 */
export function parseLayout(input: unknown): LayoutParseResult {
  if (!isDocument(input)) return { ok: false, issues: [{ path: '', message: 'A layout must be an object.' }] };
  const migrated = migrate(input);
  if ('issue' in migrated) return { ok: false, issues: [migrated.issue] };
  const tooMany = countLimitIssue(migrated.document);
  if (tooMany) return { ok: false, issues: [tooMany] };
  const parsed = layoutSchema.safeParse(migrated.document);
  if (!parsed.success) {
    return { ok: false, issues: parsed.error.issues.map((issue) => ({ path: issue.path.join('.'), message: issue.message })) };
  }
  const repairs: string[] = [];
  const layout = parsed.data;
  const mats = withUniqueIds(layout.mats, 'mat id', repairs);
  const openings = withUniqueIds(layout.openings, 'opening id', repairs).map((o) => repairOpening(o, mats.length, repairs));
  let checkSettings = layout.checkSettings;
  if (checkSettings.bridgeError > checkSettings.bridgeWarning) {
    repairs.push('The bridge error limit was wider than the warning limit; the two were swapped.');
    checkSettings = { ...checkSettings, bridgeError: checkSettings.bridgeWarning, bridgeWarning: checkSettings.bridgeError };
  }
  return { ok: true, layout: { ...layout, mats, openings, checkSettings }, repairs };
}
