import { afterEach, describe, expect, it } from 'vitest';
import { parseLayout, type Layout } from '../../geometry';
import jersey from '../../geometry/fixtures/jersey-with-sleeves.json';
import type { OutlineNames } from './outlineNames';
import { saveDraft } from './queries';

const realFetch = globalThis.fetch;
afterEach(() => {
  globalThis.fetch = realFetch;
});

/** The invented jersey fixture: one opening, a traced outline of 240 points. */
function garmentLayout(): Layout {
  const parsed = parseLayout(jersey.layout);
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
  return parsed.layout;
}
const POINTS = jersey.layout.openings[0]!.shape.points.length;

/**
 * A server that answers as PUT /api/layouts/:id/draft does (server/routes/layouts.ts):
 * a name it does not hold is a 422 outline_unknown; a whole outline is saved and named.
 */
function serverHolding(held: Set<string>) {
  const bodies: { document: { openings: { shape: Record<string, unknown> }[] }; baseRevision: number }[] = [];
  globalThis.fetch = (async (_url: string, init: RequestInit) => {
    const body = JSON.parse(String(init.body));
    bodies.push(body);
    const shape = body.document.openings[0].shape;
    if (shape.pointsRef && !held.has(shape.pointsRef)) {
      return new Response(JSON.stringify({ error: { code: 'outline_unknown', message: 'The designer sends the whole outline again.' } }), { status: 422 });
    }
    held.add('held-name');
    return new Response(JSON.stringify({ draftRevision: body.baseRevision + 1, repairs: [], outlineRefs: { jersey: 'held-name' } }), { status: 200 });
  }) as typeof fetch;
  return bodies;
}

describe('saving a draft with outlines by name', () => {
  it('sends the name once the server has named the outline, and every point again when the server no longer holds it', async () => {
    const layout = garmentLayout();
    const names: OutlineNames = new WeakMap();
    const held = new Set<string>();
    const bodies = serverHolding(held);

    await saveDraft('layout-1', layout, 1, names);
    expect(bodies[0]!.document.openings[0]!.shape.points).toHaveLength(POINTS);

    await saveDraft('layout-1', layout, 2, names);
    expect(bodies[1]!.document.openings[0]!.shape).toEqual({ kind: 'outline', pointsRef: 'held-name' });

    // Someone else's save dropped the list: the 422 is answered by sending every point once more.
    held.clear();
    const saved = await saveDraft('layout-1', layout, 3, names);
    expect(saved.draftRevision).toBe(4);
    expect(bodies[2]!.document.openings[0]!.shape).toEqual({ kind: 'outline', pointsRef: 'held-name' });
    expect(bodies[3]!.document.openings[0]!.shape.points).toHaveLength(POINTS);
    expect(bodies).toHaveLength(4);
  });

  it('passes any other refusal on to the designer', async () => {
    globalThis.fetch = (async () => new Response(JSON.stringify({ error: { code: 'draft_changed', message: 'Someone saved first.' } }), { status: 409 })) as typeof fetch;
    await expect(saveDraft('layout-1', garmentLayout(), 1)).rejects.toMatchObject({ status: 409, code: 'draft_changed' });
  });
});
