import { and, desc, eq, max, sql, type SQL } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import type { Db } from '../../db/client';
import { jobs, layouts, layoutVersions, members } from '../../db/schema';
import { parseLayout, type Layout } from '../../geometry';
import type { ComputePool } from '../compute/computePool';
import type { DraftSaveRead } from '../compute/draftSave';
import { HttpError, notFound } from '../errors';
import { joinDraft, outlineRefsOf, splitDraft, unknownOutline, type StoredDraft } from './draftOutlines';
import { recordActivity } from './activity';
import { assertCuttable, assertNothingBlocks, openingPieceNames, pieceLabels } from './layoutChecks';
import { getShopSettings } from './settings';
import { validLayout, validParsed } from './validLayout';

/**
 * A new layout's document parsed, repaired and split for storage
 * (server/services/draftOutlines.ts), on a compute thread when the document
 * is large (a traced garment of thousands of points); a small one costs less
 * here than the trip to a thread.
 */
async function newDraftOffLoop(document: unknown, compute: ComputePool | undefined, large: boolean): Promise<StoredDraft> {
  if (compute && large) {
    const read = await compute.run({ kind: 'newDraft', document });
    // A document that does not parse: validParsed throws the 400 naming its fields.
    return read.ok ? read.stored : splitDraft(validParsed(read.parsed).layout);
  }
  return splitDraft(validLayout(document).layout);
}

/** Where a layout document is parsed: on a compute thread when it is `large` and there is a pool. */
export interface LayoutWork {
  readonly compute?: ComputePool;
  readonly large: boolean;
}

const updater = alias(members, 'updater');

function summaryColumns() {
  return {
    id: layouts.id,
    jobId: layouts.jobId,
    name: layouts.name,
    draftRevision: layouts.draftRevision,
    draftBasedOnVersion: layouts.draftBasedOnVersion,
    updatedAt: layouts.updatedAt,
    // Drizzle writes a column inside sql`` without its table, so "id" here would
    // mean layout_versions.id; the outer layout is named in full.
    versionCount: sql<number>`(select count(*)::int from ${layoutVersions} where ${layoutVersions.layoutId} = ${sql.identifier('layouts')}.${sql.identifier('id')})`,
  };
}

const iso = <T extends { updatedAt: Date }>(row: T) => ({ ...row, updatedAt: row.updatedAt.toISOString() });

export async function assertJob(db: Db, shopId: string, jobId: string) {
  const job = await db.query.jobs.findFirst({ where: and(eq(jobs.shopId, shopId), eq(jobs.id, jobId)), columns: { id: true } });
  if (!job) throw notFound('Job');
}

export async function listLayouts(db: Db, shopId: string, jobId: string) {
  await assertJob(db, shopId, jobId);
  const rows = await db
    .select(summaryColumns())
    .from(layouts)
    .where(and(eq(layouts.shopId, shopId), eq(layouts.jobId, jobId)))
    .orderBy(desc(layouts.updatedAt));
  return rows.map(iso);
}

export async function createLayout(db: Db, shopId: string, memberId: string, jobId: string, name: string, document: unknown, work?: LayoutWork) {
  await assertJob(db, shopId, jobId);
  const stored = await newDraftOffLoop(document, work?.compute, work?.large ?? false);
  const id = await db.transaction(async (tx) => {
    const [row] = await tx
      .insert(layouts)
      .values({ shopId, jobId, name, draft: sql`${stored.draftJson}::jsonb`, draftOutlines: sql`${stored.addedJson}::jsonb`, updatedBy: memberId })
      .returning({ id: layouts.id });
    await recordActivity(tx, { shopId, jobId, memberId, kind: 'layout_created', detail: { name, layoutId: row!.id } });
    return row!.id;
  });
  return getLayout(db, shopId, id);
}

export async function getLayout(db: Db, shopId: string, id: string) {
  const [found] = await db
    .select({ ...summaryColumns(), draft: layouts.draft, draftOutlines: layouts.draftOutlines, updatedByName: updater.name })
    .from(layouts)
    .leftJoin(updater, eq(updater.id, layouts.updatedBy))
    .where(and(eq(layouts.shopId, shopId), eq(layouts.id, id)));
  if (!found) throw notFound('Layout');
  const { draftOutlines, ...rest } = found;
  // The whole document, and which list each outline came from so the designer's next save can keep it by name.
  const row = { ...rest, draft: joinDraft(rest.draft, draftOutlines), outlineRefs: outlineRefsOf(rest.draft) };
  const versions = await db
    .select({ number: layoutVersions.number, note: layoutVersions.note, frozenAt: layoutVersions.frozenAt, frozenByName: members.name })
    .from(layoutVersions)
    .leftJoin(members, eq(members.id, layoutVersions.frozenBy))
    .where(eq(layoutVersions.layoutId, id))
    .orderBy(desc(layoutVersions.number));
  return { layout: iso(row), versions: versions.map((v) => ({ ...v, frozenAt: v.frozenAt.toISOString() })) };
}

