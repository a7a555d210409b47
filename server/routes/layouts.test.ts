import { createHash } from 'node:crypto';
import { sql } from 'drizzle-orm';
import { afterAll, describe, expect, it } from 'vitest';
import { addMember, createHarness, signUpShop } from '../test/harness';

const h = createHarness();
afterAll(() => h.database.close());

async function jobWithLayout() {
  const shop = await signUpShop(h);
  const customer = (await shop.agent.post('/api/customers').send({ name: 'Ferris Ombudo' })).body.customer;
  const job = (await shop.agent.post('/api/jobs').send({ title: 'Tidewater Marshwhistles jersey #44', customerId: customer.id })).body.job;
  const created = await shop.agent.post(`/api/jobs/${job.id}/layouts`).send({ name: 'Jersey with two patches' });
  expect(created.status).toBe(201);
  return { ...shop, jobId: job.id as string, layout: created.body.layout, draft: created.body.layout.draft };
}

const withPhotoWindow = (draft: Record<string, unknown>, x = 16) => ({
  ...draft,
  openings: [
    {
      id: 'photo',
      shape: { kind: 'rectangle', width: 7.5, height: 9.5 },
      center: { x, y: 20 },
      rotation: 0,
      depth: 2,
      clearance: -0.25,
      reveals: [0.25],
      pieceSize: { width: 8, height: 10 },
    },
  ],
});

describe('layouts and drafts', () => {
  it("a new layout starts from the shop's stock: two mats on a 32 x 40 outer edge, revision 1, no versions", async () => {
    const { layout } = await jobWithLayout();
    expect(layout.draftRevision).toBe(1);
    expect(layout.versionCount).toBe(0);
    expect(layout.draft.outer).toEqual({ width: 32, height: 40 });
    expect(layout.draft.mats.map((m: { name: string }) => m.name)).toEqual(['Warm white', 'Harbour navy']);
  });

  it('saving a draft based on the current revision moves the revision on by one', async () => {
    const { agent, layout, draft } = await jobWithLayout();
    const res = await agent.put(`/api/layouts/${layout.id}/draft`).send({ document: withPhotoWindow(draft), baseRevision: 1 });
    expect(res.status).toBe(200);
    expect(res.body.draftRevision).toBe(2);
    const read = (await agent.get(`/api/layouts/${layout.id}`)).body.layout;
    expect(read.draft.openings[0].shape).toEqual({ kind: 'rectangle', width: 7.5, height: 9.5 });
  });

  it('a save based on an older revision is refused with 409 and carries the newer draft', async () => {
    const { agent, layout, draft } = await jobWithLayout();
    await agent.put(`/api/layouts/${layout.id}/draft`).send({ document: withPhotoWindow(draft, 10), baseRevision: 1 });
    const stale = await agent.put(`/api/layouts/${layout.id}/draft`).send({ document: withPhotoWindow(draft, 22), baseRevision: 1 });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('draft_changed');
    expect(stale.body.current.draftRevision).toBe(2);
    expect(stale.body.current.draft.openings[0].center.x).toBe(10);
  });

  it('of two saves racing from one revision exactly one wins and the other gets 409; nothing is lost', async () => {
    const { agent, layout, draft, shopId } = await jobWithLayout();
    const designer = await addMember(h, shopId, 'designer');
    const results = await Promise.all(
      Array.from({ length: 6 }, (_, i) =>
        (i % 2 === 0 ? agent : designer).put(`/api/layouts/${layout.id}/draft`).send({ document: withPhotoWindow(draft, 8 + i), baseRevision: 1 }),
      ),
    );
    const statuses = results.map((r) => r.status).sort();
    expect(statuses).toEqual([200, 409, 409, 409, 409, 409]);
    const winner = results.find((r) => r.status === 200)!;
    const winnerX = 8 + results.indexOf(winner);
    const read = (await agent.get(`/api/layouts/${layout.id}`)).body.layout;
    expect(read.draftRevision).toBe(2);
    expect(read.draft.openings[0].center.x).toBe(winnerX);
    for (const loser of results.filter((r) => r.status === 409)) expect(loser.body.current.draft.openings[0].center.x).toBe(winnerX);
  });

  it('an invalid layout document is refused with 400 naming the path, and the draft is kept', async () => {
    const { agent, layout, draft } = await jobWithLayout();
    const bad = { ...draft, outer: { width: -3, height: 40 } };
    const res = await agent.put(`/api/layouts/${layout.id}/draft`).send({ document: bad, baseRevision: 1 });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_layout');
    expect(Object.keys(res.body.error.fields)).toContain('document.outer.width');
    expect((await agent.get(`/api/layouts/${layout.id}`)).body.layout.draftRevision).toBe(1);
  });

  it('a version-1 document is lifted to the current schema on save (one reveal per opening becomes one per lower mat)', async () => {
    const { agent, layout, draft } = await jobWithLayout();
    const old = { ...withPhotoWindow(draft), schemaVersion: 1 } as Record<string, unknown>;
    old.openings = (old.openings as Record<string, unknown>[]).map(({ reveals: _r, ...o }) => ({ ...o, reveal: 0.375 }));
    const res = await agent.put(`/api/layouts/${layout.id}/draft`).send({ document: old, baseRevision: 1 });
    expect(res.status).toBe(200);
    const read = (await agent.get(`/api/layouts/${layout.id}`)).body.layout.draft;
    expect(read.schemaVersion).toBe(2);
    expect(read.openings[0].reveals).toEqual([0.375]);
  });
});

