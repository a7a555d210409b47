import DxfParser from 'dxf-parser';
import type { Response } from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { defaultShopSettings, type CutterProfile } from '../../features/settings/schema';
import type { CutFileQuery } from '../../features/exports/schema';
import { inlineCompute } from '../compute/computePool';
import { exportCutFile } from '../services/exports';
import { createFrozenFileCache } from '../services/frozenFileCache';
import { addMember, createHarness, signUpShop } from '../test/harness';

const h = createHarness();
afterAll(() => h.database.close());

const binary = (res: Response) => res.text ?? (res.body as Buffer).toString('utf8');
const mat = (id: string, name: string) => ({ id, name, color: '#1D2B4A', coreColor: '#F6F3EA', ply: 4, thickness: 0.055, bevelAngle: 45, sheet: { width: 32, height: 40 } });
const document = {
  schemaVersion: 2,
  outer: { width: 20, height: 24 },
  mats: [mat('top', 'Harbour navy'), mat('lower', 'Old gold')],
  mountingBoard: { color: '#FFFFFF', cut: false },
  openings: [
    { id: 'photo', shape: { kind: 'rectangle', width: 8, height: 10 }, center: { x: 6, y: 8 }, depth: 2, reveals: [0.25] },
    { id: 'patch', shape: { kind: 'circle', radius: 2 }, center: { x: 15, y: 18 }, depth: 1 },
  ],
};

const profile = (over: Partial<CutterProfile>): CutterProfile => ({ ...defaultShopSettings.cutterProfiles[0]!, ...over });

/** A shop with a job, a layout frozen at version 1, and two extra cutter profiles. */
async function frozenLayout() {
  const shop = await signUpShop(h, 'Saltmarsh Frame Room');
  const customer = (await shop.agent.post('/api/customers').send({ name: 'Orla Penhallow' })).body.customer;
  const job = (await shop.agent.post('/api/jobs').send({ title: 'Tidewater Brackenwings #44', customerId: customer.id })).body.job;
  const created = await shop.agent.post(`/api/jobs/${job.id}/layouts`).send({ name: 'Jersey with a patch', document });
  const layoutId = created.body.layout.id as string;
  expect((await shop.agent.post(`/api/layouts/${layoutId}/versions`).send({ baseRevision: 1 })).status).toBe(201);
  // Approved at the counter: the owner releases version 1 for cutting (the proof route is tested below).
  expect((await shop.agent.post(`/api/layouts/${layoutId}/versions/1/release`).send({ reason: 'Customer approved it at the counter' })).status).toBe(201);
  const settings = {
    ...defaultShopSettings,
    cutterProfiles: [
      ...defaultShopSettings.cutterProfiles,
      profile({ id: 'metric-one-file', name: 'Metric, one file', units: 'mm', filePerMat: false }),
      profile({ id: 'small-bed', name: 'Small bed', maxSheetWidthIn: 16, maxSheetHeightIn: 20 }),
    ],
  };
  expect((await shop.agent.put('/api/settings').send(settings)).status).toBe(200);
  return { ...shop, jobId: job.id as string, layoutId, base: `/api/layouts/${layoutId}/versions/1` };
}

const read = (text: string) => new DxfParser().parseSync(text) as unknown as { header: Record<string, unknown>; tables: { layer: { layers: Record<string, unknown> } }; entities: unknown[] };

