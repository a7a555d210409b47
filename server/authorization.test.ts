import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { traceRuns } from '../db/schema';
import type { MemberRole } from '../features/auth/schema';
import { noisyImage } from './test/fixtures/images';
import { addMember, createMailHarness, signUpShop, uniqueEmail, type MailHarness } from './test/harness';
import { routeTable, type RouteEntry } from './test/routeTable';

// The authorisation matrix, generated from the app's own router stack: every
// route x every role of shop A x shop B's ids. A route missing from the table
// below, or one that answers a role it should refuse, fails this test.

type Access = 'public' | 'self' | MemberRole[];
const staff: MemberRole[] = ['owner', 'designer', 'front_desk'];
const designers: MemberRole[] = ['owner', 'designer'];
const owner: MemberRole[] = ['owner'];

/** Who may call each route. "public": no sign-in; "self": only acts on the caller's own account. */
const access: Record<string, Access> = {
  'GET /api/health': 'public',
  'GET /api/ready': 'public',
  // Open only with METRICS_TOKEN's bearer token; without a token set (as here) it answers 404.
  'GET /api/metrics': 'public',
  'POST /api/auth/sign-up': 'public',
  'POST /api/auth/sign-in': 'public',
  'POST /api/auth/sign-out': 'public',
  'POST /api/auth/sign-out-everywhere': 'self',
  'POST /api/auth/password': 'self',
  'GET /api/auth/me': 'self',
  'PATCH /api/shop': owner,
  'GET /api/customers': staff,
  'GET /api/customers/:id': staff,
  'POST /api/customers': staff,
  'PATCH /api/customers/:id': staff,
  'DELETE /api/customers/:id': ['owner', 'front_desk'],
  'GET /api/jobs/:jobId/layouts': staff,
  'POST /api/jobs/:jobId/layouts': designers,
  'GET /api/jobs/:jobId/pieces': staff,
  'GET /api/jobs/:jobId/pieces/:pieceId': staff,
  'POST /api/jobs/:jobId/pieces': staff,
  'PATCH /api/jobs/:jobId/pieces/:pieceId': staff,
  'DELETE /api/jobs/:jobId/pieces/:pieceId': staff,
  'GET /api/jobs/:jobId/proofs': staff,
  'POST /api/jobs/:jobId/proofs': designers,
  'POST /api/jobs/:jobId/proofs/:proofId/revoke': designers,
  'GET /api/jobs/:jobId/quotes': staff,
  'POST /api/jobs/:jobId/quotes': designers,
  'PATCH /api/jobs/:jobId/quotes/:quoteId': designers,
  'GET /api/jobs/:jobId/payments': staff,
  'POST /api/jobs/:jobId/payments/checkout': ['owner', 'front_desk'],
  'POST /api/jobs/:jobId/payments/manual': ['owner', 'front_desk'],
  'POST /api/payments/webhook': 'public',
  'GET /api/jobs/:jobId/proofs/:proofId/changes-photo': staff,
  'GET /api/proofs/:token': 'public',
  'POST /api/proofs/:token/decision': 'public',
  'GET /api/proofs/:token/pieces/:index/photo': 'public',
  'POST /api/proofs/:token/arrival': 'public',
  'POST /api/proofs/:token/arrival/photos': 'public',
  'GET /api/proofs/:token/arrival/photos/:index': 'public',
  'GET /api/jobs/:jobId/shipping': staff,
  'POST /api/jobs/:jobId/shipment': staff,
  'GET /api/jobs/:jobId/arrival': staff,
  'GET /api/jobs/:jobId/arrival/photos/:photoId': staff,
  'POST /api/jobs/:jobId/arrival/photos/:photoId/showcase': staff,
  'GET /api/jobs': staff,
  'GET /api/jobs/:id': staff,
  'POST /api/jobs': staff,
  'PATCH /api/jobs/:id': staff,
  'POST /api/jobs/:id/status': staff,
  'GET /api/jobs/:id/activity': staff,
  'POST /api/jobs/:jobId/pieces/:pieceId/photos': staff,
  'GET /api/photos/:photoId/:variant': staff,
  'DELETE /api/photos/:photoId': staff,
  'GET /api/layouts/:id': staff,
  'PUT /api/layouts/:id/draft': designers,
  'POST /api/layouts/:id/versions': designers,
  'GET /api/layouts/:id/versions/:number': staff,
  'GET /api/layouts/:id/versions/:number/export': designers,
  'GET /api/layouts/:id/versions/:number/cut-sheet': designers,
  'GET /api/layouts/:id/versions/:number/approval': designers,
  'POST /api/layouts/:id/versions/:number/release': owner,
  'GET /api/members': staff,
  'GET /api/members/invitations': owner,
  'POST /api/members/invitations': owner,
  'DELETE /api/members/invitations/:id': owner,
  'PATCH /api/members/:id': owner,
  'DELETE /api/members/:id': owner,
  'GET /api/invitations/:secret': 'public',
  'POST /api/invitations/:secret/accept': 'public',
  'GET /api/outbox': staff,
  'GET /api/outbox/:id': staff,
  'GET /api/photos/:photoId/corners': designers,
  'POST /api/jobs/:jobId/pieces/:pieceId/traces': designers,
  'GET /api/traces/:traceId': staff,
  'GET /api/traces/:traceId/image': staff,
  'PUT /api/jobs/:jobId/pieces/:pieceId/outline': designers,
  'GET /api/settings': staff,
  'PUT /api/settings': owner,
  // The customer's proof page and its files: the link's secret is the only key.
  'GET /proof-assets/:name': 'public',
  'GET /proof/:token': 'public',
  'POST /proof/:token': 'public',
  'POST /proof/:token/arrival': 'public',
  'POST /proof/:token/arrival/photos': 'public',
  'GET /{*splat}': 'public',
};

