import { useRef, useState } from 'react';
import { svgPoint, unitsPerPixel } from './photoGeometry';
import type { CornerMarksProps } from './cornerMarksProps';

const LABELS = ['1', '2', '3', '4'];

/** The photo with draggable marks, by mouse or finger (pointer events), at the photo's own pixel scale. */
export function CornerMarks({ photoHref, widthPx, heightPx, marks, onMarksChange, background, pickingBackground, onBackground, box, onBoxChange }: CornerMarksProps) {
  const svg = useRef<SVGSVGElement>(null);
  const [dragging, setDragging] = useState<number | null>(null);
  const scale = svg.current ? unitsPerPixel(svg.current) : widthPx / 360;
  const r = 14 * scale;

  const at = (e: React.PointerEvent) => svgPoint(svg.current!, e.clientX, e.clientY);
  const onDown = (e: React.PointerEvent<SVGSVGElement>) => {
    const p = at(e);
    if (pickingBackground) return onBackground(p);
    let nearest = -1;
    let best = 3 * r;
    [...marks, ...(box ?? [])].forEach((m, i) => {
      const d = Math.hypot(m.x - p.x, m.y - p.y);
      if (d < best) [nearest, best] = [i, d];
    });
    if (nearest < 0) return;
    e.currentTarget.setPointerCapture(e.pointerId);
    setDragging(nearest);
  };
  const onMove = (e: React.PointerEvent<SVGSVGElement>) => {
    if (dragging === null) return;
    const p = at(e);
    const clamped = { x: Math.max(0, Math.min(widthPx, p.x)), y: Math.max(0, Math.min(heightPx, p.y)) };
    if (dragging >= marks.length && box) return onBoxChange(box.map((m, i) => (i === dragging - marks.length ? clamped : m)));
    onMarksChange(marks.map((m, i) => (i === dragging ? clamped : m)));
  };
  const onUp = () => setDragging(null);

  return (
    <svg ref={svg} viewBox={`0 0 ${widthPx} ${heightPx}`} style={{ width: '100%', height: 'auto', touchAction: 'none', display: 'block', background: '#222' }}
      onPointerDown={onDown} onPointerMove={onMove} onPointerUp={onUp} onPointerCancel={onUp} data-testid="corner-marks" role="img" aria-label="Photo with calibration marks">
      <image href={photoHref} x={0} y={0} width={widthPx} height={heightPx} preserveAspectRatio="none" />
      {marks.length === 4 ? <polygon points={marks.map((m) => `${m.x},${m.y}`).join(' ')} fill="rgba(255,200,0,0.12)" stroke="#ffc400" strokeWidth={2 * scale} /> : null}
      {marks.length === 2 ? <line x1={marks[0]!.x} y1={marks[0]!.y} x2={marks[1]!.x} y2={marks[1]!.y} stroke="#ffc400" strokeWidth={2 * scale} /> : null}
      {marks.map((m, i) => (
        <g key={i} data-testid={`mark-${i}`} data-x={m.x.toFixed(1)} data-y={m.y.toFixed(1)}>
          <circle cx={m.x} cy={m.y} r={r} fill="rgba(255,196,0,0.35)" stroke="#ffc400" strokeWidth={2 * scale} />
          <circle cx={m.x} cy={m.y} r={2 * scale} fill="#ffc400" />
          <text x={m.x + r * 1.1} y={m.y - r * 1.1} fill="#ffc400" fontSize={14 * scale} fontWeight="bold">{LABELS[i]}</text>
        </g>
      ))}
      {box ? (
        <g data-testid="garment-box">
          <rect x={Math.min(box[0]!.x, box[1]!.x)} y={Math.min(box[0]!.y, box[1]!.y)} width={Math.abs(box[1]!.x - box[0]!.x)} height={Math.abs(box[1]!.y - box[0]!.y)}
            fill="none" stroke="#00d0ff" strokeWidth={2 * scale} strokeDasharray={`${8 * scale} ${6 * scale}`} />
          {box.map((m, i) => <rect key={i} x={m.x - r * 0.6} y={m.y - r * 0.6} width={r * 1.2} height={r * 1.2} fill="rgba(0,208,255,0.35)" stroke="#00d0ff" strokeWidth={2 * scale} />)}
        </g>
      ) : null}
      {background ? <circle cx={background.x} cy={background.y} r={r * 0.8} fill="none" stroke="#00d0ff" strokeWidth={3 * scale} data-testid="background-mark" /> : null}
    </svg>
  );
}
