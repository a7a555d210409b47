import { afterAll, describe, expect, it } from 'vitest';
import { addMember, createHarness, moveJobTo, signUpShop } from '../test/harness';

// Cut files come only from the version the customer approved on a proof, unless an owner releases
// a version with a reason; job statuses follow the shop's allowed moves.
const h = createHarness();
afterAll(() => h.database.close());

const mat = (id: string, color: string) => ({ id, name: id, color, coreColor: '#F6F3EA', ply: 4, thickness: 0.055, bevelAngle: 45, sheet: { width: 32, height: 40 } });
const layoutDocument = (jerseyWidth: number) => ({
  schemaVersion: 2,
  outer: { width: 20, height: 24 },
  mats: [mat('Harbour navy', '#1D2B4A'), mat('Warm white', '#F3EFE4')],
  mountingBoard: { color: '#FFFFFF', cut: false },
  openings: [{ id: 'jersey', shape: { kind: 'rectangle', width: jerseyWidth, height: 10 }, center: { x: 10, y: 12 }, depth: 1 }],
});

async function jobWithLayout() {
  const shop = await signUpShop(h, 'Gorsebrook Frame Loft');
  const customer = (await shop.agent.post('/api/customers').send({ name: 'Tamsin Quillfeather', email: 'tamsin@customers.example' })).body.customer;
  const job = (await shop.agent.post('/api/jobs').send({ title: 'Marrowfield Thistlecats #12 jersey', customerId: customer.id })).body.job;
  const layout = (await shop.agent.post(`/api/jobs/${job.id}/layouts`).send({ name: 'Shadowbox', document: layoutDocument(8) })).body.layout;
  return { ...shop, jobId: job.id as string, layoutId: layout.id as string };
}

type Shop = Awaited<ReturnType<typeof jobWithLayout>>;

async function sendProof(shop: Shop, baseRevision: number) {
  const res = await shop.agent.post(`/api/jobs/${shop.jobId}/proofs`).send({ layoutId: shop.layoutId, baseRevision });
  expect(res.status).toBe(201);
  return { token: (res.body.link as string).split('/proof/')[1]!, number: res.body.proof.versionNumber as number };
}

const exportPath = (shop: Shop, n: number) => `/api/layouts/${shop.layoutId}/versions/${n}/export?format=dxf&mat=1`;
const sheetPath = (shop: Shop, n: number) => `/api/layouts/${shop.layoutId}/versions/${n}/cut-sheet`;
const activityKinds = async (shop: Shop) => ((await shop.agent.get(`/api/jobs/${shop.jobId}/activity`)).body.activity as { kind: string }[]).map((a) => a.kind);

describe('cut files only from the approved version', () => {
  it('answers 409 in plain words for a version the customer has not approved, and writes nothing', async () => {
    const shop = await jobWithLayout();
    const { number } = await sendProof(shop, 1);
    for (const path of [exportPath(shop, number), sheetPath(shop, number)]) {
      const res = await shop.agent.get(path);
      expect(res.status).toBe(409);
      expect(res.body.error.code).toBe('not_approved');
      expect(res.body.error.message).toMatch(/has not been approved by the customer/);
    }
    expect(await activityKinds(shop)).not.toContain('file_exported');
    const approval = await shop.agent.get(`/api/layouts/${shop.layoutId}/versions/${number}/approval`);
    expect(approval.body).toEqual({ approval: null, approvedVersion: null });
  });

  it('gives the file once the customer approves on the proof, names them on the cut sheet, and refuses a later unapproved version', async () => {
    const shop = await jobWithLayout();
    const { token, number } = await sendProof(shop, 1);
    expect((await shop.agent.post(`/api/proofs/${token}/decision`).send({ decision: 'approve', name: 'Tamsin Quillfeather' })).status).toBe(200);
    expect((await shop.agent.get(exportPath(shop, number)).buffer(true)).status).toBe(200);
    const sheet = await shop.agent.get(sheetPath(shop, number));
    expect(sheet.text).toContain('Approved by the customer (Tamsin Quillfeather) on the proof');

    // The framer then changes the draft and freezes version 2 without a new proof.
    const draft = await shop.agent.put(`/api/layouts/${shop.layoutId}/draft`).send({ document: layoutDocument(9), baseRevision: 1 });
    expect(draft.status).toBe(200);
    expect((await shop.agent.post(`/api/layouts/${shop.layoutId}/versions`).send({ baseRevision: draft.body.draftRevision })).status).toBe(201);
    const later = await shop.agent.get(exportPath(shop, 2));
    expect(later.status).toBe(409);
    expect(later.body.error.message).toContain('The customer approved version 1');
    expect((await shop.agent.get(`/api/layouts/${shop.layoutId}/versions/2/approval`)).body).toEqual({ approval: null, approvedVersion: 1 });
  });

  it('lets an owner release a version with a reason that is logged and printed, and nobody else', async () => {
    const shop = await jobWithLayout();
    const { number } = await sendProof(shop, 1);
    const release = `/api/layouts/${shop.layoutId}/versions/${number}/release`;
    const designer = await addMember(h, shop.shopId, 'designer');
    expect((await designer.post(release).send({ reason: 'Looks right to me' })).status).toBe(403);
    const noReason = await shop.agent.post(release).send({ reason: '  ' });
    expect(noReason.status).toBe(400);
    expect(Object.keys(noReason.body.error.fields)).toEqual(['reason']);
    expect((await shop.agent.get(exportPath(shop, number))).status).toBe(409);

    const done = await shop.agent.post(release).send({ reason: 'Customer approved it in the shop on Saturday' });
    expect(done.status).toBe(201);
    expect(done.body.approval).toMatchObject({ kind: 'release', reason: 'Customer approved it in the shop on Saturday', releasedBy: 'Ada Test' });
    expect((await designer.get(exportPath(shop, number)).buffer(true)).status).toBe(200);
    const sheet = await designer.get(sheetPath(shop, number));
    expect(sheet.text).toContain("Released for cutting without the customer&#39;s approval by Ada Test");
    expect(sheet.text).toContain('Customer approved it in the shop on Saturday');
    const log = (await shop.agent.get(`/api/jobs/${shop.jobId}/activity`)).body.activity as { kind: string; memberName: string; detail: Record<string, unknown> }[];
    expect(log.find((a) => a.kind === 'cut_released')).toMatchObject({ memberName: 'Ada Test', detail: { number, reason: 'Customer approved it in the shop on Saturday' } });
    expect((await shop.agent.post(release).send({ reason: 'Again' })).status).toBe(409);
  });

  it("keeps another shop's versions out of reach", async () => {
    const shop = await jobWithLayout();
    const { number } = await sendProof(shop, 1);
    const other = await signUpShop(h, 'Elsewhere Framing');
    expect((await other.agent.post(`/api/layouts/${shop.layoutId}/versions/${number}/release`).send({ reason: 'Mine' })).status).toBe(404);
    expect((await other.agent.get(`/api/layouts/${shop.layoutId}/versions/${number}/approval`)).status).toBe(404);
  });
});