interface ShopB {
  customer: string;
  job: string;
  piece: string;
  photo: string;
  layout: string;
  draft: unknown;
  invitation: string;
  member: string;
  outbox: string;
  trace: string;
  /** Words that appear only in shop B's data; no answer to shop A may contain them. */
  secrets: string[];
}

/** The path with shop B's ids in place of every parameter. */
function fill(path: string, b: ShopB): string {
  const byPrefix: [string, string][] = [
    ['/api/customers/:id', b.customer],
    ['/api/jobs/:id', b.job],
    ['/api/layouts/:id', b.layout],
    ['/api/members/invitations/:id', b.invitation],
    ['/api/members/:id', b.member],
    ['/api/outbox/:id', b.outbox],
  ];
  const match = byPrefix.find(([prefix]) => path === prefix || path.startsWith(`${prefix}/`));
  const filled = match ? path.replace(match[0], match[0].replace(':id', match[1])) : path;
  const values: Record<string, string> = { jobId: b.job, pieceId: b.piece, photoId: b.photo, traceId: b.trace, variant: 'original', number: '1', secret: 'S'.repeat(43), proofId: b.job, quoteId: b.job, token: 'T'.repeat(43), index: '0', name: 'proofZoom.js' };
  const withIds = filled.replace(/:([A-Za-z]+)/g, (_m, name: string) => {
    if (!(name in values)) throw new Error(`the matrix does not know the path parameter :${name}; add it to fill()`);
    return values[name]!;
  });
  // Required query parameters, so a refusal comes from the guard and not from validation.
  return withIds.endsWith('/export') ? `${withIds}?format=svg` : withIds;
}

