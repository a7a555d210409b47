import { and, desc, eq, inArray, max, ne } from 'drizzle-orm';
import type { z } from 'zod';
import type { Db } from '../../db/client';
import { jobs, layouts, layoutVersions, members, pieces, quotes, type QuoteRow } from '../../db/schema';
import type { PieceKind } from '../../features/pieces/schema';
import { centsText, derivedLineKinds, moneyText, type QuoteBasis, type QuoteLine, type QuoteTerms, type PublicQuoteView, type QuoteView, type quoteBuildInput, type quoteEditInput } from '../../features/quotes/schema';
import { glazingKindLabels, type FrameChoice } from '../../features/settings/materials';
import type { ShopSettings } from '../../features/settings/schema';
import { parseLayout } from '../../geometry';
import { HttpError, notFound } from '../errors';
import { inchText, layoutQuoteLines, QuoteProblem, type FrameForQuote } from '../quotes/layoutQuote';
import { quoteSums } from '../quotes/quoteTotals';
import { recordActivity } from './activity';
import { getShopSettings } from './settings';
import { joinDraft } from './draftOutlines';

type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];

const derived = new Set<string>(derivedLineKinds);

const termsOf = (settings: ShopSettings): QuoteTerms => {
  const p = settings.priceList;
  return { currency: p.currency, markupPercent: p.markupPercent, taxRatePercent: p.taxRatePercent, depositSharePercent: p.depositSharePercent, minimumChargeCents: p.minimumChargeCents };
};

function toView(row: QuoteRow, createdByName: string | null): QuoteView {
  return {
    id: row.id,
    jobId: row.jobId,
    version: row.version,
    state: row.state,
    lines: row.lines,
    subtotalCents: row.subtotalCents,
    taxCents: row.taxCents,
    totalCents: row.totalCents,
    depositCents: row.depositCents,
    terms: row.terms ?? { currency: 'USD', markupPercent: 0, taxRatePercent: 0, depositSharePercent: 50, minimumChargeCents: 0 },
    basis: row.basis ?? { layoutId: '', layoutName: '', versionNumber: null, draftRevision: null, frame: null },
    proofId: row.proofId,
    sentAt: row.sentAt?.toISOString() ?? null,
    acceptedAt: row.acceptedAt?.toISOString() ?? null,
    acceptedName: row.acceptedName,
    createdAt: row.createdAt.toISOString(),
    createdByName,
  };
}

async function jobFrame(db: Db, shopId: string, jobId: string): Promise<FrameChoice | null> {
  const job = await db.query.jobs.findFirst({ where: and(eq(jobs.shopId, shopId), eq(jobs.id, jobId)), columns: { frame: true } });
  if (!job) throw notFound('Job');
  return job.frame ?? null;
}

/** Every version of the job's quote, newest first. */
export async function listQuotes(db: Db, shopId: string, jobId: string): Promise<QuoteView[]> {
  await jobFrame(db, shopId, jobId);
  const rows = await db
    .select({ quote: quotes, createdByName: members.name })
    .from(quotes)
    .leftJoin(members, eq(members.id, quotes.createdBy))
    .where(and(eq(quotes.shopId, shopId), eq(quotes.jobId, jobId)))
    .orderBy(desc(quotes.version));
  return rows.map((r) => toView(r.quote, r.createdByName));
}

async function quoteById(db: Db, shopId: string, jobId: string, id: string): Promise<QuoteView> {
  const found = (await listQuotes(db, shopId, jobId)).find((q) => q.id === id);
  if (!found) throw notFound('Quote');
  return found;
}

/** The layout document to price: a frozen version, or the working draft. */
async function documentToPrice(db: Db, shopId: string, jobId: string, input: z.output<typeof quoteBuildInput>) {
  const layout = await db.query.layouts.findFirst({ where: and(eq(layouts.shopId, shopId), eq(layouts.id, input.layoutId), eq(layouts.jobId, jobId)) });
  if (!layout) throw new HttpError(400, 'invalid_input', "Choose one of this job's layouts", { layoutId: 'No such layout on this job' });
  if (input.versionNumber === undefined) return { layout, document: joinDraft(layout.draft, layout.draftOutlines), versionNumber: null, draftRevision: layout.draftRevision };
  const version = await db.query.layoutVersions.findFirst({ where: and(eq(layoutVersions.layoutId, layout.id), eq(layoutVersions.number, input.versionNumber)) });
  if (!version) throw new HttpError(400, 'invalid_input', 'That version does not exist', { versionNumber: 'No such version' });
  return { layout, document: version.document as unknown, versionNumber: version.number, draftRevision: null };
}

