import type { BoardPoint, Polygon } from './polygon';

/**
 * A rotation about the origin followed by a translation, applied to local
 * shape coordinates to place them on the board. Positive degrees turn
 * clockwise on screen because y points down (the same sense as SVG rotate).
 */
export interface Transform2d {
  readonly cos: number;
  readonly sin: number;
  readonly dx: number;
  readonly dy: number;
}

/** Where an opening sits: its centre on the board and its turn in degrees. */
export interface Placement {
  readonly center: BoardPoint;
  readonly rotation: number;
}

/** Quarter turns use exact sines so a turned layout measures exactly as before. */
function exactTurn(degrees: number): { cos: number; sin: number } {
  const quarter = degrees / 90;
  if (Number.isInteger(quarter)) {
    const table = [
      { cos: 1, sin: 0 },
      { cos: 0, sin: 1 },
      { cos: -1, sin: 0 },
      { cos: 0, sin: -1 },
    ];
    return table[((quarter % 4) + 4) % 4]!;
  }
  const radians = (degrees * Math.PI) / 180;
  return { cos: Math.cos(radians), sin: Math.sin(radians) };
}

export function transformFromPlacement(placement: Placement): Transform2d {
  const { cos, sin } = exactTurn(placement.rotation);
  return { cos, sin, dx: placement.center.x, dy: placement.center.y };
}

export function transformPoint(transform: Transform2d, p: BoardPoint): BoardPoint {
  return {
    x: transform.cos * p.x - transform.sin * p.y + transform.dx,
    y: transform.sin * p.x + transform.cos * p.y + transform.dy,
  };
}

export function transformPolygon(transform: Transform2d, polygon: Polygon): Polygon {
  return polygon.map((p) => transformPoint(transform, p));
}

/** Rotates about a board point, in degrees (clockwise on screen). */
export function pointRotate(p: BoardPoint, about: BoardPoint, degrees: number): BoardPoint {
  const { cos, sin } = exactTurn(degrees);
  const x = p.x - about.x;
  const y = p.y - about.y;
  return { x: cos * x - sin * y + about.x, y: sin * x + cos * y + about.y };
}
