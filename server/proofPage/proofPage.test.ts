import { selectAll, selectOne } from 'css-select';
import type { Element } from 'domhandler';
import { getAttributeValue, textContent } from 'domutils';
import { eq } from 'drizzle-orm';
import { parseDocument } from 'htmlparser2';
import { pino } from 'pino';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { connectDatabase } from '../../db/client';
import { proofs } from '../../db/schema';
import { PROOF_CLOSED_ADVICE, PROOF_CLOSED_MESSAGE } from '../../features/proofs/schema';
import { createApp } from '../app';
import { noisyImage } from '../test/fixtures/images';
import { createMailHarness, signUpShop, TEST_PUBLIC_URL, testThrottle, type MailHarness } from '../test/harness';
import { escapeHtml } from './html';

let h: MailHarness;
beforeAll(async () => {
  h = await createMailHarness();
});
afterAll(() => h.close());

const mat = (id: string, name: string, color: string) => ({ id, name, color, coreColor: '#F6F3EA', ply: 4, thickness: 0.055, bevelAngle: 45, sheet: { width: 32, height: 40 } });
const layoutDocument = (pieceId?: string) => ({
  schemaVersion: 2,
  outer: { width: 20, height: 24 },
  mats: [mat('top', 'Harbour navy', '#1D2B4A'), mat('lower', 'Old gold', '#B8902F')],
  mountingBoard: { color: '#FFFFFF', cut: false },
  openings: [{ id: 'jersey', ...(pieceId ? { pieceId } : {}), shape: { kind: 'rectangle', width: 8, height: 10 }, center: { x: 10, y: 12 }, depth: 2, reveals: [0.25] }],
});
// BX-150 from the default moulding list, so the job can be shipped.
const frame = { mouldingCode: 'BX-150', glazingKind: 'acrylic', shadowboxDepthIn: 2 };

/** A shop, a customer with an address, a job with a photographed piece, and a sent proof; the link's secret. */
async function sentProof() {
  const shop = await signUpShop(h, 'Saltmarsh <Frame> Works');
  const customer = (await shop.agent.post('/api/customers').send({ name: 'Orla Penhallow', email: `orla-${Date.now()}@customers.example` })).body.customer;
  const job = (await shop.agent.post('/api/jobs').send({ title: 'Kestrel Bay "Dunecrests" #7 jersey', customerId: customer.id, frame })).body.job;
  const piece = (await shop.agent.post(`/api/jobs/${job.id}/pieces`).send({ kind: 'photo', label: 'Signed team photo', widthIn: 8.5, heightIn: 10.5 })).body.piece;
  const upload = await shop.agent.post(`/api/jobs/${job.id}/pieces/${piece.id}/photos`).attach('photo', await noisyImage(85, 105, 'png'), { filename: 'team.png', contentType: 'image/png' });
  expect(upload.status).toBe(201);
  const layout = (await shop.agent.post(`/api/jobs/${job.id}/layouts`).send({ name: 'Shadowbox', document: layoutDocument(piece.id) })).body.layout;
  const sent = await shop.agent.post(`/api/jobs/${job.id}/proofs`).send({ layoutId: layout.id, baseRevision: 1, message: 'Here is the design <b>take a look</b>' });
  expect(sent.status).toBe(201);
  return { ...shop, customerEmail: customer.email as string, jobId: job.id as string, layoutId: layout.id as string, pieceId: piece.id as string, proofId: sent.body.proof.id as string, token: String(sent.body.link).split('/proof/')[1]! };
}

/** Parses the answer as a browser would (htmlparser2) and gives a few ways to read it. */
function parsed(body: string) {
  const dom = parseDocument(body);
  const one = (selector: string) => selectOne(selector, dom) as Element | null;
  const all = (selector: string) => selectAll(selector, dom) as unknown as Element[];
  const text = (selector: string) => {
    const found = one(selector);
    return found ? textContent(found).replace(/\s+/g, ' ').trim() : null;
  };
  return { dom, one, all, text, attr: (el: Element | null, name: string) => (el ? getAttributeValue(el, name) : undefined) };
}

const jobStatus = async (shop: { agent: request.Agent; jobId: string }) => (await shop.agent.get(`/api/jobs/${shop.jobId}`)).body.job.status;
const activityOf = async (shop: { agent: request.Agent; jobId: string }) => (await shop.agent.get(`/api/jobs/${shop.jobId}/activity`)).body.activity as { kind: string; memberName: string | null; detail?: Record<string, unknown> }[];

