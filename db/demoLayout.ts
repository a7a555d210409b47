// The schema module alone, so browser tests can build the demo document without the geometry engine.
import { LAYOUT_SCHEMA_VERSION, type LayoutInput } from '../geometry/layoutSchema';

/**
 * A folded jersey's silhouette as a tracer would give it, 16 x 19 in, points
 * relative to its centre (inches, y down). The shape is invented for the demo.
 */
export const demoJerseyOutline: { x: number; y: number }[] = [
  { x: -2.6, y: -9.5 }, { x: -1.6, y: -8.9 }, { x: -0.8, y: -8.6 }, { x: 0, y: -8.5 }, { x: 0.8, y: -8.6 },
  { x: 1.6, y: -8.9 }, { x: 2.6, y: -9.5 }, { x: 5.1, y: -9.0 }, { x: 6.8, y: -7.6 }, { x: 8.0, y: -5.4 },
  { x: 6.1, y: -3.6 }, { x: 4.6, y: -4.9 }, { x: 4.7, y: 0 }, { x: 4.9, y: 6.0 }, { x: 4.9, y: 9.5 },
  { x: 0, y: 9.4 }, { x: -4.9, y: 9.5 }, { x: -4.9, y: 6.0 }, { x: -4.7, y: 0 }, { x: -4.6, y: -4.9 },
  { x: -6.1, y: -3.6 }, { x: -8.0, y: -5.4 }, { x: -6.8, y: -7.6 }, { x: -5.1, y: -9.0 },
];

/** Three mats on a 32 x 40 sheet: a jersey window, two round patches, a photo and a plaque. */
export function demoJerseyLayout(pieceIds: { jersey: string; patchA: string; patchB: string; photo: string; plaque: string }): LayoutInput {
  const sheet = { width: 32, height: 40 };
  return {
    schemaVersion: LAYOUT_SCHEMA_VERSION,
    outer: { width: 32, height: 40 },
    mats: [
      { id: 'top', name: 'Harbour navy', color: '#1D2B4A', coreColor: '#F6F3EA', ply: 4, thickness: 0.055, bevelAngle: 45, sheet },
      { id: 'middle', name: 'Signal red', color: '#A3232B', coreColor: '#F6F3EA', ply: 4, thickness: 0.055, bevelAngle: 45, sheet },
      { id: 'bottom', name: 'Warm white', color: '#F3EEE2', coreColor: '#FBF8F1', ply: 4, thickness: 0.055, bevelAngle: 45, sheet },
    ],
    mountingBoard: { color: '#FFFFFF', cut: false },
    frameRabbet: { width: 32.25, height: 40.25 },
    openings: [
      // A garment sits behind the window with a little room around it.
      { id: 'jersey', pieceId: pieceIds.jersey, shape: { kind: 'outline', points: demoJerseyOutline }, center: { x: 16, y: 12 }, rotation: 0, depth: 3, clearance: 0.25, reveals: [0.25, 0.25] },
      // Round patches about 4 in across (common practice), overlapped 1/8 in to hold them.
      { id: 'patch-left', pieceId: pieceIds.patchA, shape: { kind: 'circle', radius: 1.875 }, center: { x: 6.5, y: 27.5 }, rotation: 0, depth: 1, clearance: -0.125, reveals: [], pieceSize: { width: 4, height: 4 } },
      { id: 'patch-right', pieceId: pieceIds.patchB, shape: { kind: 'circle', radius: 1.875 }, center: { x: 25.5, y: 27.5 }, rotation: 0, depth: 1, clearance: -0.125, reveals: [], pieceSize: { width: 4, height: 4 } },
      // A 10 x 8 print with the usual 1/4 in overlap (common practice): a 9 1/2 x 7 1/2 sight.
      { id: 'photo', pieceId: pieceIds.photo, shape: { kind: 'rectangle', width: 9.5, height: 7.5 }, center: { x: 16, y: 27.5 }, rotation: 0, depth: 2, clearance: -0.25, reveals: [0.25], pieceSize: { width: 10, height: 8 } },
      { id: 'plaque', pieceId: pieceIds.plaque, shape: { kind: 'rectangle', width: 8.75, height: 2.75 }, center: { x: 16, y: 35 }, rotation: 0, depth: 2, clearance: -0.125, reveals: [0.1875], pieceSize: { width: 9, height: 3 } },
    ],
  };
}