async function staleError(db: Db, shopId: string, id: string): Promise<HttpError> {
  const { layout } = await getLayout(db, shopId, id);
  return new HttpError(409, 'draft_changed', `${layout.updatedByName ?? 'Someone'} saved this layout after you opened it. Reload to see their changes.`, undefined, {
    current: { draft: layout.draft, outlineRefs: layout.outlineRefs, draftRevision: layout.draftRevision, updatedByName: layout.updatedByName },
  });
}

/**
 * Saves the draft only if nobody saved since `baseRevision`: the revision test
 * and the write are one UPDATE, so two racing saves cannot both win. The
 * same UPDATE checks that every outline kept by name is one the draft
 * holds, and leaves the column of point lists as it was when the save
 * neither adds nor drops one (Postgres then keeps the stored value as it is).
 */
export async function saveDraft(db: Db, shopId: string, memberId: string, id: string, draft: DraftSaveRead) {
  const { draftJson, addedJson, refs, kept, baseRevision, repairs, outlineRefs } = draft;
  const statement = saveStatements(db)[kept.length > 0 ? 'keeping' : 'sending'];
  const [row] = await statement.execute({ shopId, id, baseRevision, memberId, draftJson, addedJson, refs, refCount: refs.length, kept });
  if (!row) {
    const { layout } = await getLayout(db, shopId, id); // 404 when it is not ours
    if (layout.draftRevision === baseRevision) throw unknownOutline();
    throw await staleError(db, shopId, id);
  }
  return { draftRevision: row.draftRevision, repairs, outlineRefs };
}

/**
 * The draft save's UPDATE, prepared once per database: the busiest write of
 * the app (the designer saves every few seconds) is planned once rather than
 * built and planned on every save. One form checks the names a save keeps;
 * the other has none to check.
 */
const preparedSaves = new WeakMap<Db, ReturnType<typeof prepareSaves>>();

function saveStatements(db: Db) {
  let found = preparedSaves.get(db);
  if (!found) preparedSaves.set(db, (found = prepareSaves(db)));
  return found;
}

function prepareSaves(db: Db) {
  const lists = layouts.draftOutlines;
  const refs = sql`${sql.placeholder('refs')}::text[]`;
  // The names the stored draft uses are the keys of its lists (every write keeps them so), read from
  // the small document rather than the large column, which Postgres would otherwise have to unpack.
  const heldNames = sql`jsonb_path_query_array(${layouts.draft}, '$.openings[*].shape.pointsRef')`;
  const sameNames = sql`(${heldNames} @> to_jsonb(${refs}) AND ${heldNames} <@ to_jsonb(${refs}))`;
  // Lists already held as they are (a save that keeps or resends the same outlines) stay where they are.
  const nextLists = sql`CASE WHEN ${sameNames} THEN ${lists} ELSE (SELECT coalesce(jsonb_object_agg(e.key, e.value), '{}'::jsonb) FROM jsonb_each(${lists} || ${sql.placeholder('addedJson')}::jsonb) e WHERE e.key = ANY(${refs})) END`;
  const update = (name: string, keptHeld: SQL | undefined) =>
    db
      .update(layouts)
      // The JSON text as the parse wrote it, so the event loop never stringifies the layout again.
      .set({
        draft: sql`${sql.placeholder('draftJson')}::jsonb`,
        draftOutlines: nextLists,
        draftRevision: sql`${layouts.draftRevision} + 1`,
        updatedBy: sql`${sql.placeholder('memberId')}`,
        updatedAt: sql`now()`,
      })
      .where(and(
        eq(layouts.shopId, sql.placeholder('shopId')), eq(layouts.id, sql.placeholder('id')), eq(layouts.draftRevision, sql.placeholder('baseRevision')),
        keptHeld,
      ))
      .returning({ draftRevision: layouts.draftRevision })
      .prepare(name);
  return {
    keeping: update('layout_draft_save_keeping', sql`${heldNames} @> to_jsonb(${sql.placeholder('kept')}::text[])`),
    sending: update('layout_draft_save', undefined),
  };
}

