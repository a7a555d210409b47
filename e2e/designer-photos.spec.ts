import { expect, test } from './cspGuard';
import sharp from 'sharp';

test("a piece's uploaded photo shows through its window in the designer, at the piece's size", async ({ page }) => {
  await page.goto('/sign-in');
  await page.getByTestId('email').fill('designer@tallowmere.example');
  await page.getByTestId('password').fill('demo-frames-2026');
  await page.getByTestId('sign-in').click();
  await expect(page.getByText('Tallowmere Frame Works')).toBeVisible();

  const customerId = (await (await page.request.post('/api/customers', { data: { name: 'Wilhelmina Quarrie' } })).json()).customer.id;
  const jobId = (await (await page.request.post('/api/jobs', { data: { title: 'Fenwick Marrowlarks team photo', customerId } })).json()).job.id;
  const piece = await page.request.post(`/api/jobs/${jobId}/pieces`, { data: { kind: 'photo', label: 'Team photo', widthIn: 10, heightIn: 8 } });
  expect(piece.status()).toBe(201);
  const pieceId = (await piece.json()).piece.id as string;
  // A 1000 x 800 print scan, made here so the test carries no binary file.
  const png = await sharp({ create: { width: 1000, height: 800, channels: 3, background: { r: 40, g: 90, b: 160 } } }).png().toBuffer();
  const upload = await page.request.post(`/api/jobs/${jobId}/pieces/${pieceId}/photos`, {
    multipart: { photo: { name: 'team-photo.png', mimeType: 'image/png', buffer: png } },
  });
  expect(upload.status()).toBe(201);
  const photoId = (await upload.json()).photo.id as string;

  const created = await page.request.post(`/api/jobs/${jobId}/layouts`, { data: { name: 'Team photo' } });
  const layout = (await created.json()).layout;
  // An 8 x 10 print under a 9 1/2 x 7 1/2 sight: 1/4 in overlap all round (common practice).
  const document = {
    ...layout.draft,
    outer: { width: 16, height: 14 },
    openings: [{ id: 'print', pieceId, pieceSize: { width: 10, height: 8 }, shape: { kind: 'rectangle', width: 9.5, height: 7.5 }, center: { x: 8, y: 7 }, rotation: 0, depth: 1, clearance: -0.25, reveals: [] }],
  };
  expect((await page.request.put(`/api/layouts/${layout.id}/draft`, { data: { document, baseRevision: 1 } })).status()).toBe(200);

  const preview = page.waitForResponse((r) => r.url().endsWith(`/api/photos/${photoId}/preview`));
  await page.goto(`/layouts/${layout.id}`);
  const image = page.locator('[data-piece-photo="print"]');
  await expect(image).toHaveAttribute('width', '10');
  await expect(image).toHaveAttribute('height', '8');
  await expect(image).toHaveAttribute('x', '3');
  // The print lies on the board under the one mat its window cuts, so that mat frames it.
  await expect(page.locator('[data-testid="mat-layer-1"] [data-piece-photo="print"]')).toHaveCount(1);
  const answer = await preview;
  expect(answer.status()).toBe(200);
  expect(answer.headers()['content-type']).toBe('image/jpeg');
});
