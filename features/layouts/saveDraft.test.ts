import { afterEach, describe, expect, it } from 'vitest';
import { parseLayout, type Layout } from '../../geometry';
import type { OutlineNames } from './outlineNames';
import { saveDraft } from './queries';

const realFetch = globalThis.fetch;
afterEach(() => {
  globalThis.fetch = realFetch;
});

function garmentLayout(): Layout {
  const points = Array.from({ length: 30 }, (_, i) => ({ x: 5 * Math.cos((2 * Math.PI * i) / 30), y: 7 * Math.sin((2 * Math.PI * i) / 30) }));
  const parsed = parseLayout({
    schemaVersion: 2,
    outer: { width: 24, height: 30 },
    mats: [{ id: 'top', name: 'Top', color: '#1f3a5c', coreColor: '#f4f1e8', ply: 4, thickness: 0.055, bevelAngle: 45, sheet: { width: 32, height: 40 } }],
    mountingBoard: { color: '#ffffff', cut: false },
    openings: [{ id: 'jersey', shape: { kind: 'outline', points }, center: { x: 12, y: 14 }, depth: 1 }],
  });
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
  return parsed.layout;
}

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
    expect(bodies[0]!.document.openings[0]!.shape.points).toHaveLength(30);

    await saveDraft('layout-1', layout, 2, names);
    expect(bodies[1]!.document.openings[0]!.shape).toEqual({ kind: 'outline', pointsRef: 'held-name' });

    // Someone else's save dropped the list: the 422 is answered by sending every point once more.
    held.clear();
    const saved = await saveDraft('layout-1', layout, 3, names);
    expect(saved.draftRevision).toBe(4);
    expect(bodies[2]!.document.openings[0]!.shape).toEqual({ kind: 'outline', pointsRef: 'held-name' });
    expect(bodies[3]!.document.openings[0]!.shape.points).toHaveLength(30);
    expect(bodies).toHaveLength(4);
  });

  it('passes any other refusal on to the designer', async () => {
    globalThis.fetch = (async () => new Response(JSON.stringify({ error: { code: 'draft_changed', message: 'Someone saved first.' } }), { status: 409 })) as typeof fetch;
    await expect(saveDraft('layout-1', garmentLayout(), 1)).rejects.toMatchObject({ status: 409, code: 'draft_changed' });
  });
});
