import { useRef, useState } from 'react';
import type { BoardPoint } from '../../geometry';
import { nearestEdge } from './outlineEdits';
import { svgPoint, unitsPerPixel } from './photoGeometry';
import type { OutlineCanvasProps } from './outlineCanvasProps';

type Drag = { kind: 'node'; index: number; moved: boolean } | { kind: 'all'; last: BoardPoint; moved: boolean };

/**
 * The outline over the squared photo at true scale (one SVG unit per inch).
 * Pointer events serve mouse and touch alike: press a node to select and
 * drag it, press an edge to add a node there, or in the move tool drag the
 * whole outline.
 */
export function OutlineCanvas({ imageHref, widthIn, heightIn, points, dispatch, selected, onSelect, tool }: OutlineCanvasProps) {
  const svg = useRef<SVGSVGElement>(null);
  const [drag, setDrag] = useState<Drag | null>(null);
  const scale = svg.current ? unitsPerPixel(svg.current) : widthIn / 360;
  const r = 12 * scale;

  const at = (e: React.PointerEvent) => svgPoint(svg.current!, e.clientX, e.clientY);
  const onDown = (e: React.PointerEvent<SVGSVGElement>) => {
    const p = at(e);
    e.currentTarget.setPointerCapture(e.pointerId);
    if (tool === 'move') return setDrag({ kind: 'all', last: p, moved: false });
    let nearest = -1;
    let best = r * 1.5;
    points.forEach((q, i) => {
      const d = Math.hypot(q.x - p.x, q.y - p.y);
      if (d < best) [nearest, best] = [i, d];
    });
    if (nearest >= 0) {
      onSelect(nearest);
      return setDrag({ kind: 'node', index: nearest, moved: false });
    }
    const edge = nearestEdge(points, p);
    if (edge.distance > r * 1.5) return onSelect(null);
    dispatch({ type: 'addNode', after: edge.after, at: edge.point });
    onSelect(edge.after + 1);
    setDrag({ kind: 'node', index: edge.after + 1, moved: true });
  };
  const onMove = (e: React.PointerEvent<SVGSVGElement>) => {
    if (!drag) return;
    const p = at(e);
    if (drag.kind === 'node') {
      dispatch({ type: 'moveNode', index: drag.index, to: p, continuing: drag.moved });
      if (!drag.moved) setDrag({ ...drag, moved: true });
    } else {
      dispatch({ type: 'moveAll', dx: p.x - drag.last.x, dy: p.y - drag.last.y, continuing: drag.moved });
      setDrag({ kind: 'all', last: p, moved: true });
    }
  };
  const onUp = () => setDrag(null);

  return (
    <svg ref={svg} viewBox={`0 0 ${widthIn} ${heightIn}`} style={{ width: '100%', height: 'auto', touchAction: 'none', display: 'block', background: '#222' }}
      onPointerDown={onDown} onPointerMove={onMove} onPointerUp={onUp} onPointerCancel={onUp} data-testid="outline-canvas" role="img" aria-label="Traced outline over the squared photo">
      <image href={imageHref} x={0} y={0} width={widthIn} height={heightIn} preserveAspectRatio="none" />
      <polygon points={points.map((p) => `${p.x},${p.y}`).join(' ')} fill="rgba(255,64,64,0.15)" stroke="#ff4040" strokeWidth={2 * scale} data-testid="outline-path" />
      {points.map((p, i) => (
        <circle key={i} cx={p.x} cy={p.y} r={i === selected ? r * 0.7 : r * 0.45} fill={i === selected ? '#ffffff' : '#ff4040'} stroke="#ff4040" strokeWidth={scale}
          data-testid={`outline-node-${i}`} />
      ))}
    </svg>
  );
}
