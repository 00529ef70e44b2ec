/**
 * One view of a sketch drawn to a true scale for the PDF build sheet, as SVG in points (1/72 in):
 * the ground and the datum lines, the axes' directions as arrows from the datum, the wheels, the
 * members, every pivot marked by what it is (frame bracket, moving pivot, driveline reference) and
 * labelled with its id, and a scale bar. Both views draw +h to the left, as the board does: the side
 * view seen from the vehicle's left (front to the left), the cross view seen from behind (the
 * vehicle's left to the left).
 */
import type { Sketch } from '../../../shared/schema/sketch';
import type { LengthUnit, Mm } from '../../../shared/units';
import type { Vec3 } from '../../../shared/vec3';
import { labelWidth, placeLabels, type Box, type LabelRequest } from './labels';

export type DrawnView = 'side' | 'cross';

/** Points (1/72 in) per millimetre of paper. */
const PT_PER_MM = 72 / 25.4;
/** The scales a drawing may take (1:n), the largest that fits is chosen. */
const SCALES = [1, 2, 5, 10, 20, 25, 50, 100] as const;
/** Room around the drawn parts for labels, the axes and the scale bar (pt). */
const MARGIN = { left: 30, right: 30, top: 26, bottom: 40 };
const LABEL_SIZE = 6.5;

export interface ViewDrawing {
  svg: string;
  /** pt */
  width: number;
  height: number;
  /** the drawing is 1:scale on paper printed at 100 % */
  scale: number;
}

type PivotRole = 'frame' | 'moving' | 'reference';

interface Plane {
  h: Mm;
  v: Mm;
}

function planeOf(view: DrawnView, p: Vec3): Plane {
  return { h: view === 'side' ? p.x : p.y, v: p.z };
}

function esc(s: string): string {
  return s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
}

const n = (v: number) => v.toFixed(2);

/** The largest standard scale at which the span fits the room (1:n), the smallest paper drawing otherwise. */
export function chooseScale(spanH: Mm, spanV: Mm, roomW: number, roomH: number): number {
  for (const s of SCALES) {
    const k = PT_PER_MM / s;
    if (spanH * k <= roomW && spanV * k <= roomH) return s;
  }
  return SCALES[SCALES.length - 1];
}

/** A round length for the scale bar, in the sheet's unit, at most `maxPt` long on paper. */
function scaleBarLength(k: number, u: LengthUnit, maxPt: number): { mm: Mm; text: string } {
  const steps = u === 'in' ? [1, 2, 5, 10, 20, 50] : [10, 20, 50, 100, 200, 250, 500, 1000];
  const perUnit = u === 'in' ? 25.4 : 1;
  let best = steps[0];
  for (const s of steps) if (s * perUnit * k <= maxPt) best = s;
  return { mm: best * perUnit, text: `${best} ${u}` };
}

/**
 * The drawing of one view, at most `maxWidth` × `maxHeight` pt; its height shrinks to what the
 * parts need at the chosen scale. `roles` says what each pivot is (frame bracket, moving, reference).
 */
