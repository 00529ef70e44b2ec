/**
 * The sketch's optional board fields (additions to format v1; docs/sketch-format.md): the designer's
 * `targets` and the `tracing` photos behind the views. They do not change the sweep, but they
 * save, export and import with the sketch, so the server checks them like every other field.
 * Objects are loose, as in the rest of the format: a key this build does not know survives.
 * Targets are in the file's units (% for anti-squat and roll steer, degrees for angles, mm for
 * lengths); a tracing is placed in the view's plane in mm.
 */
import { z } from 'zod';
import { MAX_COORDINATE_MM } from './sketchVocabulary';

/** The fields of this file: the sweep reads neither, so a problem in them never stops a sweep. */
export const boardOnlyFields = ['targets', 'tracing'] as const;

/**
 * The sweep quantities a target band can be set on, in the targets table's order. The metric
 * registry (shared/kinematics/metrics/registry) marks the same keys as target-capable: the
 * schema cannot import the kinematics, so the list lives here and a test holds both equal.
 */
export const targetMetrics = [
  'antiSquat',
  'pinionAngleChange',
  'lateralShift',
  'foreAftShift',
  'rollCenterHeight',
  'bind',
  'rollSteer',
  'articulation',
] as const;
export type TargetMetric = (typeof targetMetrics)[number];

const finite = z.number().finite();
/**
 * A band on one metric; either end may be open. `from`/`to` limit the check to part of the
 * sweep: mm of travel for heave metrics, degrees of roll for roll metrics.
 */
export const targetBandSchema = z
  .looseObject({ min: finite.optional(), max: finite.optional(), from: finite.optional(), to: finite.optional() })
  .refine((b) => b.min === undefined || b.max === undefined || b.min <= b.max, { message: 'min must not be above max' })
  .refine((b) => b.from === undefined || b.to === undefined || b.from <= b.to, {
    message: 'from must not be after to',
  });
export type TargetBand = z.output<typeof targetBandSchema>;

const targetsShape = Object.fromEntries(targetMetrics.map((m) => [m, targetBandSchema.optional()])) as Record<
  TargetMetric,
  z.ZodOptional<typeof targetBandSchema>
>;
/** The designer's bands by metric: the object the board edits (a key this build does not know is kept by the file). */
const targetsObject = z.object(targetsShape);
export type Targets = z.output<typeof targetsObject>;

/** The `targets` field as a file holds it: the bands, and any key this build does not know, kept. */
export const targetsSchema = targetsObject.loose();

/** Scales outside this range (mm per image px) come from a slip, not from a photo of a vehicle. */
export const MIN_MM_PER_PX = 0.001;
export const MAX_MM_PER_PX = 1000;

const coordinate = z.number().finite().min(-MAX_COORDINATE_MM).max(MAX_COORDINATE_MM);
/**
 * One photo behind a view: which upload, its size in its own pixels, where its centre sits (mm) and its scale.
 * The image is drawn upright and unmirrored on screen; only its centre and its scale are stored.
 */
export const tracingImageSchema = z.looseObject({
  /** upload id as POST /api/sketches/:id/uploads answers it (a UUID string on this server) */
  upload: z.union([z.string().min(1).max(100), z.number().int().positive()]),
  /** where the bytes are served, '/api/uploads/:id' */
  url: z.string().min(1).max(500),
  /** image size in its own pixels */
  width: z.number().positive(),
  height: z.number().positive(),
  /** the image's centre in the view's plane, mm (h = x in the side view, y in the rear view; v = z) */
  centre: z.looseObject({ h: coordinate, v: coordinate }),
  /** mm per image pixel */
  mmPerPx: z.number().min(MIN_MM_PER_PX).max(MAX_MM_PER_PX),
  /** 0 (invisible) to 1 (opaque) */
  opacity: z.number().min(0).max(1),
  /** a locked photo cannot be moved by dragging */
  locked: z.boolean(),
});
export type TracingImage = z.infer<typeof tracingImageSchema>;

/** The sketch's optional `tracing` field: at most one photo per view. */
export const tracingSchema = z.looseObject({
  side: tracingImageSchema.optional(),
  rear: tracingImageSchema.optional(),
});
export type Tracing = z.infer<typeof tracingSchema>;
