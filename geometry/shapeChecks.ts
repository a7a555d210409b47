import type { Finding } from './findings';
import type { FindingWords } from './findingWords';
import { capitalised } from './findingWords';
import type { Opening } from './layoutSchema';
import type { Shape } from './shapes';
import { pointsAreFinite, polygonArea, polygonTurns } from './polygon';
import { polygonThin } from './garment';
import { OUTLINE_SIMPLIFY_TOLERANCE_IN } from './garment';
import { polygonSelfIntersections } from './selfIntersection';
import { EPSILON_IN } from './units';

/**
 * Most full turns an outline or polygon may make, counted after thinning
 * within 0.002 in: a traced jersey makes about 5 to 40, a drawn polygon
 * one. Each extra turn is a spike or tooth a blade has to go round, and the
 * offsets' work grows with the turns times the points, so a spiky star of
 * 50 000 points is refused here in linear time instead of taking minutes.
 */
export const MAX_OUTLINE_TURNS = 250;

function shapeNumbers(shape: Shape): number[] {
  switch (shape.kind) {
    case 'rectangle': case 'oval': return [shape.width, shape.height];
    case 'roundedRectangle': return [shape.width, shape.height, shape.cornerRadius + 1];
    case 'circle': return [shape.radius];
    case 'regularPolygon': return [shape.radius, shape.sides - 2];
    default: return [];
  }
}

/** A shape nothing can be cut from: a clear finding instead of a crash or minutes of work later on. */
export function shapeFinding(opening: Opening, words: FindingWords): Finding | null {
  const { shape, center } = opening;
  const at = Number.isFinite(center.x) && Number.isFinite(center.y) ? center : { x: 0, y: 0 };
  const name = words.opening(opening.id);
  const base = { at, measured: null, required: null, openingIds: [opening.id] };
  const degenerate = (why: string): Finding => ({ ...base, code: 'shape-degenerate', severity: 'error', message: `${capitalised(name)} cannot be cut: ${why}.` });
  if (!Number.isFinite(center.x) || !Number.isFinite(center.y) || !Number.isFinite(opening.rotation)) return degenerate('its position is not a number');
  if (shape.kind !== 'polygon' && shape.kind !== 'outline') {
    const numbers = shapeNumbers(shape);
    if (!numbers.every(Number.isFinite)) return degenerate('a size is not a number');
    return numbers.every((n) => n > 0) ? null : degenerate('a size is zero or negative');
  }
  if (shape.points.length < 3) return degenerate(`its outline has ${shape.points.length} point(s); it needs at least 3`);
  if (!pointsAreFinite(shape.points)) return degenerate('a point of its outline is not a number');
  if (polygonArea(shape.points) < EPSILON_IN) return degenerate('its outline encloses no area');
  const turns = polygonTurns(polygonThin(shape.points, OUTLINE_SIMPLIFY_TOLERANCE_IN));
  if (turns > MAX_OUTLINE_TURNS) {
    return {
      ...base, code: 'shape-too-detailed', severity: 'error',
      message: `The outline of ${name} doubles back ${Math.round(turns)} times, more than a blade can follow (at most ${MAX_OUTLINE_TURNS}); retrace it or smooth its spikes.`,
    };
  }
  const crossing = polygonSelfIntersections(shape.points, 1)[0];
  if (!crossing) return null;
  return {
    ...base,
    code: 'shape-self-intersecting',
    severity: 'error',
    at: { x: center.x + crossing.x, y: center.y + crossing.y },
    message: `The outline of ${name} crosses itself; retrace or edit it near the marked spot.`,
  };
}