export function drawView(
  sketch: Sketch,
  view: DrawnView,
  roles: ReadonlyMap<string, PivotRole>,
  u: LengthUnit,
  maxWidth: number,
  maxHeight: number,
  crossView: 'front' | 'rear' = 'rear',
): ViewDrawing {
  const pts = new Map(sketch.points.map((p) => [p.id, p] as const));
  const r = sketch.vehicle.tireRadius;
  const wheels = [sketch.wheels.left, sketch.wheels.right]
    .map((id) => pts.get(id))
    .filter((p): p is NonNullable<typeof p> => !!p);

  // What the drawing must hold: every pivot, the tyres, and the datum.
  const extent: Plane[] = [{ h: 0, v: 0 }, ...sketch.points.map((p) => planeOf(view, p))];
  for (const w of wheels) {
    const c = planeOf(view, w);
    if (view === 'side') extent.push({ h: c.h - r, v: c.v - r }, { h: c.h + r, v: c.v + r });
    else extent.push({ h: c.h, v: 0 }, { h: c.h, v: c.v + r });
  }
  const hMin = Math.min(...extent.map((q) => q.h));
  const hMax = Math.max(...extent.map((q) => q.h));
  const vMin = Math.min(...extent.map((q) => q.v));
  const vMax = Math.max(...extent.map((q) => q.v));

  const roomW = maxWidth - MARGIN.left - MARGIN.right;
  const roomH = maxHeight - MARGIN.top - MARGIN.bottom;
  const scale = chooseScale(hMax - hMin, vMax - vMin, roomW, roomH);
  const k = PT_PER_MM / scale;
  const width = maxWidth;
  const height = Math.min(maxHeight, (vMax - vMin) * k + MARGIN.top + MARGIN.bottom);
  // +h to the left: the largest h sits at the left edge of the room, centred across the width.
  const originX = MARGIN.left + (roomW - (hMax - hMin) * k) / 2 + hMax * k;
  const originY = MARGIN.top + vMax * k;
  const X = (q: Plane) => originX - q.h * k;
  const Y = (q: Plane) => originY - q.v * k;
  const at = (p: Vec3) => ({ x: X(planeOf(view, p)), y: Y(planeOf(view, p)) });

  const out: string[] = [];
  const line = (x1: number, y1: number, x2: number, y2: number, w: number, dash?: string) =>
    out.push(
      `<line x1="${n(x1)}" y1="${n(y1)}" x2="${n(x2)}" y2="${n(y2)}" stroke="#000" stroke-width="${w}"` +
        `${dash ? ` stroke-dasharray="${dash}"` : ''}/>`,
    );
  const text = (x: number, y: number, s: string, size: number, anchor: 'start' | 'middle' | 'end' = 'start') =>
    out.push(
      `<text x="${n(x)}" y="${n(y)}" font-family="Roboto" font-size="${size}" fill="#000"` +
        ` text-anchor="${anchor}">${esc(s)}</text>`,
    );
  const arrow = (x1: number, y1: number, x2: number, y2: number) => {
    line(x1, y1, x2, y2, 0.9);
    const a = Math.atan2(y2 - y1, x2 - x1);
    const head = (da: number) => `${n(x2 - 5 * Math.cos(a + da))},${n(y2 - 5 * Math.sin(a + da))}`;
    out.push(`<polygon points="${n(x2)},${n(y2)} ${head(0.4)} ${head(-0.4)}" fill="#000"/>`);
  };
  const obstacles: Box[] = [];

  // The ground at ride (z = 0) and the datum line through h = 0.
  const gy = Y({ h: 0, v: 0 });
  line(4, gy, width - 4, gy, 0.6);
  const groundText = 'ground at ride, z = 0';
  text(width - 6, gy + 9, groundText, 6, 'end');
  obstacles.push({ x: width - 6 - labelWidth(groundText, 6), y: gy + 2, w: labelWidth(groundText, 6), h: 9 });
  const ox = X({ h: 0, v: 0 });
  line(ox, MARGIN.top - 14, ox, height - 14, 0.4, '6 2 1 2');
  const datumLine = view === 'side' ? 'x = 0 (wheel centres)' : 'y = 0 (centreline)';
  text(ox + 3, MARGIN.top - 16, datumLine, 6);
  obstacles.push({ x: ox + 2, y: MARGIN.top - 23, w: labelWidth(datumLine, 6) + 2, h: 9 });

  // The wheels: the tyre's outline in the side view, its centre plane in the cross view.
  for (const w of wheels) {
    const c = at(w);
    if (view === 'side')
      out.push(
        `<circle cx="${n(c.x)}" cy="${n(c.y)}" r="${n(r * k)}" fill="none" stroke="#000" stroke-width="0.4"` +
          ` stroke-dasharray="3 2"/>`,
      );
    else line(c.x, gy, c.x, Y({ h: 0, v: planeOf(view, w).v + r }), 0.4, '3 2');
  }

  // Members; a hinge also draws its arm (lines from both frame pivots to the arm's other points).
  const memberLine = (a: Vec3, b: Vec3, w: number, dash?: string) => {
    const [p, q] = [at(a), at(b)];
    if (Math.hypot(p.x - q.x, p.y - q.y) > 0.2) line(p.x, p.y, q.x, q.y, w, dash);
  };
  for (const m of sketch.members) {
    const [a, b] = [pts.get(m.a), pts.get(m.b)];
    if (!a || !b) continue;
    if (m.kind === 'hinge') {
      memberLine(a, b, 0.5, '4 1.5 1 1.5');
      for (const p of sketch.points.filter((q) => q.body === m.body)) {
        memberLine(a, p, 0.9);
        memberLine(b, p, 0.9);
      }
    } else if (m.kind === 'shock' || m.kind === 'spring') memberLine(a, b, 0.8, '3 1.5');
    else memberLine(a, b, m.kind === 'ball-joint' ? 0.5 : 1.1);
  }
  // A solid axle as the line between its wheel centres; a knuckle as lines from its wheel centre to its joints.
  if (wheels.length === 2 && wheels.every((w) => w.body === 'axle')) memberLine(wheels[0], wheels[1], 1.4);
  for (const w of wheels) {
    if (w.body === 'axle') continue;
    for (const p of sketch.points.filter((q) => q.body === w.body && q.body.startsWith('knuckle')))
      memberLine(w, p, 0.7);
  }

  // The axes from the datum: +h to the left, +z up.
  const axisLen = 34;
  arrow(ox, gy, ox - axisLen, gy);
  arrow(ox, gy, ox, gy - axisLen);
  out.push(`<circle cx="${n(ox)}" cy="${n(gy)}" r="2.2" fill="#fff" stroke="#000" stroke-width="0.8"/>`);
  const hAxis = view === 'side' ? '+x forward' : '+y left';
  const axisTexts: [number, number, string, 'start' | 'end'][] = [
    [ox - axisLen - 2, gy + 9, hAxis, 'end'],
    [ox + 3, gy - axisLen + 4, '+z up', 'start'],
    [ox + 3, gy + 9, 'datum 0', 'start'],
  ];
  for (const [x, y, s, anchor] of axisTexts) {
    text(x, y, s, 6.5, anchor);
    const w = labelWidth(s, 6.5);
    obstacles.push({ x: anchor === 'end' ? x - w : x, y: y - 7, w, h: 9 });
  }
  obstacles.push(
    { x: ox - axisLen - 4, y: gy - 4, w: axisLen + 6, h: 8 },
    { x: ox - 4, y: gy - axisLen - 2, w: 8, h: axisLen },
  );

  // The scale bar and what the view looks at, along the bottom.
  const bar = scaleBarLength(k, u, 110);
  const bx = 8;
  const by = height - 12;
  const bw = bar.mm * k;
  line(bx, by, bx + bw, by, 1.2);
  for (const t of [0, 0.5, 1]) line(bx + bw * t, by - 3, bx + bw * t, by + 1, 0.6);
  text(bx, by - 5, '0', 6);
  text(bx + bw, by - 5, bar.text, 6, 'middle');
  text(bx + bw + 16, by + 1, `scale 1:${scale} (print at 100 %)`, 6.5);
  const seen =
    view === 'side'
      ? 'seen from the vehicle\u2019s left: front (+x) to the left'
      : `${crossView === 'front' ? 'drawn as ' : ''}seen from behind: the vehicle\u2019s left (+y) to the left`;
  text(width - 6, by + 1, seen, 6.5, 'end');
  obstacles.push({ x: 0, y: by - 12, w: width, h: 20 });

  // Every pivot, marked by what it is; coincident pivots share one label.
  const requests: LabelRequest[] = [];
  const markers: { x: number; y: number; role: PivotRole }[] = [];
  for (const p of sketch.points) {
    const role = roles.get(p.id) ?? 'moving';
    const c = at(p);
    markers.push({ ...c, role });
    obstacles.push({ x: c.x - 3, y: c.y - 3, w: 6, h: 6 });
    const near = requests.find((q) => Math.hypot(q.x - c.x, q.y - c.y) < 2.5);
    if (near) near.lines.push(p.id);
    else requests.push({ x: c.x, y: c.y, lines: [p.id] });
  }
  for (const m of markers) {
    if (m.role === 'frame')
      out.push(`<rect x="${n(m.x - 2.4)}" y="${n(m.y - 2.4)}" width="4.8" height="4.8" fill="#000"/>`);
    else if (m.role === 'reference') {
      line(m.x - 2.6, m.y - 2.6, m.x + 2.6, m.y + 2.6, 0.8);
      line(m.x - 2.6, m.y + 2.6, m.x + 2.6, m.y - 2.6, 0.8);
    } else out.push(`<circle cx="${n(m.x)}" cy="${n(m.y)}" r="2.3" fill="#fff" stroke="#000" stroke-width="0.8"/>`);
  }
  const bounds: Box = { x: 2, y: 2, w: width - 4, h: height - 18 };
  for (const placed of placeLabels(requests, obstacles, bounds, LABEL_SIZE)) {
    if (placed.leader) line(placed.leader.x1, placed.leader.y1, placed.leader.x2, placed.leader.y2, 0.35);
    const b = placed.box;
    out.push(
      `<rect x="${n(b.x)}" y="${n(b.y)}" width="${n(b.w)}" height="${n(b.h)}" fill="#fff" fill-opacity="0.85"/>`,
    );
    placed.lines.forEach((s, i) => text(b.x + 1, b.y + LABEL_SIZE * (1.2 * i + 0.95), s, LABEL_SIZE));
  }

  const svg =
    `<svg xmlns="http://www.w3.org/2000/svg" width="${n(width)}" height="${n(height)}" ` +
    `viewBox="0 0 ${n(width)} ${n(height)}">${out.join('')}</svg>`;
  return { svg, width, height, scale };
}