describe('cut file export', () => {
  it('gives an owner one mat as a DXF attachment named after the job and version, and logs it on the job', async () => {
    const { agent, base, jobId, layoutId } = await frozenLayout();
    const res = await agent.get(`${base}/export?format=dxf&profile=default&mat=1`).buffer(true);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^application\/dxf/);
    expect(res.headers['content-disposition']).toBe('attachment; filename="tidewater-brackenwings-44-v1-mat1.dxf"');
    const file = read(binary(res));
    expect(file.header.$INSUNITS).toBe(1);
    expect(Object.keys(file.tables.layer.layers).sort()).toEqual(['0', 'MAT1_OPENINGS', 'MAT1_OUTER']);
    expect(file.entities).toHaveLength(3);
    const activity = (await agent.get(`/api/jobs/${jobId}/activity`)).body.activity as { kind: string; detail: unknown }[];
    expect(activity.find((a) => a.kind === 'file_exported')?.detail).toEqual({ format: 'dxf', layoutId, version: 1, mat: '1', profile: 'default' });
  });

  it('gives a designer an SVG in inches, and all mats in one millimetre file when the profile takes one file', async () => {
    const { base, shopId } = await frozenLayout();
    const designer = await addMember(h, shopId, 'designer');
    const svg = await designer.get(`${base}/export?format=svg&mat=2`).buffer(true);
    expect(svg.status).toBe(200);
    expect(svg.headers['content-type']).toMatch(/^image\/svg\+xml/);
    expect(svg.headers['content-disposition']).toBe('attachment; filename="tidewater-brackenwings-44-v1-mat2.svg"');
    expect(binary(svg)).toMatch(/width="20in" height="24in" viewBox="0 0 20 24"/);
    const all = await designer.get(`${base}/export?format=dxf&profile=metric-one-file&mat=all`).buffer(true);
    expect(all.status).toBe(200);
    expect(all.headers['content-disposition']).toContain('tidewater-brackenwings-44-v1-all-mats.dxf');
    const file = read(binary(all));
    expect(file.header.$INSUNITS).toBe(4);
    expect(Object.keys(file.tables.layer.layers).sort()).toEqual(['0', 'MAT1_OPENINGS', 'MAT1_OUTER', 'MAT2_OPENINGS', 'MAT2_OUTER']);
  });

  it('refuses the front desk with 403 and another shop with 404', async () => {
    const { base, shopId } = await frozenLayout();
    const frontDesk = await addMember(h, shopId, 'front_desk');
    expect((await frontDesk.get(`${base}/export?format=dxf&mat=1`)).status).toBe(403);
    expect((await frontDesk.get(`${base}/cut-sheet`)).status).toBe(403);
    const other = await signUpShop(h, 'Brackwater Framing');
    const foreign = await other.agent.get(`${base}/export?format=dxf&mat=1`);
    expect(foreign.status).toBe(404);
    expect((await other.agent.get(`${base}/cut-sheet`)).status).toBe(404);
  });

  it('has nothing to export for a draft that was never frozen, a version that does not exist or an id that is not one', async () => {
    const { agent, jobId, layoutId } = await frozenLayout();
    const draftOnly = (await agent.post(`/api/jobs/${jobId}/layouts`).send({ name: 'Unfrozen idea', document })).body.layout.id;
    expect((await agent.get(`/api/layouts/${draftOnly}/versions/1/export?format=dxf&mat=1`)).status).toBe(404);
    expect((await agent.get(`/api/layouts/${layoutId}/versions/2/export?format=dxf&mat=1`)).status).toBe(404);
    expect((await agent.get(`/api/layouts/${layoutId}/versions/first/export?format=dxf&mat=1`)).status).toBe(404);
    expect((await agent.get('/api/layouts/not-a-uuid/versions/1/export?format=dxf&mat=1')).status).toBe(404);
  });

  it('answers 400 naming the field for a bad format, an unknown profile, a mat out of range or all mats for a one-file-per-mat cutter', async () => {
    const { agent, base } = await frozenLayout();
    const cases: [string, string][] = [
      ['format=pdf&mat=1', 'format'],
      ['mat=1', 'format'],
      ['format=dxf&profile=laser-9000&mat=1', 'profile'],
      ['format=dxf&mat=3', 'mat'],
      ['format=dxf&mat=first', 'mat'],
      ['format=dxf&profile=default&mat=all', 'mat'],
    ];
    for (const [query, field] of cases) {
      const res = await agent.get(`${base}/export?${query}`);
      expect(res.status, query).toBe(400);
      expect(Object.keys(res.body.error.fields), query).toEqual([field]);
    }
  });

  it('answers 422 and writes nothing when the layout is larger than the largest sheet the cutter takes', async () => {
    const { agent, base, jobId } = await frozenLayout();
    const res = await agent.get(`${base}/export?format=dxf&profile=small-bed&mat=1`);
    expect(res.status).toBe(422);
    expect(res.body.error.message).toMatch(/20 x 24 in .* up to 16 x 20 in/);
    const activity = (await agent.get(`/api/jobs/${jobId}/activity`)).body.activity as { kind: string }[];
    expect(activity.filter((a) => a.kind === 'file_exported')).toEqual([]);
  });
});

