import type { BoardPoint } from '../../geometry';

/** Client coordinates of a pointer to the user units of the SVG it is over (photo pixels or inches). */
export function svgPoint(svg: SVGSVGElement, clientX: number, clientY: number): BoardPoint {
  const matrix = svg.getScreenCTM();
  if (!matrix) return { x: clientX, y: clientY };
  const p = new DOMPoint(clientX, clientY).matrixTransform(matrix.inverse());
  return { x: p.x, y: p.y };
}

/** How many user units one screen pixel covers, so marks stay a finger's size at any zoom. */
export function unitsPerPixel(svg: SVGSVGElement): number {
  const matrix = svg.getScreenCTM();
  return matrix && matrix.a > 0 ? 1 / matrix.a : 1;
}