/** A body that would succeed on the caller's own rows, so a refusal shows the guard and not a validation slip. */
function bodyFor(key: string, b: ShopB): object | undefined {
  const bodies: Record<string, object> = {
    'PATCH /api/customers/:id': { name: 'Renamed by another shop' },
    'POST /api/jobs': { title: 'Job on another shop\'s customer', customerId: b.customer },
    'PATCH /api/jobs/:id': { title: 'Renamed by another shop' },
    'POST /api/jobs/:id/status': { status: 'designing' },
    'POST /api/jobs/:jobId/layouts': { name: 'Layout in another shop' },
    'POST /api/jobs/:jobId/pieces': { kind: 'photo', label: 'Piece in another shop', widthIn: 8, heightIn: 10 },
    'PATCH /api/jobs/:jobId/pieces/:pieceId': { label: 'Renamed by another shop' },
    'PUT /api/layouts/:id/draft': { document: b.draft, baseRevision: 1 },
    'POST /api/layouts/:id/versions': { baseRevision: 1 },
    'POST /api/jobs/:jobId/proofs': { layoutId: b.layout, baseRevision: 1 },
    'POST /api/jobs/:jobId/quotes': { layoutId: b.layout },
    'PATCH /api/jobs/:jobId/quotes/:quoteId': { extras: [], adjustments: [] },
    'POST /api/proofs/:token/decision': { decision: 'approve', name: 'Someone else' },
    'POST /api/layouts/:id/versions/:number/release': { reason: 'Released by another shop' },
    'POST /api/jobs/:jobId/payments/checkout': { purpose: 'deposit' },
    'POST /api/jobs/:jobId/payments/manual': { method: 'cash', amountCents: 100 },
    'POST /api/proofs/:token/arrival': { comment: 'Arrived fine' },
    'POST /api/jobs/:jobId/shipment': { carrier: 'Parcel carrier', trackingNumber: 'B1', emailCustomer: false },
    'PATCH /api/members/:id': { role: 'owner' },
    'POST /api/jobs/:jobId/pieces/:pieceId/traces': {
      photoId: b.photo,
      calibration: { kind: 'twoPoints', from: { x: 1, y: 1 }, to: { x: 30, y: 1 }, distanceIn: 10 },
    },
    'PUT /api/jobs/:jobId/pieces/:pieceId/outline': { traceId: b.trace, points: [{ x: 0, y: 0 }, { x: 4, y: 0 }, { x: 0, y: 4 }] },
  };
  return bodies[key];
}

const keyOf = (r: RouteEntry) => `${r.method} ${r.path}`;
const hasShopIds = (path: string) => /:(?!secret|token|splat)/.test(path.replace('/{*splat}', ''));

let h: MailHarness;
let b: ShopB;
let agents: Record<MemberRole, ReturnType<typeof request.agent>>;
let before: string;

/** Shop B's rows as they stand, to prove nothing of B changed. */
async function snapshotOfB(bOwner: ReturnType<typeof request.agent>): Promise<string> {
  const reads = [
    `/api/customers/${b.customer}`,
    `/api/jobs/${b.job}`,
    `/api/jobs/${b.job}/pieces`,
    `/api/jobs/${b.job}/payments`,
    `/api/layouts/${b.layout}`,
    '/api/members',
    '/api/members/invitations',
    '/api/settings',
    '/api/auth/me',
  ];
  const bodies = await Promise.all(reads.map(async (path) => JSON.stringify((await bOwner.get(path)).body)));
  return bodies.join('\n');
}

let bOwner: ReturnType<typeof request.agent>;

beforeAll(async () => {
  h = await createMailHarness();
  const shopB = await signUpShop(h, 'Kestrel Point Frames');
  bOwner = shopB.agent;
  const customer = (await bOwner.post('/api/customers').send({ name: 'Zephyrine Oakhollow', notes: 'private note of shop B' })).body.customer;
  const job = (await bOwner.post('/api/jobs').send({ title: 'Thornbury Flintmoths signed shirt', customerId: customer.id })).body.job;
  const piece = (await bOwner.post(`/api/jobs/${job.id}/pieces`).send({ kind: 'photo', label: 'Shop B photo piece', widthIn: 8, heightIn: 10 })).body.piece;
  const photo = (
    await bOwner.post(`/api/jobs/${job.id}/pieces/${piece.id}/photos`).attach('photo', await noisyImage(40, 30, 'png'), { filename: 'b.png', contentType: 'image/png' })
  ).body.photo;
  const layout = (await bOwner.post(`/api/jobs/${job.id}/layouts`).send({ name: 'Shop B layout' })).body.layout;
  expect((await bOwner.post(`/api/layouts/${layout.id}/versions`).send({ baseRevision: layout.draftRevision })).status).toBe(201);
  const invited = uniqueEmail('b-invitee');
  const invitation = (await bOwner.post('/api/members/invitations').send({ email: invited, role: 'designer' })).body.invitation;
  await addMember(h, shopB.shopId, 'designer');
  const team = (await bOwner.get('/api/members')).body.members as { id: string; role: string }[];
  const outbox = (await bOwner.get('/api/outbox')).body.messages as { id: string }[];
  // A trace run of shop B's, written directly: the test app runs no tracing queue.
  const [trace] = await h.database.db
    .insert(traceRuns)
    .values({ shopId: shopB.shopId, pieceId: piece.id, photoId: photo.id, calibration: { kind: 'twoPoints', from: { x: 1, y: 1 }, to: { x: 30, y: 1 }, distanceIn: 10 }, options: {} })
    .returning({ id: traceRuns.id });
  b = {
    customer: customer.id,
    job: job.id,
    piece: piece.id,
    photo: photo.id,
    layout: layout.id,
    draft: layout.draft,
    invitation: invitation.id,
    member: team.find((m) => m.role === 'designer')!.id,
    outbox: outbox[0]!.id,
    trace: trace!.id,
    secrets: ['Zephyrine Oakhollow', 'private note of shop B', 'Thornbury Flintmoths', 'Shop B photo piece', 'Shop B layout', 'Kestrel Point', invited, shopB.email],
  };
  before = await snapshotOfB(bOwner);

  const shopA = await signUpShop(h, 'Marram Dunes Frames');
  agents = { owner: shopA.agent, designer: await addMember(h, shopA.shopId, 'designer'), front_desk: await addMember(h, shopA.shopId, 'front_desk') };
}, 60_000);
afterAll(() => h.close());