describe('frozen versions', () => {
  it('freezing copies the draft into version 1; later edits change the draft, never the version', async () => {
    const { agent, layout, draft, jobId } = await jobWithLayout();
    await agent.put(`/api/layouts/${layout.id}/draft`).send({ document: withPhotoWindow(draft, 12), baseRevision: 1 });
    const frozen = await agent.post(`/api/layouts/${layout.id}/versions`).send({ baseRevision: 2, note: 'Sent for approval' });
    expect(frozen.status).toBe(201);
    expect(frozen.body.number).toBe(1);

    await agent.put(`/api/layouts/${layout.id}/draft`).send({ document: withPhotoWindow(draft, 20), baseRevision: 2 });
    const v1 = (await agent.get(`/api/layouts/${layout.id}/versions/1`)).body.version;
    expect(v1.document.openings[0].center.x).toBe(12);
    expect(v1.note).toBe('Sent for approval');
    const detail = (await agent.get(`/api/layouts/${layout.id}`)).body;
    expect(detail.layout.draftBasedOnVersion).toBe(1);
    expect(detail.layout.draft.openings[0].center.x).toBe(20);
    expect(detail.versions.map((v: { number: number }) => v.number)).toEqual([1]);

    const log = (await agent.get(`/api/jobs/${jobId}/activity`)).body.activity.map((a: { kind: string }) => a.kind);
    expect(log.slice(0, 2)).toEqual(['version_frozen', 'layout_created']);
  });

  it("each layout in the job's list counts only its own frozen versions", async () => {
    const { agent, layout, jobId } = await jobWithLayout();
    const other = (await agent.post(`/api/jobs/${jobId}/layouts`).send({ name: 'Second idea' })).body.layout;
    for (const baseRevision of [1, 1]) {
      const frozen = await agent.post(`/api/layouts/${layout.id}/versions`).send({ baseRevision });
      expect(frozen.status).toBe(201);
    }
    const listed = (await agent.get(`/api/jobs/${jobId}/layouts`)).body.layouts as { id: string; versionCount: number; draftBasedOnVersion: number | null }[];
    const byId = new Map(listed.map((l) => [l.id, l]));
    expect(byId.get(layout.id)).toMatchObject({ versionCount: 2, draftBasedOnVersion: 2 });
    expect(byId.get(other.id)).toMatchObject({ versionCount: 0, draftBasedOnVersion: null });
    expect((await agent.get(`/api/layouts/${layout.id}`)).body.layout.versionCount).toBe(2);
  });

  it('no route changes a frozen version, and the database refuses a direct update', async () => {
    const { agent, layout } = await jobWithLayout();
    await agent.post(`/api/layouts/${layout.id}/versions`).send({ baseRevision: 1 });
    for (const method of ['put', 'patch', 'delete'] as const) {
      const res = await agent[method](`/api/layouts/${layout.id}/versions/1`).send({ document: {} });
      expect(res.status).toBe(404);
    }
    const tamper = h.database.db.execute(sql`update layout_versions set note = 'tampered' where layout_id = ${layout.id}`);
    // Drizzle wraps the driver's error; the trigger's words are in its cause.
    await expect(tamper).rejects.toMatchObject({ cause: { message: expect.stringMatching(/is frozen and cannot be changed/) } });
    expect((await agent.get(`/api/layouts/${layout.id}/versions/1`)).body.version.note).toBeNull();
  });

  it('freezing a stale revision is refused with 409', async () => {
    const { agent, layout, draft } = await jobWithLayout();
    await agent.put(`/api/layouts/${layout.id}/draft`).send({ document: withPhotoWindow(draft), baseRevision: 1 });
    const res = await agent.post(`/api/layouts/${layout.id}/versions`).send({ baseRevision: 1 });
    expect(res.status).toBe(409);
    expect((await agent.get(`/api/layouts/${layout.id}`)).body.versions).toEqual([]);
  });
});