describe('job status rules', () => {
  it('refuses moves outside the rules with 409 and plain words', async () => {
    const shop = await jobWithLayout();
    const move = (status: string, note?: string) => shop.agent.post(`/api/jobs/${shop.jobId}/status`).send({ status, ...(note ? { note } : {}) });
    const waiting = await move('awaiting_approval');
    expect(waiting.status).toBe(409);
    expect(waiting.body.error.message).toMatch(/proof is sent/);
    expect((await move('shipped')).status).toBe(409);
    await moveJobTo(h, shop.agent, shop.jobId, 'cancelled');
    const shipCancelled = await move('shipped');
    expect(shipCancelled.status).toBe(409);
    expect(shipCancelled.body.error.code).toBe('status_move_refused');
    expect((await move('taken_in')).status).toBe(200);
  });

  it('approves by hand only for an owner with a reason, logged as an override', async () => {
    const shop = await jobWithLayout();
    const designer = await addMember(h, shop.shopId, 'designer');
    expect((await designer.post(`/api/jobs/${shop.jobId}/status`).send({ status: 'approved', note: 'Fine' })).status).toBe(409);
    const bare = await shop.agent.post(`/api/jobs/${shop.jobId}/status`).send({ status: 'approved' });
    expect(bare.status).toBe(400);
    expect(Object.keys(bare.body.error.fields)).toEqual(['note']);
    const done = await shop.agent.post(`/api/jobs/${shop.jobId}/status`).send({ status: 'approved', note: 'Approved face to face' });
    expect(done.status).toBe(200);
    const log = (await shop.agent.get(`/api/jobs/${shop.jobId}/activity`)).body.activity as { kind: string; detail: Record<string, unknown> }[];
    expect(log[0]).toMatchObject({ kind: 'status_changed', detail: { from: 'taken_in', to: 'approved', note: 'Approved face to face', override: true } });
  });

  it('a shipped job never moves again, and a job past approval takes no new proof', async () => {
    const shop = await jobWithLayout();
    await moveJobTo(h, shop.agent, shop.jobId, 'cutting');
    const late = await shop.agent.post(`/api/jobs/${shop.jobId}/proofs`).send({ layoutId: shop.layoutId, baseRevision: 1 });
    expect(late.status).toBe(409);
    expect(late.body.error.message).toMatch(/before cutting starts/);
    await moveJobTo(h, shop.agent, shop.jobId, 'shipped');
    for (const status of ['cancelled', 'ready', 'collected']) {
      expect((await shop.agent.post(`/api/jobs/${shop.jobId}/status`).send({ status })).status).toBe(409);
    }
  });

  it('cancelling a job closes its open proof link, so the customer cannot approve it', async () => {
    const shop = await jobWithLayout();
    const { token } = await sendProof(shop, 1);
    expect((await shop.agent.get(`/api/proofs/${token}`)).status).toBe(200);
    expect((await shop.agent.post(`/api/jobs/${shop.jobId}/status`).send({ status: 'cancelled' })).status).toBe(200);
    expect((await shop.agent.get(`/api/proofs/${token}`)).body.error.code).toBe('proof_closed');
    expect((await shop.agent.post(`/api/proofs/${token}/decision`).send({ decision: 'approve', name: 'Tamsin' })).status).toBe(404);
    expect((await shop.agent.get(`/api/jobs/${shop.jobId}`)).body.job.status).toBe('cancelled');
  });
});