function send(agent: ReturnType<typeof request.agent> | ReturnType<typeof request>, route: RouteEntry, path: string, body?: object) {
  const method = route.method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete';
  const req = agent[method](path);
  return body ? req.send(body) : req;
}

describe('authorisation matrix', () => {
  it('every route the app registers has a row in the access table, and every row names a route', () => {
    const routes = routeTable(h.app).map(keyOf);
    expect(routes.filter((k) => !(k in access))).toEqual([]);
    // The web build's catch-all is registered only when a build exists; the test app has none.
    expect(Object.keys(access).filter((k) => !routes.includes(k) && k !== 'GET /{*splat}')).toEqual([]);
    expect(routes.length).toBeGreaterThan(40);
  });

  it('a visitor who is not signed in gets 401 from every route that is not public', async () => {
    const refused: string[] = [];
    for (const route of routeTable(h.app)) {
      if (access[keyOf(route)] === 'public') continue;
      const res = await send(request(h.app), route, fill(route.path, b), bodyFor(keyOf(route), b));
      if (res.status !== 401) refused.push(`${keyOf(route)} answered ${res.status}`);
    }
    expect(refused).toEqual([]);
  });

  it("each role of shop A gets 403 where its role may not, 404 for shop B's ids where it may, never a 2xx, a 500 or B's data", async () => {
    const breaches: string[] = [];
    for (const route of routeTable(h.app)) {
      const rule = access[keyOf(route)];
      if (rule === 'public' || rule === 'self' || rule === undefined) continue;
      const body = bodyFor(keyOf(route), b);
      // Shop B's id in the path must be a 404; in a body (a job for B's customer) a 404 or a 400 naming the field.
      const inPath = hasShopIds(route.path);
      const inBody = JSON.stringify(body ?? {}).includes(b.customer);
      for (const role of staff) {
        const res = await send(agents[role], route, fill(route.path, b), body);
        const text = JSON.stringify(res.body ?? '') + (res.text ?? '');
        const expected = !rule.includes(role) ? [403] : inPath ? [404] : inBody ? [400, 404] : null;
        if (expected && !expected.includes(res.status)) breaches.push(`${role} ${keyOf(route)} answered ${res.status}, expected ${expected.join(' or ')}`);
        if (res.status >= 500) breaches.push(`${role} ${keyOf(route)} answered ${res.status}`);
        const leaked = b.secrets.filter((s) => text.includes(s) || text.includes(b.customer));
        if (leaked.length > 0) breaches.push(`${role} ${keyOf(route)} showed shop B's ${leaked.join(', ')}`);
      }
    }
    expect(breaches).toEqual([]);
    expect(await snapshotOfB(bOwner)).toBe(before);
  }, 120_000);
});
