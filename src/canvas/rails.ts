/**
 * Context drawn behind a sketch: where the frame rails roughly run and how wide a tyre is drawn.
 * The sketch file holds neither; both are read off the pivots so the drawing sits right, and
 * the board labels them "indicative". Lengths in mm.
 */
import type { Sketch } from '../../shared/schema/sketch';
import { drivelinePointKeys } from '../../shared/schema/sketchVocabulary';
import type { Mm } from '../../shared/units';

/** Drawn rail height: a typical ladder-frame rail (common practice, no published source). */
export const RAIL_HEIGHT_MM: Mm = 160;
/** How far the rail outline runs past the foremost and rearmost frame pivots. */
export const RAIL_OVERRUN_MM: Mm = 300;
/** Pivots this close to the centre plane are centre mounts (lateral rod, driveline), not rail mounts. */
export const CENTRE_BAND_MM: Mm = 120;

export interface Rails {
  /** distance of each rail's centre from the centre plane */
  yHalf: Mm;
  zBottom: Mm;
  zTop: Mm;
  xMin: Mm;
  xMax: Mm;
}

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  const m = Math.floor(s.length / 2);
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

/** The rails' outline: over the highest side-mounted frame pivot, spaced at their median width. */
export function railsOf(sketch: Sketch): Rails | null {
  const d = sketch.driveline;
  const drive = new Set(d ? drivelinePointKeys.map((k) => d[k]) : []);
  const side = sketch.points.filter((p) => p.body === 'frame' && !drive.has(p.id) && Math.abs(p.y) > CENTRE_BAND_MM);
  if (side.length === 0) return null;
  const top = Math.max(...side.map((p) => p.z));
  const zBottom = top - RAIL_HEIGHT_MM * 0.25;
  return {
    yHalf: median(side.map((p) => Math.abs(p.y))),
    zBottom,
    zTop: zBottom + RAIL_HEIGHT_MM,
    xMin: Math.min(...side.map((p) => p.x)) - RAIL_OVERRUN_MM,
    xMax: Math.max(...side.map((p) => p.x)) + RAIL_OVERRUN_MM,
  };
}

/** Drawn tyre section width for a tyre radius: an indicative proportion (common practice, no published source). */
export function tyreWidth(tireRadius: Mm): Mm {
  return Math.min(340, Math.max(180, tireRadius * 0.6));
}