describe('files kept from a frozen version', () => {
  /** The file made afresh from the database, by the same service with nothing kept. */
  async function freshlyMade(agent: Awaited<ReturnType<typeof frozenLayout>>['agent'], shopId: string, layoutId: string, query: CutFileQuery) {
    const memberId = (await agent.get('/api/auth/me')).body.member.id as string;
    const file = await exportCutFile(h.database.db, inlineCompute(), createFrozenFileCache(0), shopId, memberId, layoutId, 1, query);
    return file.body;
  }

  it('serves a repeated export byte for byte as a file made afresh, and logs every export', async () => {
    const { agent, base, shopId, layoutId, jobId } = await frozenLayout();
    const first = binary(await agent.get(`${base}/export?format=dxf&profile=default&mat=1`).buffer(true));
    const again = binary(await agent.get(`${base}/export?format=dxf&profile=default&mat=1`).buffer(true));
    const fresh = await freshlyMade(agent, shopId, layoutId, { format: 'dxf', profile: 'default', mat: '1' });
    // The DXF reference: a file is a sequence of group code / value pairs, so equal text is an equal drawing.
    expect(again).toBe(first);
    expect(again).toBe(fresh);
    const activity = (await agent.get(`/api/jobs/${jobId}/activity`)).body.activity as { kind: string }[];
    expect(activity.filter((a) => a.kind === 'file_exported')).toHaveLength(3);
  });

  it('makes a new file when a setting it depends on changes, equal to one made afresh', async () => {
    const { agent, base, shopId, layoutId } = await frozenLayout();
    const inches = binary(await agent.get(`${base}/export?format=dxf&profile=default&mat=1`).buffer(true));
    // The DXF reference: $INSUNITS 1 is inches, 4 is millimetres.
    expect(read(inches).header.$INSUNITS).toBe(1);
    const settings = (await agent.get('/api/settings')).body.settings;
    const metric = { ...settings, cutterProfiles: settings.cutterProfiles.map((p: CutterProfile) => (p.id === 'default' ? { ...p, units: 'mm' } : p)) };
    expect((await agent.put('/api/settings').send(metric)).status).toBe(200);
    const millimetres = binary(await agent.get(`${base}/export?format=dxf&profile=default&mat=1`).buffer(true));
    expect(read(millimetres).header.$INSUNITS).toBe(4);
    expect(millimetres).not.toBe(inches);
    expect(millimetres).toBe(await freshlyMade(agent, shopId, layoutId, { format: 'dxf', profile: 'default', mat: '1' }));
  });

  it('keeps a cut sheet apart from a cut file and makes a changed job title a new sheet', async () => {
    const { agent, base, jobId } = await frozenLayout();
    const sheet = await agent.get(`${base}/cut-sheet`);
    expect(sheet.text).toContain('Tidewater Brackenwings #44');
    expect((await agent.patch(`/api/jobs/${jobId}`).send({ title: 'Tidewater Brackenwings #45' })).status).toBe(200);
    const renamed = await agent.get(`${base}/cut-sheet`);
    expect(renamed.text).toContain('Tidewater Brackenwings #45');
    expect(renamed.text).not.toContain('Tidewater Brackenwings #44');
  });
});

describe('cut sheet', () => {
  it('is a printable HTML page with the job, each mat and the blade cautions, loading nothing from outside', async () => {
    const { agent, base } = await frozenLayout();
    const res = await agent.get(`${base}/cut-sheet`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/html/);
    expect(res.headers['content-security-policy']).toContain("default-src 'none'");
    expect(res.text).toContain('Tidewater Brackenwings #44');
    expect(res.text).toContain('Harbour navy');
    expect(res.text).toContain('Old gold');
    expect(res.text).toMatch(/sharps container/);
    expect((await agent.get(`${base}/cut-sheet?profile=nope`)).body.error.fields).toEqual({ profile: expect.any(String) });
  });
});
