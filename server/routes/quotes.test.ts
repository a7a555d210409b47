import { eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { demoJerseyLayout } from '../../db/demoLayout';
import { layoutVersions, shopSettings as settingsTable } from '../../db/schema';
import { defaultShopSettings } from '../../features/settings/schema';
import { addMember, createHarness, signUpShop } from '../test/harness';

const h = createHarness();
afterAll(() => h.database.close());

const demoPieces = {
  jersey: { kind: 'garment', label: 'Home jersey #14, folded', widthIn: 16, heightIn: 19 },
  patchA: { kind: 'patch', label: 'Crest patch', widthIn: 4, heightIn: 4 },
  patchB: { kind: 'patch', label: 'Anniversary patch', widthIn: 4, heightIn: 4 },
  photo: { kind: 'photo', label: 'Goal print', widthIn: 10, heightIn: 8 },
  plaque: { kind: 'plaque', label: 'Engraved plaque', widthIn: 9, heightIn: 3 },
} as const;

/** A shop with a job holding the demo jersey layout, framed in BX-150 with acrylic, 2 in deep. */
async function demoJob(frame: object | null = { mouldingCode: 'BX-150', glazingKind: 'acrylic', shadowboxDepthIn: 2 }) {
  const shop = await signUpShop(h, 'Gullwing Frame Loft');
  const customer = (await shop.agent.post('/api/customers').send({ name: 'Perrin Ashdown', email: 'perrin@customers.example' })).body.customer;
  const job = (await shop.agent.post('/api/jobs').send({ title: 'Brackwater Herons #14 jersey', customerId: customer.id })).body.job;
  const ids: Record<string, string> = {};
  for (const [key, piece] of Object.entries(demoPieces)) ids[key] = (await shop.agent.post(`/api/jobs/${job.id}/pieces`).send(piece)).body.piece.id;
  const document = demoJerseyLayout(ids as Parameters<typeof demoJerseyLayout>[0]);
  const layout = (await shop.agent.post(`/api/jobs/${job.id}/layouts`).send({ name: 'Jersey shadowbox', document })).body.layout;
  if (frame) expect((await shop.agent.patch(`/api/jobs/${job.id}`).send({ frame })).status).toBe(200);
  return { ...shop, jobId: job.id as string, layoutId: layout.id as string };
}

type Shop = Awaited<ReturnType<typeof demoJob>>;
const build = (shop: Shop, body: object = {}) => shop.agent.post(`/api/jobs/${shop.jobId}/quotes`).send({ layoutId: shop.layoutId, ...body });
const quotesOf = async (shop: Shop) => (await shop.agent.get(`/api/jobs/${shop.jobId}/quotes`)).body.quotes as { id: string; version: number; state: string; proofId: string | null }[];
const sendProof = async (shop: Shop) => {
  const res = await shop.agent.post(`/api/jobs/${shop.jobId}/proofs`).send({ layoutId: shop.layoutId, versionNumber: 1 });
  expect(res.status).toBe(201);
  return { proofId: res.body.proof.id as string, token: (res.body.link as string).split('/proof/')[1]! };
};
/** The one place these tests get a layout version to send: freezing the draft as version 1. */
async function freezeFirstVersion(shop: Shop) {
  expect((await shop.agent.post(`/api/layouts/${shop.layoutId}/versions`).send({ baseRevision: 1 })).status).toBe(201);
}

describe('building a quote from the layout', () => {
  it('prices the demo layout to the hand-computed total and keeps its basis', async () => {
    const shop = await demoJob();
    const res = await build(shop);
    expect(res.status).toBe(201);
    const q = res.body.quote;
    expect([q.version, q.state]).toEqual([1, 'draft']);
    // Hand figures (see server/quotes/layoutQuote.test.ts): materials 3 x 38.00 + 128.89 + 165.75 + 42.00 = 450.64,
    // markup 40 % = 180.26, mounting 75.00, cutting 55.00, fitting 35.00: 795.90; tax 8.25 % = 65.66; 861.56; half 430.78.
    expect([q.subtotalCents, q.taxCents, q.totalCents, q.depositCents]).toEqual([79590, 6566, 86156, 43078]);
    expect(q.lines.find((l: { kind: string }) => l.kind === 'glazing').explanation).toBe('Glazing, acrylic: 32 x 40 in = 8.89 sq ft x 14.50');
    expect(q.basis).toMatchObject({ layoutName: 'Jersey shadowbox', versionNumber: null, draftRevision: 1, frame: 'BX-150 Deep box, satin black, acrylic, 2 in deep' });
    expect(q.terms).toEqual({ currency: 'USD', markupPercent: 40, taxRatePercent: 8.25, depositSharePercent: 50, minimumChargeCents: 7500 });
    const activity = (await shop.agent.get(`/api/jobs/${shop.jobId}/activity`)).body.activity as { kind: string; detail: Record<string, unknown> }[];
    expect(activity.find((a) => a.kind === 'quote_built')?.detail).toMatchObject({ version: 1, total: '$861.56' });
  });

  it('front desk reads quotes but may not build or change them; another shop gets 404', async () => {
    const shop = await demoJob();
    const quote = (await build(shop)).body.quote;
    const desk = await addMember(h, shop.shopId, 'front_desk');
    expect((await desk.get(`/api/jobs/${shop.jobId}/quotes`)).status).toBe(200);
    expect((await desk.post(`/api/jobs/${shop.jobId}/quotes`).send({ layoutId: shop.layoutId })).status).toBe(403);
    expect((await desk.patch(`/api/jobs/${shop.jobId}/quotes/${quote.id}`).send({ extras: [], adjustments: [] })).status).toBe(403);
    const designer = await addMember(h, shop.shopId, 'designer');
    expect((await designer.post(`/api/jobs/${shop.jobId}/quotes`).send({ layoutId: shop.layoutId })).status).toBe(201);
    const other = await signUpShop(h, 'Sandpiper Mouldings');
    expect((await other.agent.get(`/api/jobs/${shop.jobId}/quotes`)).status).toBe(404);
    expect((await other.agent.patch(`/api/jobs/${shop.jobId}/quotes/${quote.id}`).send({ extras: [], adjustments: [] })).status).toBe(404);
    const otherJob = await demoJob();
    // Another job's layout is not this job's.
    const wrong = await shop.agent.post(`/api/jobs/${shop.jobId}/quotes`).send({ layoutId: otherJob.layoutId });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fields.layoutId).toBe('No such layout on this job');
  });

  it('refuses a version without mats in plain words, bad extras with the field named, and records nothing', async () => {
    const shop = await demoJob();
    // A version stored without mats (written directly: the designer never saves one).
    await h.database.db.insert(layoutVersions).values({ shopId: shop.shopId, layoutId: shop.layoutId, number: 7, document: { schemaVersion: 2, outer: { width: 20, height: 24 }, mats: [], openings: [] } });
    const noMats = await build(shop, { versionNumber: 7 });
    expect(noMats.status).toBe(400);
    expect(noMats.body.error).toEqual({ code: 'no_mats', message: 'This version has no mats to price; add a mat in the designer first', requestId: expect.any(String) });
    const badExtra = await build(shop, { extras: [{ label: 'Brass plate', amountCents: -500 }] });
    expect(badExtra.status).toBe(400);
    expect(badExtra.body.error.fields['extras.0.amountCents']).toBe('Amounts cannot be negative');
    const unknownMoulding = await demoJob({ mouldingCode: 'GONE-1', glazingKind: 'acrylic', shadowboxDepthIn: 0 });
    const gone = await build(unknownMoulding);
    expect(gone.status).toBe(400);
    expect(gone.body.error.message).toContain('GONE-1');
    expect(await quotesOf(shop)).toEqual([]);
  });

  it('a price list with a negative price is refused naming the field; settings saved before prices read the defaults', async () => {
    const shop = await demoJob();
    const bad = { ...defaultShopSettings, priceList: { ...defaultShopSettings.priceList, fittingPerFrameCents: -1 } };
    const res = await shop.agent.put('/api/settings').send(bad);
    expect(res.status).toBe(400);
    expect(res.body.error.fields['priceList.fittingPerFrameCents']).toBe('Amounts cannot be negative');
    const twice = { ...defaultShopSettings, mouldings: [...defaultShopSettings.mouldings, defaultShopSettings.mouldings[0]!] };
    expect((await shop.agent.put('/api/settings').send(twice)).body.error.fields['mouldings.3.code']).toBe('This is listed twice');
    const noSheet = { ...defaultShopSettings, priceList: { ...defaultShopSettings.priceList, matBoards: [{ ply: 4, sheetName: 'Jumbo 48 x 96', pricePerSheetCents: 9000 }] } };
    const unlisted = await shop.agent.put('/api/settings').send(noSheet);
    expect(unlisted.status).toBe(400);
    expect(unlisted.body.error.fields['priceList.matBoards.0.sheetName']).toBe('No sheet size is named Jumbo 48 x 96');
    const { priceList: _dropped, ...older } = defaultShopSettings;
    await h.database.db.insert(settingsTable).values({ shopId: shop.shopId, settings: { ...older, rounding: '1/8' } });
    const read = (await shop.agent.get('/api/settings')).body.settings;
    expect(read.rounding).toBe('1/8');
    expect(read.priceList.depositSharePercent).toBe(50);
    expect(read.priceList.currency).toBe('USD');
  });
});