describe('layout access', () => {
  it('front desk reads layouts but may not create, save or freeze them (403)', async () => {
    const { layout, shopId, jobId, draft } = await jobWithLayout();
    const desk = await addMember(h, shopId, 'front_desk');
    expect((await desk.get(`/api/layouts/${layout.id}`)).status).toBe(200);
    expect((await desk.get(`/api/jobs/${jobId}/layouts`)).body.layouts).toHaveLength(1);
    expect((await desk.post(`/api/jobs/${jobId}/layouts`).send({ name: 'Mine' })).status).toBe(403);
    expect((await desk.put(`/api/layouts/${layout.id}/draft`).send({ document: draft, baseRevision: 1 })).status).toBe(403);
    expect((await desk.post(`/api/layouts/${layout.id}/versions`).send({ baseRevision: 1 })).status).toBe(403);
  });

  it("another shop gets 404 on every layout route of this shop's job", async () => {
    const { layout, jobId, draft, agent } = await jobWithLayout();
    await agent.post(`/api/layouts/${layout.id}/versions`).send({ baseRevision: 1 });
    const other = (await signUpShop(h, 'Rival Frames')).agent;
    expect((await other.get(`/api/jobs/${jobId}/layouts`)).status).toBe(404);
    expect((await other.post(`/api/jobs/${jobId}/layouts`).send({ name: 'x' })).status).toBe(404);
    expect((await other.get(`/api/layouts/${layout.id}`)).status).toBe(404);
    expect((await other.put(`/api/layouts/${layout.id}/draft`).send({ document: draft, baseRevision: 1 })).status).toBe(404);
    expect((await other.post(`/api/layouts/${layout.id}/versions`).send({ baseRevision: 1 })).status).toBe(404);
    expect((await other.get(`/api/layouts/${layout.id}/versions/1`)).status).toBe(404);
  });

  it('a save without a base revision is a 400 naming it', async () => {
    const { agent, layout, draft } = await jobWithLayout();
    const res = await agent.put(`/api/layouts/${layout.id}/draft`).send({ document: draft });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(['baseRevision']);
  });
});