function parsedForQuote(document: unknown) {
  const mats = (document as { mats?: unknown } | null)?.mats;
  if (!Array.isArray(mats) || mats.length === 0) throw new HttpError(400, 'no_mats', 'This version has no mats to price; add a mat in the designer first');
  const parsed = parseLayout(document);
  if (!parsed.ok) throw new HttpError(400, 'invalid_layout', 'This layout cannot be read, so it cannot be priced; open it in the designer and save it again');
  return parsed.layout;
}

function frameForQuote(frame: FrameChoice | null, settings: ShopSettings): FrameForQuote | null {
  if (!frame) return null;
  const moulding = settings.mouldings.find((m) => m.code === frame.mouldingCode);
  if (!moulding) throw new HttpError(400, 'frame_unknown', `The job's moulding ${frame.mouldingCode} is no longer in the shop's list; choose the frame again`);
  const glazing = settings.glazing.find((g) => g.kind === frame.glazingKind);
  if (!glazing) throw new HttpError(400, 'frame_unknown', `The shop no longer lists ${glazingKindLabels[frame.glazingKind].toLowerCase()}; choose the frame again`);
  return { moulding, glazing, shadowboxDepthIn: frame.shadowboxDepthIn };
}

const frameWords = (f: FrameForQuote | null) =>
  f ? `${f.moulding.code} ${f.moulding.name}, ${glazingKindLabels[f.glazing.kind].toLowerCase()}${f.shadowboxDepthIn > 0 ? `, ${inchText(f.shadowboxDepthIn)} in deep` : ''}` : null;

const extraLines = (extras: readonly { label: string; amountCents: number }[]): QuoteLine[] =>
  extras.map((e) => ({ kind: 'extra', label: e.label, explanation: 'Added by the framer', amountCents: e.amountCents }));

/** Prices a layout into a new draft version (n + 1); older drafts of the job are replaced. */
export async function buildQuote(db: Db, shopId: string, memberId: string, jobId: string, input: z.output<typeof quoteBuildInput>): Promise<QuoteView> {
  const frame = await jobFrame(db, shopId, jobId);
  const source = await documentToPrice(db, shopId, jobId, input);
  const layout = parsedForQuote(source.document);
  const settings = await getShopSettings(db, shopId);
  const frameFound = frameForQuote(frame, settings);
  const kindRows = await db.select({ id: pieces.id, kind: pieces.kind }).from(pieces).where(eq(pieces.jobId, jobId));
  let priced: QuoteLine[];
  try {
    priced = layoutQuoteLines({ layout, pieceKinds: new Map(kindRows.map((r) => [r.id, r.kind as PieceKind])), frame: frameFound, sheets: settings.sheets, priceList: settings.priceList });
  } catch (err) {
    if (err instanceof QuoteProblem) throw new HttpError(400, 'cannot_price', err.message, err.field ? { [err.field]: err.message } : undefined);
    throw err;
  }
  const terms = termsOf(settings);
  const sums = quoteSums([...priced, ...extraLines(input.extras)], terms);
  const basis: QuoteBasis = { layoutId: source.layout.id, layoutName: source.layout.name, versionNumber: source.versionNumber, draftRevision: source.draftRevision, frame: frameWords(frameFound) };
  const id = await db.transaction(async (tx) => {
    // The job's row lock serialises version numbers of one job.
    await tx.select({ id: jobs.id }).from(jobs).where(eq(jobs.id, jobId)).for('update');
    const [last] = await tx.select({ n: max(quotes.version) }).from(quotes).where(eq(quotes.jobId, jobId));
    await tx.update(quotes).set({ state: 'replaced' }).where(and(eq(quotes.jobId, jobId), eq(quotes.state, 'draft')));
    const [row] = await tx
      .insert(quotes)
      .values({ shopId, jobId, version: (last?.n ?? 0) + 1, ...sums, terms, basis, createdBy: memberId })
      .returning({ id: quotes.id, version: quotes.version });
    await recordActivity(tx, { shopId, jobId, memberId, kind: 'quote_built', detail: { quoteId: row!.id, version: row!.version, total: moneyText(sums.totalCents, terms.currency) } });
    return row!.id;
  });
  return quoteById(db, shopId, jobId, id);
}

/** The computed lines as the price list gave them, with any earlier changes undone. */
const computedLines = (lines: readonly QuoteLine[]): QuoteLine[] =>
  lines
    .filter((l) => !derived.has(l.kind) && l.kind !== 'extra')
    .map(({ computedCents, note: _note, ...line }) => ({ ...line, amountCents: computedCents ?? line.amountCents }));