describe("the customer's proof page, rendered on the server", () => {
  it('opens without signing in, with the allow-listed data only, the headers of a secret link and a strict script policy', async () => {
    const shop = await sentProof();
    const res = await request(h.app).get(`/proof/${shop.token}`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/html/);
    expect(res.headers['referrer-policy']).toBe('no-referrer');
    expect(res.headers['x-robots-tag']).toContain('noindex');
    expect(res.headers['cache-control']).toBe('no-store');
    const csp = String(res.headers['content-security-policy']);
    expect(csp).toContain("script-src 'self'");
    expect(csp).not.toContain('unsafe-inline');
    const page = parsed(res.text);
    expect(page.attr(page.one('html'), 'lang')).toBe('en');
    expect(page.attr(page.one('meta[name=robots]'), 'content')).toContain('noindex');
    // Pinching stays the browser's: the viewport does not turn user scaling off (WCAG 2.1, 1.4.4 Resize text).
    expect(page.attr(page.one('meta[name=viewport]'), 'content')).toBe('width=device-width, initial-scale=1');
    expect(page.text('h1')).toBe('Kestrel Bay "Dunecrests" #7 jersey');
    // Text typed by the shop is shown as text, never as markup.
    expect(page.text('[data-testid=proof-message]')).toBe('Here is the design <b>take a look</b>');
    expect(page.all('b')).toHaveLength(0);
    expect(res.text).toContain(escapeHtml('Saltmarsh <Frame> Works'));
    expect(page.text('[data-testid=proof-outer]')).toBe('Finished size of the mats: 20" wide by 24" high.');
    // BX-150's face is 1.5 in: 20 + 2 x 1.5 = 23 by 24 + 2 x 1.5 = 27 outside the frame (face width on each side, common practice).
    expect(page.text('[data-testid=proof-frame]')).toBe('Frame: Deep box, satin black, 1 1/2" wide at the front, 2" deep inside for your piece, glazed with acrylic. Outside size with the frame: about 23" wide by 27" high.');
    expect(page.all('[data-testid=proof-piece]').map((el) => textContent(el))).toEqual(['Signed team photo: 8 1/2" by 10 1/2"']);
    expect(page.text('.mats')).toContain('1. Harbour navy (dark blue), with a white core showing at the bevel');
    // Every script is an external file of this origin: nothing inline to allow.
    const scripts = page.all('script');
    expect(scripts.map((s) => [Boolean(page.attr(s, 'src')), textContent(s)])).toEqual([[true, '']]);
    // No internal ids and no address but the shop's.
    for (const secret of [shop.jobId, shop.layoutId, shop.shopId, shop.pieceId, shop.proofId, shop.customerEmail]) expect(res.text).not.toContain(secret);
    expect(res.text).toContain(shop.email);
    expect((await shop.agent.get(`/api/jobs/${shop.jobId}/proofs`)).body.proofs[0].state).toBe('opened');
  });

  it('draws the picture as an inline SVG: one group per mat, the piece photo under the mat it shows through, at the piece size', async () => {
    const shop = await sentProof();
    const page = parsed((await request(h.app).get(`/proof/${shop.token}`)).text);
    const svg = page.one('svg[data-testid=proof-picture]');
    expect(page.attr(svg, 'role')).toBe('img');
    expect(page.attr(svg, 'aria-label')).toMatch(/^Picture of the proposed mats, 20" wide by 24" high/);
    // htmlparser2 lowercases attribute names, as HTML parsing does outside foreign content.
    expect(page.attr(svg, 'viewbox')).toBe('0 0 20 24');
    // Width and height fix the picture's shape before anything has loaded: 20 x 24 at 720 px on the long side.
    expect([page.attr(svg, 'width'), page.attr(svg, 'height')]).toEqual(['600', '720']);
    const groups = page.all('svg[data-testid=proof-picture] > g');
    // Lowest mat first (mat 2 is drawn before mat 1 covers it).
    expect(groups.map((g) => page.attr(g, 'data-testid'))).toEqual(['mat-layer-2', 'mat-layer-1']);
    for (const g of groups) expect(selectAll('path', g).map((p) => getAttributeValue(p as Element, 'fill-rule'))).toEqual(['evenodd', 'evenodd']);
    const image = page.one('image[data-piece-photo=jersey]');
    // The opening cuts 2 mats, so its piece lies on the board under mat 2, centred on the opening at 8.5 x 10.5 in.
    expect(image?.parent && page.attr(image.parent as Element, 'data-testid')).toBe('mat-layer-2');
    expect([page.attr(image, 'x'), page.attr(image, 'y'), page.attr(image, 'width'), page.attr(image, 'height')]).toEqual(['5.75', '6.75', '8.5', '10.5']);
    expect(page.attr(image, 'href')).toBe(`/api/proofs/${shop.token}/pieces/0/photo`);
    const photo = await request(h.app).get(page.attr(image, 'href')!);
    expect(photo.status).toBe(200);
  });

  it('serves its stylesheet, zoom script and font from this origin under hashed names, cached a year', async () => {
    const shop = await sentProof();
    const page = parsed((await request(h.app).get(`/proof/${shop.token}`)).text);
    const files = [page.attr(page.one('link[rel=stylesheet]'), 'href'), page.attr(page.one('script'), 'src'), page.attr(page.one('link[rel=preload]'), 'href')];
    for (const file of files) {
      expect(file).toMatch(/^\/proof-assets\/[\w-]+\.[0-9a-f]{16}\.(css|js|woff2)$/);
      const res = await request(h.app).get(file!);
      expect(res.status).toBe(200);
      expect(res.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    }
    expect((await request(h.app).get('/proof-assets/proofZoom.0000000000000000.js')).status).toBe(404);
    // Text goes compressed to a browser that asks (RFC 9110, Accept-Encoding), as is the page itself.
    const css = await request(h.app).get(files[0]!).set('Accept-Encoding', 'br, gzip');
    expect(css.headers['content-encoding']).toBe('br');
    expect(css.text).toContain('@font-face');
    // Regular and bold, each as its Latin part (the one preloaded) and the rest, which the
    // browser fetches only for a page showing such a character (CSS Fonts 4, unicode-range).
    const fontUrls = [...css.text.matchAll(/url\('([^']+\.woff2)'\)/g)].map((m) => m[1]!);
    expect(fontUrls).toHaveLength(4);
    expect(css.text.match(/unicode-range: U\+/g)).toHaveLength(4);
    expect(fontUrls).toContain(files[2]);
    for (const url of fontUrls) {
      const font = await request(h.app).get(url);
      expect(font.status).toBe(200);
      expect(font.headers['content-type']).toBe('font/woff2');
    }
    const gzipped = await request(h.app).get(`/proof/${shop.token}`).set('Accept-Encoding', 'gzip');
    expect(gzipped.headers['content-encoding']).toBe('gzip');
    expect(parsed(gzipped.text).text('h1')).toBe('Kestrel Bay "Dunecrests" #7 jersey');
  });

  it('made-up, revoked, replaced and expired links give one identical page with the same status', async () => {
    const shop = await sentProof();
    const revoke = await shop.agent.post(`/api/jobs/${shop.jobId}/proofs/${shop.proofId}/revoke`);
    expect(revoke.status).toBe(200);
    const send = async () => String((await shop.agent.post(`/api/jobs/${shop.jobId}/proofs`).send({ layoutId: shop.layoutId, versionNumber: 1 })).body.link).split('/proof/')[1]!;
    const replaced = await send();
    const expired = await send();
    const expiredId = (await shop.agent.get(`/api/jobs/${shop.jobId}/proofs`)).body.proofs[0].id;
    await h.database.db.update(proofs).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(proofs.id, expiredId));
    const answers: { status: number; body: string }[] = [];
    for (const token of ['A'.repeat(43), shop.token, replaced, expired, 'short']) {
      const view = await request(h.app).get(`/proof/${token}`);
      answers.push({ status: view.status, body: view.text });
      const post = await request(h.app).post(`/proof/${token}`).type('form').send({ decision: 'approve', name: 'Orla Penhallow' });
      answers.push({ status: post.status, body: post.text });
    }
    expect(answers[0]!.status).toBe(404);
    for (const answer of answers) expect(answer).toEqual(answers[0]);
    const page = parsed(answers[0]!.body);
    expect(page.text('h1')).toBe(PROOF_CLOSED_MESSAGE);
    expect(page.text('[data-testid=proof-closed]')).toBe(PROOF_CLOSED_ADVICE);
    expect(page.all('svg, form')).toHaveLength(0);
  });
});

describe("the customer's answer through the page's forms", () => {
  it('approving with a typed name redirects back (303), moves the job to approved and logs it; a second answer is refused (409) in plain words', async () => {
    const shop = await sentProof();
    const res = await request(h.app).post(`/proof/${shop.token}`).type('form').send({ decision: 'approve', name: 'Orla Penhallow' });
    expect(res.status).toBe(303);
    expect(res.headers.location).toBe(`/proof/${shop.token}#answer`);
    expect(await jobStatus(shop)).toBe('approved');
    const decided = (await activityOf(shop)).find((a) => a.kind === 'proof_decided');
    expect(decided?.memberName).toBeNull();
    const page = parsed((await request(h.app).get(`/proof/${shop.token}`)).text);
    expect(page.text('[data-testid=proof-answered]')).toMatch(/^You approved this design ?Approved by Orla Penhallow on /);
    expect(page.all('form')).toHaveLength(0);
    const again = await request(h.app).post(`/proof/${shop.token}`).type('form').send({ decision: 'changes', comment: 'Wait' });
    expect(again.status).toBe(409);
    const refused = parsed(again.text);
    expect(refused.text('[data-testid=proof-notice]')).toBe('This proof has already been answered; ask the shop if something has changed');
    expect(refused.all('form')).toHaveLength(0);
    expect(await jobStatus(shop)).toBe('approved');
  });

  it('asking for changes with a comment and a sketch photo sends the job back to designing with the comment', async () => {
    const shop = await sentProof();
    const res = await request(h.app)
      .post(`/proof/${shop.token}`)
      .field('decision', 'changes')
      .field('comment', 'Could the gold mat be a little wider?')
      .attach('photo', await noisyImage(300, 200, 'jpeg'), { filename: 'sketch.jpg', contentType: 'image/jpeg' });
    expect(res.status).toBe(303);
    expect(await jobStatus(shop)).toBe('designing');
    const listed = (await shop.agent.get(`/api/jobs/${shop.jobId}/proofs`)).body.proofs[0];
    expect(listed).toMatchObject({ state: 'changes_asked', changesComment: 'Could the gold mat be a little wider?' });
    expect((await shop.agent.get(listed.changesPhotoUrl)).status).toBe(200);
    const page = parsed((await request(h.app).get(`/proof/${shop.token}`)).text);
    expect(page.text('[data-testid=proof-answered]')).toContain('you wrote: “Could the gold mat be a little wider?”. Your photo went with it.');
  });

  it('an empty form field comes back on the page with its message beside the field and the typed values kept (400)', async () => {
    const shop = await sentProof();
    const noName = await request(h.app).post(`/proof/${shop.token}`).type('form').send({ decision: 'approve', name: '   ' });
    expect(noName.status).toBe(400);
    const page = parsed(noName.text);
    const field = page.one('#proof-name');
    expect(page.attr(field, 'aria-invalid')).toBe('true');
    expect(page.text(`#${page.attr(field, 'aria-describedby')}`)).toBe('Type your name to approve');
    const noComment = await request(h.app).post(`/proof/${shop.token}`).field('decision', 'changes').field('comment', '');
    expect(noComment.status).toBe(400);
    expect(parsed(noComment.text).text('#changes-comment-error')).toBe('Say what should change');
    // A bell character is refused by the shared text rules; what was typed comes back, escaped.
    const typed = 'Wider <gold> mat\u0007';
    const control = await request(h.app).post(`/proof/${shop.token}`).field('decision', 'changes').field('comment', typed);
    expect(control.status).toBe(400);
    const kept = parsed(control.text);
    // htmlparser2 leaves a textarea's escaped text as written (a browser decodes it): the markup stays text.
    expect(kept.text('#proof-comment')).toBe(escapeHtml(typed));
    expect(kept.text('#changes-comment-error')).toBeTruthy();
    expect(await jobStatus(shop)).toBe('awaiting_approval');
  });

  it('the sketch photo follows the piece-photo rules: a file that is not a photo is 415 beside the field, a photo with an approval 400', async () => {
    const shop = await sentProof();
    const text = await request(h.app)
      .post(`/proof/${shop.token}`)
      .field('decision', 'changes')
      .field('comment', 'See attached')
      .attach('photo', Buffer.from('not an image at all, just words'), { filename: 'note.jpg', contentType: 'image/jpeg' });
    expect(text.status).toBe(415);
    const page = parsed(text.text);
    expect(page.text('#changes-photo-error')).toMatch(/^This file is not a photo Matwright can read/);
    expect(page.text('#proof-comment')).toBe('See attached');
    const approve = await request(h.app)
      .post(`/proof/${shop.token}`)
      .field('decision', 'approve')
      .field('name', 'Orla Penhallow')
      .attach('photo', await noisyImage(40, 40, 'png'), { filename: 'a.png', contentType: 'image/png' });
    expect(approve.status).toBe(400);
    expect(parsed(approve.text).text('[data-testid=approve-form] [role=alert]')).toBe('A photo goes only with a request for changes');
    expect(await jobStatus(shop)).toBe('awaiting_approval');
  });
});

describe('after delivery, the same link asks how it arrived', () => {
  it('takes a note and a photo through plain forms and shows them back, with the hanging caution', async () => {
    const shop = await sentProof();
    expect((await request(h.app).post(`/proof/${shop.token}/arrival`).type('form').send({ comment: 'Too soon' })).status).toBe(409);
    expect((await request(h.app).post(`/proof/${shop.token}`).type('form').send({ decision: 'approve', name: 'Orla Penhallow' })).status).toBe(303);
    for (const status of ['cutting', 'assembling', 'ready']) expect((await shop.agent.post(`/api/jobs/${shop.jobId}/status`).send({ status })).status).toBe(200);
    expect((await shop.agent.post(`/api/jobs/${shop.jobId}/shipment`).send({ carrier: 'Parcel carrier', trackingNumber: 'PAGE1', emailCustomer: false })).status).toBe(201);

    const before = parsed((await request(h.app).get(`/proof/${shop.token}`)).text);
    expect(before.text('h1')).toBe('How did it arrive?');
    expect(before.text('.notice.info')).toMatch(/^Hanging it ?Hang a heavy frame from two hangers into studs/);
    const note = await request(h.app).post(`/proof/${shop.token}/arrival`).type('form').send({ comment: 'Arrived safe, it is on the wall' });
    expect(note.status).toBe(303);
    expect(note.headers.location).toBe(`/proof/${shop.token}?done=note#arrival-note`);
    const bad = await request(h.app).post(`/proof/${shop.token}/arrival`).type('form').send({ comment: 'bell\u0007' });
    expect(bad.status).toBe(400);
    expect(parsed(bad.text).text('#note-comment-error')).toBeTruthy();
    const photo = await request(h.app).post(`/proof/${shop.token}/arrival/photos`).attach('photo', await noisyImage(60, 40, 'jpeg'), { filename: 'wall.jpg', contentType: 'image/jpeg' });
    expect(photo.status).toBe(303);
    const after = parsed((await request(h.app).get(`/proof/${shop.token}?done=note`)).text);
    expect(after.text('#arrival-comment')).toBe('Arrived safe, it is on the wall');
    expect(after.text('[data-testid=arrival-thanks]')).toBe('Thank you, Saltmarsh <Frame> Works has your note.');
    const own = after.all('[data-testid=arrival-own-photo]');
    expect(own.map((img) => [getAttributeValue(img, 'width'), getAttributeValue(img, 'height')])).toEqual([['110', '110']]);
    expect((await request(h.app).get(getAttributeValue(own[0]!, 'src')!)).status).toBe(200);
    const report = (await shop.agent.get(`/api/jobs/${shop.jobId}/arrival`)).body;
    expect(report.comment).toBe('Arrived safe, it is on the wall');
    expect(report.photos).toHaveLength(1);
  });
});

describe('attempt limits on the page', () => {
  it('counts the page and its forms against the link and answers a 429 page with Retry-After past the limit', async () => {
    const database = connectDatabase(inject('databaseUrl'));
    const app = createApp({
      db: database.db,
      logger: pino({ level: 'silent' }),
      publicUrl: TEST_PUBLIC_URL,
      throttle: { ...testThrottle, keyPrefix: `proof-page-${Date.now()}-` },
      proofThrottle: { perAccount: { points: 3, durationS: 60 }, perAddress: { points: 1000, durationS: 60 } },
    });
    try {
      const shop = await sentProof();
      const codes = [];
      for (let i = 0; i < 2; i += 1) codes.push((await request(app).get(`/proof/${shop.token}`)).status);
      codes.push((await request(app).get(`/api/proofs/${shop.token}`)).status);
      const refused = await request(app).post(`/proof/${shop.token}`).type('form').send({ decision: 'approve', name: 'Orla Penhallow' });
      codes.push(refused.status);
      expect(codes).toEqual([200, 200, 200, 429]);
      expect(Number(refused.headers['retry-after'])).toBeGreaterThan(0);
      expect(refused.headers['content-type']).toMatch(/^text\/html/);
      expect(parsed(refused.text).text('h1')).toBe('Too many attempts');
      expect(await jobStatus(shop)).toBe('awaiting_approval');
    } finally {
      await database.close();
    }
  });
});