/** A traced garment of `count` points on an ellipse: well over the size read on a compute thread. */
const withTracedOutline = (draft: Record<string, unknown>, count: number) => ({
  ...draft,
  openings: [{
    id: 'jersey',
    shape: { kind: 'outline', points: Array.from({ length: count }, (_, i) => ({ x: 6 * Math.cos((2 * Math.PI * i) / count), y: 8 * Math.sin((2 * Math.PI * i) / count) })) },
    center: { x: 16, y: 20 },
    depth: 1,
  }],
});

describe('large drafts', () => {
  it('a 2 000-point traced outline saves and reads back point for point', async () => {
    const { agent, layout, draft } = await jobWithLayout();
    const document = withTracedOutline(draft, 2000);
    expect(JSON.stringify(document).length).toBeGreaterThan(32 * 1024);
    const res = await agent.put(`/api/layouts/${layout.id}/draft`).send({ document, baseRevision: 1 });
    expect(res.status).toBe(200);
    expect(res.body.draftRevision).toBe(2);
    const read = (await agent.get(`/api/layouts/${layout.id}`)).body.layout.draft;
    expect(read.openings[0].shape.points).toEqual(document.openings[0]!.shape.points);
    // Filled in by the schema's defaults, as for a small document.
    expect(read.openings[0].reveals).toEqual([]);
  });

  it('a large document with one point off the board is a 400 naming that point, and the draft is kept', async () => {
    const { agent, layout, draft } = await jobWithLayout();
    const document = withTracedOutline(draft, 2000);
    document.openings[0]!.shape.points[1500] = { x: 500, y: 0 };
    const res = await agent.put(`/api/layouts/${layout.id}/draft`).send({ document, baseRevision: 1 });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_layout');
    expect(Object.keys(res.body.error.fields)).toEqual(['document.openings.0.shape.points.1500']);
    expect((await agent.get(`/api/layouts/${layout.id}`)).body.layout.draftRevision).toBe(1);
  });

  it('a large stale save is refused with 409 like a small one', async () => {
    const { agent, layout, draft } = await jobWithLayout();
    const document = withTracedOutline(draft, 2000);
    expect((await agent.put(`/api/layouts/${layout.id}/draft`).send({ document, baseRevision: 1 })).status).toBe(200);
    const stale = await agent.put(`/api/layouts/${layout.id}/draft`).send({ document, baseRevision: 1 });
    expect(stale.status).toBe(409);
    expect(stale.body.current.draftRevision).toBe(2);
  });

  it('a body that is not JSON is a 400 in plain words, and a body of another type a 400 asking for the fields', async () => {
    const { agent, layout } = await jobWithLayout();
    const broken = await agent.put(`/api/layouts/${layout.id}/draft`).set('content-type', 'application/json').send('{"document": {"schemaVersion": 2,');
    expect(broken.status).toBe(400);
    expect(broken.body.error).toMatchObject({ code: 'invalid_json', message: 'The request body is not valid JSON' });
    const text = await agent.put(`/api/layouts/${layout.id}/draft`).set('content-type', 'text/plain').send('hello');
    expect(text.status).toBe(400);
    expect(text.body.error.code).toBe('invalid_input');
  });
});


/** The stored columns of one draft, straight from Postgres. */
async function storedDraft(layoutId: string) {
  const { rows } = await h.database.db.execute<{ draft: { openings: { shape: Record<string, unknown> }[] }; lists: Record<string, unknown>; draft_bytes: number }>(
    sql`select draft, draft_outlines as lists, pg_column_size(draft) as draft_bytes from layouts where id = ${layoutId}`,
  );
  return rows[0]!;
}

/**
 * The values stored in the layouts table's TOAST table (where Postgres keeps
 * values too large for the row), by id: an UPDATE that writes a large value
 * again gives it a new id; one that leaves it alone keeps the old one.
 */
async function toastValues(): Promise<number[]> {
  const { rows } = await h.database.db.execute<{ toast: string }>(sql`select reltoastrelid::regclass::text as toast from pg_class where relname = 'layouts'`);
  const ids = await h.database.db.execute<{ id: number }>(sql.raw(`select distinct chunk_id::text::bigint as id from ${rows[0]!.toast} order by 1`));
  return ids.rows.map((r) => Number(r.id));
}