/** Changes a draft: its extras and changed amounts (each with a note). A sent quote is never changed. */
export async function editQuote(db: Db, shopId: string, jobId: string, quoteId: string, input: z.output<typeof quoteEditInput>): Promise<QuoteView> {
  await quoteById(db, shopId, jobId, quoteId);
  await db.transaction(async (tx) => {
    const [row] = await tx.select().from(quotes).where(and(eq(quotes.id, quoteId), eq(quotes.jobId, jobId))).for('update');
    if (!row) throw notFound('Quote');
    if (row.state !== 'draft') throw new HttpError(409, 'quote_not_editable', `Version ${row.version} has been ${row.state}; build a new version to change the price`);
    const lines = computedLines(row.lines);
    input.adjustments.forEach((adj, i) => {
      const line = lines[adj.line];
      if (!line) throw new HttpError(400, 'invalid_input', 'Only a line computed from the layout can be changed', { [`adjustments.${i}.line`]: 'No such computed line' });
      if (adj.amountCents !== line.amountCents) lines[adj.line] = { ...line, amountCents: adj.amountCents, computedCents: line.amountCents, note: adj.note };
    });
    const terms = row.terms ?? { currency: 'USD', markupPercent: 0, taxRatePercent: 0, depositSharePercent: 50, minimumChargeCents: 0 };
    const sums = quoteSums([...lines, ...extraLines(input.extras)], terms);
    await tx.update(quotes).set(sums).where(eq(quotes.id, row.id));
  });
  return quoteById(db, shopId, jobId, quoteId);
}

/**
 * Inside the transaction that sends a proof: the job's newest open quote (draft or sent)
 * goes with it; any other sent quote of the job is replaced.
 */
export async function sendQuoteWithProof(tx: Tx, shopId: string, jobId: string, proofId: string, now: Date): Promise<void> {
  const [open] = await tx
    .select({ id: quotes.id, sentAt: quotes.sentAt })
    .from(quotes)
    .where(and(eq(quotes.shopId, shopId), eq(quotes.jobId, jobId), inArray(quotes.state, ['draft', 'sent'])))
    .orderBy(desc(quotes.version))
    .limit(1);
  if (!open) return;
  await tx.update(quotes).set({ state: 'replaced' }).where(and(eq(quotes.jobId, jobId), inArray(quotes.state, ['draft', 'sent']), ne(quotes.id, open.id)));
  await tx.update(quotes).set({ state: 'sent', proofId, sentAt: open.sentAt ?? now }).where(eq(quotes.id, open.id));
}

/** Inside the approval's transaction: the quote that travelled with the proof becomes the job's accepted price. */
export async function acceptQuoteOfProof(tx: Tx, jobId: string, proofId: string, name: string, now: Date): Promise<void> {
  const [sent] = await tx.select({ id: quotes.id }).from(quotes).where(and(eq(quotes.proofId, proofId), eq(quotes.state, 'sent'))).for('update');
  if (!sent) return;
  await tx.update(quotes).set({ state: 'replaced' }).where(and(eq(quotes.jobId, jobId), eq(quotes.state, 'accepted')));
  await tx.update(quotes).set({ state: 'accepted', acceptedAt: now, acceptedName: name }).where(eq(quotes.id, sent.id));
}

/** What the customer's page shows of the quote that travelled with a proof: allow-listed fields only. */
export async function publicQuoteOf(db: Db, proofId: string): Promise<PublicQuoteView | null> {
  const [row] = await db.select().from(quotes).where(and(eq(quotes.proofId, proofId), inArray(quotes.state, ['sent', 'accepted']))).limit(1);
  if (!row || row.state === 'draft') return null;
  const terms = toView(row, null).terms;
  return {
    version: row.version,
    state: row.state,
    currency: terms.currency,
    // A changed amount says so, so the sum in words never disagrees with the amount beside it; the shop's note stays inside.
    lines: row.lines.map((l) => ({
      label: l.label,
      explanation: l.computedCents === undefined ? l.explanation : `${l.explanation}; set by the shop at ${centsText(l.amountCents)}`,
      amountCents: l.amountCents,
    })),
    subtotalCents: row.subtotalCents,
    taxRatePercent: terms.taxRatePercent,
    taxCents: row.taxCents,
    totalCents: row.totalCents,
    depositSharePercent: terms.depositSharePercent,
    depositCents: row.depositCents,
  };
}
