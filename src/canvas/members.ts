/**
 * Konva line configs for one member, by kind: a link as a rod, a lateral rod heavier and green,
 * a shackle short and thick, a shock as body and shaft with marks at its stroke limits, a spring
 * as a coil, a hinge as a dashed axis carried past its pivots,
 * a leaf half as a thin chord from its eye to the seat. Pure: screen points in, configs out.
 */
import type Konva from 'konva';
import type { Sketch } from '../../shared/schema/sketch';
import type { Mm } from '../../shared/units';
import type { ScreenPoint } from './transform';
import { hingeAxis, shockMarks, springCoil } from './shapes';
import type { CanvasPalette } from './palette';

type Member = Sketch['members'][number];

export interface MemberDrawOptions {
  palette: CanvasPalette;
  /** 3D length now (mm), for a shock's stroke marks */
  length: Mm;
  selected: boolean;
  /** drawn faint: the far side of a side view */
  far: boolean;
  /** drawn as the ghost at the slider position */
  ghost: boolean;
}

const BASE: Konva.LineConfig = {
  lineCap: 'round',
  lineJoin: 'round',
  perfectDrawEnabled: false,
  shadowForStrokeEnabled: false,
};

export function memberLines(m: Member, a: ScreenPoint, b: ScreenPoint, o: MemberDrawOptions): Konva.LineConfig[] {
  const c = o.palette;
  const seg = [a.px, a.py, b.px, b.py];
  const opacity = o.ghost ? 0.9 : o.far ? c.farSideAlpha : 1;
  const tag = { memberId: m.id, opacity, listening: !o.ghost && !o.far };
  const colour = (own: string) => (o.ghost ? c.ghost : own);
  const dash = o.ghost ? [7, 5] : undefined;
  const out: Konva.LineConfig[] = [];
  if (o.selected && !o.ghost)
    out.push({ ...BASE, points: seg, stroke: c.selection, strokeWidth: 16, listening: false });

  switch (m.kind) {
    case 'link':
      out.push({ ...BASE, ...tag, points: seg, stroke: colour(c.link), strokeWidth: 4, dash, hitStrokeWidth: 14 });
      break;
    case 'lateral-rod':
      out.push({
        ...BASE,
        ...tag,
        points: seg,
        stroke: colour(c.lateralRod),
        strokeWidth: 5,
        dash,
        hitStrokeWidth: 14,
      });
      break;
    case 'tie-rod':
      out.push({ ...BASE, ...tag, points: seg, stroke: colour(c.tieRod), strokeWidth: 3, dash, hitStrokeWidth: 14 });
      break;
    case 'shackle':
      out.push({ ...BASE, ...tag, points: seg, stroke: colour(c.shackle), strokeWidth: 8, dash, hitStrokeWidth: 14 });
      break;
    case 'shock': {
      const s = shockMarks(a, b, o.length, m.minLength, m.maxLength);
      const body = o.ghost ? c.ghost : s.outside ? c.shockOut : c.shock;
      if (s.compressed && s.extended && !o.ghost) {
        out.push({
          ...BASE,
          points: [s.compressed.px, s.compressed.py, s.extended.px, s.extended.py],
          stroke: c.shockStroke,
          strokeWidth: 9,
          opacity,
          listening: false,
          lineCap: 'butt',
        });
      }
      out.push({ ...BASE, ...tag, points: s.body, stroke: body, strokeWidth: 8, dash, hitStrokeWidth: 14 });
      out.push({ ...BASE, ...tag, points: s.shaft, stroke: body, strokeWidth: 3, dash, hitStrokeWidth: 14 });
      if (!o.ghost) {
        for (const t of [s.compressedTick, s.extendedTick])
          if (t) out.push({ ...BASE, points: t, stroke: body, strokeWidth: 2, opacity, listening: false });
      }
      break;
    }
    case 'spring':
      out.push({
        ...BASE,
        ...tag,
        points: springCoil(a, b),
        stroke: colour(c.spring),
        strokeWidth: 2,
        dash: undefined,
        hitStrokeWidth: 14,
      });
      break;
    case 'hinge':
      out.push({
        ...BASE,
        ...tag,
        points: hingeAxis(a, b),
        stroke: colour(c.hinge),
        strokeWidth: 2,
        dash: [10, 4, 2, 4],
        hitStrokeWidth: 14,
      });
      break;
    case 'leaf-half':
      // The pack itself is drawn bent (and not listening) by the leaf-spring layer; this thin
      // chord from eye to seat is what a click or tap finds, like any other member.
      out.push({
        ...BASE,
        ...tag,
        points: seg,
        stroke: colour(c.spring),
        strokeWidth: 1.5,
        dash: dash ?? [3, 4],
        hitStrokeWidth: 14,
      });
      break;
  }
  return out;
}
