/**
 * A tracing: a reference photo behind a view, placed in the view's plane (mm) and scaled from
 * two clicked points whose real distance the user types. Kept in the sketch document as the
 * optional `tracing` field, one image per view, so it saves with the sketch:
 *   tracing: { side?: TracingImage, rear?: TracingImage }   (shapes: tracingSchema in shared/schema)
 * The image is drawn upright and unmirrored on screen; only its centre (mm) and its scale
 * (mm per image pixel) are stored. Pure functions only; the canvas converts with
 * canvasTransform, the one place mm become stage pixels.
 */
import {
  MAX_MM_PER_PX,
  MIN_MM_PER_PX,
  tracingImageSchema,
  type Tracing,
  type TracingImage,
} from '../../shared/schema/boardFields';
import { UPLOAD_IMAGE_TYPES, UPLOAD_MAX_BYTES, byteSizeText } from '../../shared/schema/requestLimits';
import type { Mm } from '../../shared/units';
import { planeToScreen, screenToPlane, type PlanePoint, type ViewKind, type ViewTransform } from './transform';

/** Opacity a new photo starts with: visible but behind the linkage. */
export const DEFAULT_TRACING_OPACITY = 0.5;
/** Two scale points closer than this on the photo (image px) cannot give a trustworthy scale. */
const MIN_SCALE_PICK_PX = 4;

/** The document's tracing for a view, or null when absent or malformed (a bad field never breaks the board). */
export function readTracing(doc: unknown, view: ViewKind): TracingImage | null {
  const raw = (doc as { tracing?: Record<string, unknown> } | null | undefined)?.tracing?.[view];
  if (raw === undefined) return null;
  const res = tracingImageSchema.safeParse(raw);
  return res.success ? res.data : null;
}

/** The whole `tracing` field with one view's image replaced (null removes it; an empty field is dropped). */
export function withTracing(doc: unknown, view: ViewKind, img: TracingImage | null): Tracing | undefined {
  const current = ((doc as { tracing?: Tracing } | null | undefined)?.tracing ?? {}) as Tracing;
  const next: Tracing = { ...current };
  if (img) next[view] = img;
  else delete next[view];
  return Object.keys(next).length ? next : undefined;
}

/** Why a file cannot be a tracing, or null when it can. */
export function photoProblem(file: { type: string; size: number; name: string }): string | null {
  if (!Object.hasOwn(UPLOAD_IMAGE_TYPES, file.type)) return `“${file.name}” is not a PNG or JPEG photo.`;
  if (file.size > UPLOAD_MAX_BYTES)
    return `“${file.name}” is ${(file.size / 1024 / 1024).toFixed(1)} MB; a tracing may be up to ${byteSizeText(UPLOAD_MAX_BYTES)}.`;
  if (file.size === 0) return `“${file.name}” is empty.`;
  return null;
}

/**
 * Where a fresh photo goes before it is scaled: as wide as 1.6 wheelbases (a side photo of a
 * whole vehicle; the rear view: 1.6 tracks), centred over the middle of the wheelbase, its
 * bottom edge on the ground. The user then sets the true scale from two points.
 */
export function initialPlacement(
  view: ViewKind,
  width: number,
  height: number,
  vehicle: { wheelbase: Mm; track: Mm } | undefined,
): Pick<TracingImage, 'centre' | 'mmPerPx'> {
  const span = view === 'side' ? (vehicle?.wheelbase ?? 3000) : (vehicle?.track ?? 1600);
  const mmPerPx = Math.min(MAX_MM_PER_PX, Math.max(MIN_MM_PER_PX, (1.6 * span) / width));
  const centreH = view === 'side' ? span / 2 : 0;
  return { centre: { h: centreH, v: (height * mmPerPx) / 2 }, mmPerPx };
}

/** The image's rectangle on the stage (px): top-left corner and size. */
export function imageRect(
  img: TracingImage,
  t: ViewTransform,
): { x: number; y: number; width: number; height: number } {
  const c = planeToScreen(t, img.centre);
  const width = img.width * img.mmPerPx * t.scale;
  const height = img.height * img.mmPerPx * t.scale;
  return { x: c.px - width / 2, y: c.py - height / 2, width, height };
}

/** The image's centre (mm) when its top-left corner sits at stage (x, y), e.g. after a drag. */
export function centreForRect(img: TracingImage, t: ViewTransform, x: number, y: number): PlanePoint {
  const width = img.width * img.mmPerPx * t.scale;
  const height = img.height * img.mmPerPx * t.scale;
  return screenToPlane(t, { px: x + width / 2, py: y + height / 2 });
}

export type ScaleOutcome = { ok: true; image: TracingImage } | { ok: false; error: string };

/**
 * The image rescaled so that the two picked points (plane mm at the present scale) lie
 * `realMm` apart; the first point stays where it is on the vehicle, so a user who picks a
 * known point first (a wheel centre) keeps it in place.
 */
export function rescaleFromPicks(img: TracingImage, a: PlanePoint, b: PlanePoint, realMm: Mm): ScaleOutcome {
  if (!(Number.isFinite(realMm) && realMm > 0))
    return { ok: false, error: 'The real distance must be a length above zero.' };
  const shownMm = Math.hypot(b.h - a.h, b.v - a.v);
  if (shownMm / img.mmPerPx < MIN_SCALE_PICK_PX)
    return { ok: false, error: 'The two points are too close together on the photo; pick points further apart.' };
  const k = realMm / shownMm;
  const mmPerPx = img.mmPerPx * k;
  if (mmPerPx < MIN_MM_PER_PX || mmPerPx > MAX_MM_PER_PX)
    return {
      ok: false,
      error: 'That distance gives an impossible scale for this photo; check the number and its unit.',
    };
  const centre = { h: a.h + (img.centre.h - a.h) * k, v: a.v + (img.centre.v - a.v) * k };
  return { ok: true, image: { ...img, mmPerPx, centre } };
}