/** The draft read again and checked (on a compute thread when there is one): a 400 or 422 when it cannot be frozen. */
async function cuttableDraft(tx: Pick<Db, 'select' | 'query'>, shopId: string, jobId: string, draft: unknown, compute?: ComputePool): Promise<Layout> {
  if (!compute) {
    const { layout } = validLayout(draft);
    const [openingNames, settings] = await Promise.all([openingPieceNames(tx, shopId, jobId, layout), getShopSettings(tx, shopId)]);
    assertCuttable({ layout, openingNames, rounding: settings.rounding }, 'freeze');
    return layout;
  }
  const [labels, settings] = await Promise.all([pieceLabels(tx, shopId, jobId), getShopSettings(tx, shopId)]);
  const { parsed, blocking } = await compute.run({ kind: 'freezeChecks', document: draft, pieceLabels: [...labels], rounding: settings.rounding });
  const { layout } = validParsed(parsed);
  assertNothingBlocks(blocking, 'freeze');
  return layout;
}

/** Copies the draft, as of `baseRevision`, into the next numbered version; versions never change again. */
export async function freezeVersion(db: Db, shopId: string, memberId: string, id: string, baseRevision: number, note?: string, compute?: ComputePool) {
  const number = await db.transaction(async (tx) => {
    const [current] = await tx.select().from(layouts).where(and(eq(layouts.shopId, shopId), eq(layouts.id, id))).for('update');
    if (!current) throw notFound('Layout');
    if (current.draftRevision !== baseRevision) throw await staleError(db, shopId, id);
    const layout = await cuttableDraft(tx, shopId, current.jobId, joinDraft(current.draft, current.draftOutlines), compute);
    const [last] = await tx.select({ n: max(layoutVersions.number) }).from(layoutVersions).where(eq(layoutVersions.layoutId, id));
    const next = (last?.n ?? 0) + 1;
    await tx.insert(layoutVersions).values({ shopId, layoutId: id, number: next, document: layout, note: note ?? null, frozenBy: memberId });
    await tx.update(layouts).set({ draftBasedOnVersion: next }).where(eq(layouts.id, id));
    await recordActivity(tx, { shopId, jobId: current.jobId, memberId, kind: 'version_frozen', detail: { layoutId: id, name: current.name, number: next } });
    return next;
  });
  return { number };
}

/**
 * What a file made from a frozen version is named after, and the version's id,
 * in one query and without any document: 404 for a layout or version that is
 * not the shop's.
 */
export async function frozenVersionHeading(db: Pick<Db, 'select'>, shopId: string, layoutId: string, number: number) {
  const [row] = await db
    .select({ layoutName: layouts.name, jobId: layouts.jobId, jobTitle: jobs.title, versionId: layoutVersions.id })
    .from(layouts)
    .innerJoin(jobs, eq(jobs.id, layouts.jobId))
    .leftJoin(layoutVersions, and(eq(layoutVersions.shopId, shopId), eq(layoutVersions.layoutId, layouts.id), eq(layoutVersions.number, number)))
    .where(and(eq(layouts.shopId, shopId), eq(layouts.id, layoutId)));
  if (!row) throw notFound('Layout');
  if (!row.versionId) throw notFound('Version');
  return { ...row, versionId: row.versionId };
}

/** The document of a frozen version exactly as stored. */
export async function frozenDocument(db: Pick<Db, 'select'>, versionId: string): Promise<unknown> {
  const [row] = await db.select({ document: layoutVersions.document }).from(layoutVersions).where(eq(layoutVersions.id, versionId));
  if (!row) throw notFound('Version');
  return row.document;
}

/** A frozen version with its document exactly as stored. */
export async function getStoredVersion(db: Db, shopId: string, layoutId: string, number: number) {
  const [row] = await db
    .select({
      layoutId: layoutVersions.layoutId,
      number: layoutVersions.number,
      note: layoutVersions.note,
      frozenAt: layoutVersions.frozenAt,
      frozenByName: members.name,
      document: layoutVersions.document,
    })
    .from(layoutVersions)
    .leftJoin(members, eq(members.id, layoutVersions.frozenBy))
    .where(and(eq(layoutVersions.shopId, shopId), eq(layoutVersions.layoutId, layoutId), eq(layoutVersions.number, number)));
  if (!row) throw notFound('Version');
  return row;
}

export async function getVersion(db: Db, shopId: string, layoutId: string, number: number) {
  const row = await getStoredVersion(db, shopId, layoutId, number);
  // Stored before a schema change? Lift it to the current form on the way out.
  const parsed = parseLayout(row.document);
  return { ...row, document: parsed.ok ? parsed.layout : row.document, frozenAt: row.frozenAt.toISOString() };
}