describe('versions, editing and sending', () => {
  it('edits a draft (changed amount with a note, an extra) and recomputes markup, tax and deposit by hand', async () => {
    const shop = await demoJob();
    const q = (await build(shop)).body.quote;
    expect(q.lines[0].label).toBe('Mat board, Harbour navy 4-ply');
    const edit = await shop.agent.patch(`/api/jobs/${shop.jobId}/quotes/${q.id}`).send({
      extras: [{ label: 'Engraved brass plate', amountCents: 2500 }],
      adjustments: [{ line: 0, amountCents: 5000, note: 'Rush order board' }],
    });
    expect(edit.status).toBe(200);
    const e = edit.body.quote;
    expect(e.lines[0]).toMatchObject({ amountCents: 5000, computedCents: 3800, note: 'Rush order board' });
    // Materials 450.64 - 38.00 + 50.00 = 462.64; 40 % = 185.056 -> 185.06; work 75.00 + 55.00 + 35.00, extra 25.00:
    // 462.64 + 185.06 + 165.00 + 25.00 = 837.70; tax 8.25 % = 69.11025 -> 69.11; total 906.81; half 453.405 -> 453.41.
    expect([e.subtotalCents, e.taxCents, e.totalCents, e.depositCents]).toEqual([83770, 6911, 90681, 45341]);
    // Leaving the change out puts the price list's amount back.
    const undone = (await shop.agent.patch(`/api/jobs/${shop.jobId}/quotes/${q.id}`).send({ extras: [], adjustments: [] })).body.quote;
    expect(undone.totalCents).toBe(86156);
    const derivedLine = undone.lines.findIndex((l: { kind: string }) => l.kind === 'markup');
    const refused = await shop.agent.patch(`/api/jobs/${shop.jobId}/quotes/${q.id}`).send({ extras: [], adjustments: [{ line: derivedLine, amountCents: 1, note: 'x' }] });
    expect(refused.status).toBe(400);
    expect(refused.body.error.fields['adjustments.0.line']).toBe('No such computed line');
  });

  it('a new build is version n + 1; the draft goes with the next proof and is then frozen; a newer one replaces it', async () => {
    const shop = await demoJob();
    await freezeFirstVersion(shop);
    const v1 = (await build(shop)).body.quote;
    const v2 = (await build(shop, { versionNumber: 1 })).body.quote;
    expect(v2.version).toBe(2);
    expect(v2.basis.versionNumber).toBe(1);
    expect((await quotesOf(shop)).map((q) => [q.version, q.state])).toEqual([[2, 'draft'], [1, 'replaced']]);
    const first = await sendProof(shop);
    const afterSend = await quotesOf(shop);
    expect(afterSend[0]).toMatchObject({ version: 2, state: 'sent', proofId: first.proofId });
    const locked = await shop.agent.patch(`/api/jobs/${shop.jobId}/quotes/${v2.id}`).send({ extras: [], adjustments: [] });
    expect(locked.status).toBe(409);
    expect(locked.body.error.message).toBe('Version 2 has been sent; build a new version to change the price');
    const v3 = (await build(shop, { versionNumber: 1, extras: [{ label: 'Second hanger set', amountCents: 1200 }] })).body.quote;
    expect(v3.version).toBe(3);
    // Until the next proof the customer still sees version 2.
    expect((await request(h.app).get(`/api/proofs/${first.token}`)).body.proof.quote.version).toBe(2);
    const second = await sendProof(shop);
    expect((await quotesOf(shop)).map((q) => [q.version, q.state, q.proofId])).toEqual([
      [3, 'sent', second.proofId],
      [2, 'replaced', first.proofId],
      [1, 'replaced', null],
    ]);
    expect(v1.version).toBe(1);
  });
});