describe('outlines kept by name between saves', () => {
  // The name is SHA-256 (FIPS 180-4) of the points' JSON, base64url (RFC 4648 §5), computed here with Node's crypto.
  const nameOf = (points: unknown) => createHash('sha256').update(JSON.stringify(points)).digest('base64url');

  it('names a saved outline by the SHA-256 of its points, and a save that sends only the name keeps every point', async () => {
    const { agent, layout, draft } = await jobWithLayout();
    const document = withTracedOutline(draft, 2000);
    const points = document.openings[0]!.shape.points;
    const first = await agent.put(`/api/layouts/${layout.id}/draft`).send({ document, baseRevision: 1 });
    expect(first.status).toBe(200);
    expect(first.body.outlineRefs).toEqual({ jersey: nameOf(points) });

    // Stored apart: the document names the list, the list sits in its own column.
    const stored = await storedDraft(layout.id);
    expect(stored.draft.openings[0]!.shape).toEqual({ kind: 'outline', pointsRef: nameOf(points) });
    expect(Object.keys(stored.lists)).toEqual([nameOf(points)]);

    const moved = { ...document, openings: [{ ...document.openings[0]!, center: { x: 15, y: 19 }, shape: { kind: 'outline', pointsRef: nameOf(points) } }] };
    const second = await agent.put(`/api/layouts/${layout.id}/draft`).send({ document: moved, baseRevision: 2 });
    expect(second.status).toBe(200);
    expect(second.body.outlineRefs).toEqual({ jersey: nameOf(points) });
    const read = (await agent.get(`/api/layouts/${layout.id}`)).body.layout;
    expect(read.draftRevision).toBe(3);
    expect(read.draft.openings[0].center).toEqual({ x: 15, y: 19 });
    expect(read.draft.openings[0].shape).toEqual({ kind: 'outline', points });
    expect(read.outlineRefs).toEqual({ jersey: nameOf(points) });
  });

  it('leaves the stored list where it is when a save keeps it, and writes a new one only when the outline changes', async () => {
    const { agent, layout, draft } = await jobWithLayout();
    const document = withTracedOutline(draft, 2000);
    const ref = (await agent.put(`/api/layouts/${layout.id}/draft`).send({ document, baseRevision: 1 })).body.outlineRefs.jersey;
    // The document itself stays small enough to live in the row, so any new chunk would be the list's.
    expect((await storedDraft(layout.id)).draft_bytes).toBeLessThan(2000);
    const before = await toastValues();
    expect(before.length).toBeGreaterThan(0);
    const kept = { ...document, openings: [{ ...document.openings[0]!, center: { x: 17, y: 21 }, shape: { kind: 'outline', pointsRef: ref } }] };
    expect((await agent.put(`/api/layouts/${layout.id}/draft`).send({ document: kept, baseRevision: 2 })).status).toBe(200);
    expect(await toastValues()).toEqual(before);
    // Every point sent again, unchanged (a client that keeps no names): still the same stored list.
    expect((await agent.put(`/api/layouts/${layout.id}/draft`).send({ document, baseRevision: 3 })).status).toBe(200);
    expect(await toastValues()).toEqual(before);

    const retraced = withTracedOutline(draft, 2001);
    const changed = await agent.put(`/api/layouts/${layout.id}/draft`).send({ document: retraced, baseRevision: 4 });
    expect(changed.status).toBe(200);
    expect(await toastValues()).not.toEqual(before);
    // The old list is dropped with the outline that used it.
    expect(Object.keys((await storedDraft(layout.id)).lists)).toEqual([nameOf(retraced.openings[0]!.shape.points)]);
  });

  it('refuses a name the draft does not hold (made up, or another shop\'s) with 422 and saves nothing; a malformed name is a 400', async () => {
    const { agent, layout, draft } = await jobWithLayout();
    const other = await jobWithLayout();
    const theirs = withTracedOutline(other.draft, 1500);
    const theirRef = (await other.agent.put(`/api/layouts/${other.layout.id}/draft`).send({ document: theirs, baseRevision: 1 })).body.outlineRefs.jersey;
    expect(theirRef).toBe(nameOf(theirs.openings[0]!.shape.points));

    const naming = (pointsRef: string) => ({ ...draft, openings: [{ id: 'jersey', shape: { kind: 'outline', pointsRef }, center: { x: 16, y: 20 }, depth: 1 }] });
    for (const ref of [nameOf([{ x: 1, y: 1 }, { x: 2, y: 1 }, { x: 1, y: 2 }]), theirRef]) {
      const res = await agent.put(`/api/layouts/${layout.id}/draft`).send({ document: naming(ref), baseRevision: 1 });
      expect(res.status).toBe(422);
      expect(res.body.error.code).toBe('outline_unknown');
      expect(res.body.error.message).toMatch(/sends the whole outline again/);
    }
    const malformed = await agent.put(`/api/layouts/${layout.id}/draft`).send({ document: naming('not a name'), baseRevision: 1 });
    expect(malformed.status).toBe(400);
    expect((await agent.get(`/api/layouts/${layout.id}`)).body.layout.draftRevision).toBe(1);
    // Their outline is untouched and still theirs alone.
    expect((await other.agent.get(`/api/layouts/${other.layout.id}`)).body.layout.draft.openings[0].shape.points).toEqual(theirs.openings[0]!.shape.points);
  });

  it('checks a kept outline against the board like a sent one: moved off the board it is a 400', async () => {
    const { agent, layout, draft } = await jobWithLayout();
    const document = withTracedOutline(draft, 2000);
    const ref = (await agent.put(`/api/layouts/${layout.id}/draft`).send({ document, baseRevision: 1 })).body.outlineRefs.jersey;
    // The ellipse reaches 6 in across and 8 in down from its centre: a centre 10 in past the right edge puts all of it off the board.
    const offBoard = { ...document, openings: [{ ...document.openings[0]!, center: { x: 42 + 10, y: 20 }, shape: { kind: 'outline', pointsRef: ref } }] };
    const res = await agent.put(`/api/layouts/${layout.id}/draft`).send({ document: offBoard, baseRevision: 2 });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(['document.openings.0.center']);
  });

  it('a stale save that keeps an outline gets the 409 with the whole winning draft; a frozen version holds every point', async () => {
    const { agent, layout, draft } = await jobWithLayout();
    const document = withTracedOutline(draft, 2000);
    const points = document.openings[0]!.shape.points;
    const ref = (await agent.put(`/api/layouts/${layout.id}/draft`).send({ document, baseRevision: 1 })).body.outlineRefs.jersey;
    const kept = (x: number) => ({ ...document, openings: [{ ...document.openings[0]!, center: { x, y: 20 }, shape: { kind: 'outline', pointsRef: ref } }] });
    expect((await agent.put(`/api/layouts/${layout.id}/draft`).send({ document: kept(14), baseRevision: 2 })).status).toBe(200);
    const stale = await agent.put(`/api/layouts/${layout.id}/draft`).send({ document: kept(18), baseRevision: 2 });
    expect(stale.status).toBe(409);
    expect(stale.body.current.draft.openings[0].shape.points).toEqual(points);
    expect(stale.body.current.outlineRefs).toEqual({ jersey: ref });

    const frozen = await agent.post(`/api/layouts/${layout.id}/versions`).send({ baseRevision: 3 });
    expect(frozen.status).toBe(201);
    const version = (await agent.get(`/api/layouts/${layout.id}/versions/${frozen.body.number}`)).body.version;
    expect(version.document.openings[0].shape).toEqual({ kind: 'outline', points });
    expect(version.document.openings[0].center).toEqual({ x: 14, y: 20 });
  });
});