describe('acceptance through the proof', () => {
  it('the customer sees the lines and total, and approving accepts the quote with their name', async () => {
    const shop = await demoJob();
    await freezeFirstVersion(shop);
    const quote = (await build(shop)).body.quote;
    const { token } = await sendProof(shop);
    const view = (await request(h.app).get(`/api/proofs/${token}`)).body.proof.quote;
    expect(view).toMatchObject({ version: 1, state: 'sent', currency: 'USD', totalCents: 86156, depositCents: 43078, taxRatePercent: 8.25, depositSharePercent: 50 });
    expect(view.lines).toHaveLength(quote.lines.length);
    const approve = await request(h.app).post(`/api/proofs/${token}/decision`).send({ decision: 'approve', name: 'Perrin Ashdown' });
    expect(approve.status).toBe(200);
    expect(approve.body.proof.quote.state).toBe('accepted');
    const [accepted] = await quotesOf(shop);
    expect(accepted).toMatchObject({ id: quote.id, state: 'accepted', acceptedName: 'Perrin Ashdown' });
    expect(Date.parse((accepted as unknown as { acceptedAt: string }).acceptedAt)).toBeGreaterThan(Date.now() - 60_000);
    expect((await shop.agent.get(`/api/jobs/${shop.jobId}`)).body.job.status).toBe('approved');
  });

  it('asking for changes leaves the quote sent; a proof without a quote shows none', async () => {
    const shop = await demoJob();
    await freezeFirstVersion(shop);
    const bare = await sendProof(shop);
    expect((await request(h.app).get(`/api/proofs/${bare.token}`)).body.proof.quote).toBeNull();
    await build(shop);
    const { token } = await sendProof(shop);
    await request(h.app).post(`/api/proofs/${token}/decision`).send({ decision: 'changes', comment: 'Swap the red mat for green' });
    expect((await quotesOf(shop))[0]!.state).toBe('sent');
  });
});
