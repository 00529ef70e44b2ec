/**
 * Sketch exchange format, version 1 (docs/sketch-format.md, a contract).
 * One zod schema validates the file for the client, the server and the command line;
 * the types are inferred from it. Objects are "loose": fields this build does not know
 * are kept, so a richer document (or a later minor addition) survives a round trip.
 * Lengths in mm, angles in degrees, rates in N/mm.
 */
import { z } from 'zod';
import { gridCount } from './sweepGrid';
import { SketchValidationError, formatPath } from './errors';
import { vecDistance } from '../vec3';
import { targetsSchema, tracingSchema } from './boardFields';
import {
  axleEnds,
  bodyIds,
  hingeBodyIds,
  layouts,
  wishboneArmBodyIds,
  DEFAULT_BIND_THRESHOLD_MM,
  DEFAULT_JOINT_ANGLE_LIMIT_DEG,
  driveshaftTypes,
  drivelinePointKeys,
  MAX_AXLE_TORQUE_NM,
  MAX_COORDINATE_MM,
  MAX_ID_LENGTH,
  MAX_MEMBERS,
  MAX_NAME_LENGTH,
  MAX_POINTS,
  MAX_PITMAN_SWING_DEG,
  MAX_RACK_TRAVEL_MM,
  MAX_ROLL_DEG,
  MAX_SWEEP_ROWS,
  MAX_TRAVEL_MM,
  MIN_MEMBER_LENGTH_MM,
  pitmanLayouts,
} from './sketchVocabulary';

export * from './sketchVocabulary';

const coordinate = z.number().min(-MAX_COORDINATE_MM).max(MAX_COORDINATE_MM);
const positiveLength = z.number().positive().max(MAX_COORDINATE_MM);
const id = z.string().min(1).max(MAX_ID_LENGTH);

export const pointSchema = z.looseObject({
  id,
  body: z.enum(bodyIds),
  x: coordinate,
  y: coordinate,
  z: coordinate,
});

const memberBase = { id, a: id, b: id };

export const memberSchema = z.discriminatedUnion('kind', [
  z.looseObject({ ...memberBase, kind: z.literal('link'), group: z.enum(['upper', 'lower']).optional() }),
  z.looseObject({ ...memberBase, kind: z.literal('lateral-rod') }),
  z.looseObject({ ...memberBase, kind: z.literal('tie-rod') }),
  z.looseObject({ ...memberBase, kind: z.literal('shackle') }),
  z.looseObject({
    ...memberBase,
    kind: z.literal('shock'),
    minLength: positiveLength.optional(),
    maxLength: positiveLength.optional(),
  }),
  z.looseObject({ ...memberBase, kind: z.literal('spring'), rate: z.number().positive().max(1e6).optional() }),
  z.looseObject({ ...memberBase, kind: z.literal('hinge'), body: z.enum(hingeBodyIds) }),
  // Double-wishbone layouts (addition; docs/design/double-wishbone.md): a spherical joint, `a` the ball joint on a
  // wishbone arm body and `b` the knuckle's point for it. The joint is at `a`: the knuckle is held there (the two
  // points are normally drawn at one place; a `b` drawn elsewhere only names which knuckle).
  z.looseObject({ ...memberBase, kind: z.literal('ball-joint') }),
  // Leaf-spring layouts (addition; docs/design/leaf-spring.md): one half of a leaf spring as the SAE
  // three-link model's equivalent link, from its eye `a` (frame hanger or shackle) to its
  // pivot `b` on the axle, bending about `seat` (the axle point at the spring's seat centre);
  // `rate` (N/mm) is this half's share of the spring's vertical rate at the seat.
  z.looseObject({
    ...memberBase,
    kind: z.literal('leaf-half'),
    seat: id,
    rate: z.number().positive().max(1e6).optional(),
  }),
]);

export const vehicleSchema = z.looseObject({
  wheelbase: positiveLength,
  cgHeight: positiveLength,
  track: positiveLength,
  tireRadius: positiveLength,
  /** %, share of the braking force on the front axle, for anti-dive (addition; default DEFAULT_FRONT_BRAKE_SHARE_PERCENT) */
  frontBrakeShare: z.number().min(0).max(100).optional(),
  /** which end a solid axle is (addition; absent: DEFAULT_AXLE_END, rear); the board writes it only when chosen */
  axle: z.enum(axleEnds).optional(),
});

export const sweepSettingsSchema = z
  .looseObject({
    /** mm, negative */
    droop: z.number().min(-MAX_TRAVEL_MM).lt(0).default(-150),
    /** mm, positive */
    bump: z.number().gt(0).max(MAX_TRAVEL_MM).default(150),
    /** mm */
    step: z.number().gt(0).max(MAX_TRAVEL_MM).default(5),
    /** degrees, each way */
    roll: z.number().min(0).max(MAX_ROLL_DEG).default(8),
    /** degrees */
    rollStep: z.number().gt(0).max(MAX_ROLL_DEG).default(1),
    /** mm: bind above this raises a flag */
    bindThreshold: z.number().gt(0).max(1000).default(DEFAULT_BIND_THRESHOLD_MM),
    /** degrees: a driveline joint operating angle above this raises a flag */
    jointAngleLimit: z.number().gt(0).max(90).default(DEFAULT_JOINT_ANGLE_LIMIT_DEG),
    /**
     * N·m, drive torque at the axle (positive driving forward) for wind-up and link loads
     * (addition; optional so hand-built sketches stay valid; the core reads DEFAULT_AXLE_TORQUE_NM when absent)
     */
    axleTorque: z.number().min(-MAX_AXLE_TORQUE_NM).max(MAX_AXLE_TORQUE_NM).optional(),
    /** N, a link whose axial load exceeds this (either sign) is flagged; no limit when absent (addition) */
    linkLoadLimit: z.number().gt(0).max(1e8).optional(),
    /**
     * The steer sweep (addition; absent: none): the rack moves `rack` mm each way along the line through the
     * tie rods' inner ends, by `step` mm, at ride height (docs/sketch-format.md, "The steer sweep").
     */
    steer: z
      .looseObject({
        /** mm each way, positive (a layout steered by a rack) */
        rack: z.number().gt(0).max(MAX_RACK_TRAVEL_MM).optional(),
        /** degrees each way, positive (addition: a layout steered by a pitman arm, `pitmanLayouts`) */
        pitman: z.number().gt(0).max(MAX_PITMAN_SWING_DEG).optional(),
        /** mm of rack or degrees of pitman arm, positive, at most the travel */
        step: z.number().gt(0).max(MAX_RACK_TRAVEL_MM),
      })
      .optional(),
  })
  .prefault({});

const baseSketchSchema = z.looseObject({
  format: z.literal('arcwright.sketch'),
  version: z.literal(1),
  name: z.string().max(MAX_NAME_LENGTH),
  layout: z.enum(layouts),
  vehicle: vehicleSchema,
  points: z.array(pointSchema).max(MAX_POINTS),
  members: z.array(memberSchema).max(MAX_MEMBERS),
  wheels: z.looseObject({ left: id, right: id }),
  /**
   * The driveshaft from the gearbox output to the axle's pinion: four points, and the settings of its
   * checks (additions, each optional; the core reads the DEFAULT_* of sketchVocabulary.ts when absent).
   */
  driveline: z
    .looseObject({
      output: id,
      outputAxis: id,
      pinion: id,
      pinionAxis: id,
      /** two single Cardan joints, or a double-Cardan (CV) joint at the output */
      shaft: z.enum(driveshaftTypes).optional(),
      /** degrees: a joint running straighter than this is flagged (0 turns the check off) */
      minJointAngle: z.number().min(0).max(90).optional(),
      /** degrees: single Cardan joints whose angles differ by more, or a double-Cardan shaft's pinion angle above it, is flagged */
      maxJointAngleMismatch: z.number().min(0).max(90).optional(),
      /** mm, output to pinion joint centres: the shortest and longest the slip yoke allows */
      slipYoke: z.looseObject({ collapsed: positiveLength, extended: positiveLength }).optional(),
    })
    .optional(),
  /**
   * Half-shafts from a frame-mounted drive unit to independent wheels (addition, trailing
   * arms): `inner` and `innerAxis` are frame points (the inner joint, and a point on the drive
   * unit's output axis inboard of it); `outer` and `outerAxis` are points of the wheel's
   * carrier (the outer joint, and a point on the wheel's spin axis outboard of it).
   */
  halfShafts: z
    .looseObject({
      left: z.looseObject({ inner: id, innerAxis: id, outer: id, outerAxis: id }).optional(),
      right: z.looseObject({ inner: id, innerAxis: id, outer: id, outerAxis: id }).optional(),
    })
    .optional(),
  /**
   * A steering box's pitman arm (addition, `pitmanLayouts`): frame points `pivot` (where the box's output shaft
   * carries the arm) and `axis` (a second point on that shaft's axis), and `ball` (the arm's ball, where the drag
   * link starts). Each is optional here so that a sketch missing one still sweeps heave and roll; the steer sweep
   * names what is missing (docs/design/steered-front-axle.md).
   */
  pitmanArm: z.looseObject({ pivot: id.optional(), axis: id.optional(), ball: id.optional() }).optional(),
  sweep: sweepSettingsSchema,
  /** the designer's target bands (addition; boardFields.ts) */
  targets: targetsSchema.optional(),
  /** reference photos behind the views (addition; boardFields.ts) */
  tracing: tracingSchema.optional(),
});

type BaseSketch = z.infer<typeof baseSketchSchema>;
type Path = (string | number)[];
type Report = (path: Path, message: string) => void;

const isWishboneArm = (body: string): boolean => (wishboneArmBodyIds as readonly string[]).includes(body);
const bodySide = (body: string): 'left' | 'right' | null =>
  body.endsWith('-left') ? 'left' : body.endsWith('-right') ? 'right' : null;

/** A member from a wishbone arm to a moving body of the other side: the field of the arm's end, and the problem. */
function armSideMismatch(aBody: string, bBody: string): { field: 'a' | 'b'; message: string } | null {
  const [sa, sb] = [bodySide(aBody), bodySide(bBody)];
  if (!sa || !sb || sa === sb) return null;
  if (!isWishboneArm(aBody) && !isWishboneArm(bBody)) return null;
  const field = isWishboneArm(bBody) ? 'b' : 'a';
  return { field, message: `joins '${aBody}' to '${bBody}': a member on a wishbone arm must stay on its side` };
}

/** Each wishbone arm body that has points needs its hinge (two frame pivots) and its ball joint to the knuckle. */
function checkWishboneArms(s: BaseSketch, report: Report): void {
  for (const arm of wishboneArmBodyIds) {
    const i = s.points.findIndex((p) => p.body === arm);
    if (i < 0) continue;
    if (!s.members.some((m) => m.kind === 'hinge' && m.body === arm))
      report(['points', i, 'body'], `'${arm}' has no hinge: a wishbone arm turns about two frame pivots`);
    const onArm = new Set(s.points.filter((p) => p.body === arm).map((p) => p.id));
    if (!s.members.some((m) => m.kind === 'ball-joint' && onArm.has(m.a)))
      report(['points', i, 'body'], `'${arm}' has no ball joint: a wishbone arm holds the knuckle at one point`);
  }
}

/**
 * `sweep.steer`'s input: a rack (mm) for a layout steered by a rack, a pitman arm's swing (degrees) for one steered
 * by a pitman arm, never both; the step at most the travel. Returns the steer rows it asks for (0 when refused).
 */
function checkSteerInput(
  layout: BaseSketch['layout'],
  steer: NonNullable<BaseSketch['sweep']['steer']>,
  report: Report,
) {
  const path = ['sweep', 'steer'];
  const pitmanLayout = pitmanLayouts.includes(layout);
  if (steer.rack !== undefined && steer.pitman !== undefined) {
    report([...path, 'pitman'], 'give rack (mm) or pitman (degrees), not both');
    return 0;
  }
  if (pitmanLayout && steer.rack !== undefined) {
    report(
      [...path, 'rack'],
      `the ${layout} layout turns a pitman arm, not a rack: give sweep.steer.pitman (degrees each way) instead`,
    );
    return 0;
  }
  if (!pitmanLayout && steer.pitman !== undefined) {
    report([...path, 'pitman'], `the ${layout} layout has no pitman arm: give sweep.steer.rack (mm each way) instead`);
    return 0;
  }
  const travel = pitmanLayout ? steer.pitman : steer.rack;
  if (travel === undefined) {
    report(
      [...path, pitmanLayout ? 'pitman' : 'rack'],
      pitmanLayout ? 'required, the pitman arm swing in degrees each way' : 'required, the rack travel in mm each way',
    );
    return 0;
  }
  // A block whose own fields are refused by the field schemas adds no second problem here.
  if (!(travel > 0 && steer.step > 0)) return 0;
  if (steer.step > travel)
    report(
      [...path, 'step'],
      pitmanLayout ? `must be at most the pitman swing (${travel}°)` : `must be at most the rack travel (${travel} mm)`,
    );
  return gridCount(-travel, travel, steer.step);
}

/** The rules that join fields together; each problem names the field it is about. */
function checkCrossFields(s: BaseSketch, report: Report): void {
  const points = new Map<string, BaseSketch['points'][number]>();
  s.points.forEach((p, i) => {
    if (points.has(p.id)) report(['points', i, 'id'], `duplicate id '${p.id}'`);
    else points.set(p.id, p);
  });
  const memberIds = new Set<string>();
  s.members.forEach((m, i) => {
    if (memberIds.has(m.id)) report(['members', i, 'id'], `duplicate id '${m.id}'`);
    memberIds.add(m.id);
    const a = points.get(m.a);
    const b = points.get(m.b);
    if (!a) report(['members', i, 'a'], `no point '${m.a}'`);
    if (!b) report(['members', i, 'b'], `no point '${m.b}'`);
    if (!a || !b) return;
    if (m.kind === 'hinge') {
      // A knuckle turns about its kingpin axis on the axle; an arm about two frame pivots.
      const axisBody = m.body.startsWith('knuckle-') ? 'axle' : 'frame';
      const where =
        axisBody === 'axle'
          ? "a knuckle's hinge (kingpin) axis point must be on the axle"
          : 'a hinge axis point must be on the frame';
      if (a.body !== axisBody) report(['members', i, 'a'], `${where} ('${a.id}' is on '${a.body}')`);
      if (b.body !== axisBody) report(['members', i, 'b'], `${where} ('${b.id}' is on '${b.body}')`);
      if (!s.points.some((p) => p.body === m.body)) report(['members', i, 'body'], `no point is on '${m.body}'`);
    } else if (a.body === b.body) {
      report(['members', i, 'b'], `joins two points of one body ('${m.a}' and '${m.b}' are both on '${a.body}')`);
    }
    const crossing = armSideMismatch(a.body, b.body);
    if (crossing) report(['members', i, crossing.field], crossing.message);
    if (m.kind === 'ball-joint') {
      if (!isWishboneArm(a.body))
        report(
          ['members', i, 'a'],
          `a ball joint's first point must be on a wishbone arm ('${a.id}' is on '${a.body}')`,
        );
      if (!b.body.startsWith('knuckle-'))
        report(['members', i, 'b'], `a ball joint's second point must be on a knuckle ('${b.id}' is on '${b.body}')`);
      return;
    }
    if (m.kind === 'leaf-half') {
      if (a.body !== 'frame' && !a.body.startsWith('shackle-')) {
        report(
          ['members', i, 'a'],
          `a leaf spring's eye must be on the frame or a shackle ('${a.id}' is on '${a.body}')`,
        );
      }
      if (b.body !== 'axle')
        report(['members', i, 'b'], `a leaf spring's pivot must be on the axle ('${b.id}' is on '${b.body}')`);
      const seat = points.get(m.seat);
      if (!seat) report(['members', i, 'seat'], `no point '${m.seat}'`);
      else if (seat.body !== 'axle')
        report(['members', i, 'seat'], `a leaf spring's seat must be on the axle ('${seat.id}' is on '${seat.body}')`);
      else if (vecDistance(a, seat) < MIN_MEMBER_LENGTH_MM)
        report(['members', i, 'seat'], `must be apart from the eye '${m.a}' (at least ${MIN_MEMBER_LENGTH_MM} mm)`);
    }
    const len = vecDistance(a, b);
    if (len < MIN_MEMBER_LENGTH_MM) {
      report(
        ['members', i],
        `zero length: '${m.a}' and '${m.b}' are ${len.toFixed(2)} mm apart (at least ${MIN_MEMBER_LENGTH_MM} mm)`,
      );
    }
    if (m.kind === 'shock' && m.minLength !== undefined && m.maxLength !== undefined && !(m.minLength < m.maxLength)) {
      report(['members', i, 'maxLength'], `must be greater than minLength (${m.minLength})`);
    }
  });

  checkWishboneArms(s, report);
  const wheel = (side: 'left' | 'right') => {
    const ref = s.wheels[side];
    const p = points.get(ref);
    if (!p) report(['wheels', side], `no point '${ref}'`);
    else if (p.body === 'frame')
      report(['wheels', side], `'${ref}' is on the frame; a wheel centre must be on a moving body`);
    return p;
  };
  const wl = wheel('left');
  const wr = wheel('right');
  if (wl && wr && wl.id === wr.id) report(['wheels', 'right'], `same point as wheels.left ('${wr.id}')`);

  if (s.driveline) {
    const d = s.driveline;
    const at = (key: (typeof drivelinePointKeys)[number], onFrame: boolean) => {
      const ref = d[key];
      const p = points.get(ref);
      if (!p) report(['driveline', key], `no point '${ref}'`);
      else if (onFrame && p.body !== 'frame')
        report(['driveline', key], `'${ref}' must be on the frame (it is on '${p.body}')`);
      else if (!onFrame && p.body === 'frame')
        report(['driveline', key], `'${ref}' must be on a moving body (it is on the frame)`);
      return p;
    };
    const o = at('output', true);
    const oa = at('outputAxis', true);
    const pn = at('pinion', false);
    const pa = at('pinionAxis', false);
    if (o && oa && vecDistance(o, oa) < MIN_MEMBER_LENGTH_MM)
      report(['driveline', 'outputAxis'], `must be apart from the output point (at least ${MIN_MEMBER_LENGTH_MM} mm)`);
    if (pn && pa && vecDistance(pn, pa) < MIN_MEMBER_LENGTH_MM)
      report(['driveline', 'pinionAxis'], `must be apart from the pinion point (at least ${MIN_MEMBER_LENGTH_MM} mm)`);
    if (pn && pa && pn.body !== pa.body && pa.body !== 'frame')
      report(['driveline', 'pinionAxis'], `must be on the same body as the pinion ('${pn.body}')`);
    if (o && pn && vecDistance(o, pn) < MIN_MEMBER_LENGTH_MM)
      report(['driveline', 'pinion'], `must be apart from the output point (at least ${MIN_MEMBER_LENGTH_MM} mm)`);
    if (d.slipYoke && !(d.slipYoke.collapsed < d.slipYoke.extended))
      report(['driveline', 'slipYoke', 'extended'], `must be longer than collapsed (${d.slipYoke.collapsed} mm)`);
  }

  for (const side of ['left', 'right'] as const) {
    const h = s.halfShafts?.[side];
    if (!h) continue;
    const at = (key: 'inner' | 'innerAxis' | 'outer' | 'outerAxis') => {
      const p = points.get(h[key]);
      if (!p) report(['halfShafts', side, key], `no point '${h[key]}'`);
      return p;
    };
    const inner = at('inner'),
      innerAxis = at('innerAxis'),
      outer = at('outer'),
      outerAxis = at('outerAxis');
    if (inner && inner.body !== 'frame')
      report(['halfShafts', side, 'inner'], `'${inner.id}' must be on the frame (it is on '${inner.body}')`);
    if (innerAxis && innerAxis.body !== 'frame')
      report(
        ['halfShafts', side, 'innerAxis'],
        `'${innerAxis.id}' must be on the frame (it is on '${innerAxis.body}')`,
      );
    if (outer && outer.body === 'frame')
      report(['halfShafts', side, 'outer'], `'${outer.id}' must be on a moving body (it is on the frame)`);
    if (outer && outerAxis && outerAxis.body !== outer.body)
      report(['halfShafts', side, 'outerAxis'], `must be on the same body as the outer joint ('${outer.body}')`);
    if (inner && innerAxis && vecDistance(inner, innerAxis) < MIN_MEMBER_LENGTH_MM)
      report(
        ['halfShafts', side, 'innerAxis'],
        `must be apart from the inner joint (at least ${MIN_MEMBER_LENGTH_MM} mm)`,
      );
    if (outer && outerAxis && vecDistance(outer, outerAxis) < MIN_MEMBER_LENGTH_MM)
      report(
        ['halfShafts', side, 'outerAxis'],
        `must be apart from the outer joint (at least ${MIN_MEMBER_LENGTH_MM} mm)`,
      );
    if (inner && outer && vecDistance(inner, outer) < MIN_MEMBER_LENGTH_MM)
      report(['halfShafts', side, 'outer'], `must be apart from the inner joint (at least ${MIN_MEMBER_LENGTH_MM} mm)`);
  }

  const sw = s.sweep;
  const steerRows = sw.steer ? checkSteerInput(s.layout, sw.steer, report) : 0;
  const rows = gridCount(sw.droop, sw.bump, sw.step) + gridCount(-sw.roll, sw.roll, sw.rollStep) + steerRows;
  if (rows > MAX_SWEEP_ROWS) {
    report(
      ['sweep'],
      `at most ${MAX_SWEEP_ROWS} rows a sweep (these settings give ${Number.isFinite(rows) ? rows : 'too many'}); use a larger step`,
    );
  }
}

/** The sketch file schema with every cross-field rule. */
export const sketchSchema = baseSketchSchema.superRefine((s, ctx) => {
  checkCrossFields(s, (path, message) => ctx.addIssue({ code: 'custom', path, message }));
});

/** A validated sketch (output of the schema: sweep defaults filled in). */
export type Sketch = z.infer<typeof sketchSchema>;
/** A sketch as written in a file (sweep block and its fields optional). */
export type SketchInput = z.input<typeof sketchSchema>;
export type SketchPoint = Sketch['points'][number];
export type SketchMember = Sketch['members'][number];
export type SweepSettings = Sketch['sweep'];
export type Vehicle = Sketch['vehicle'];
export type Driveline = NonNullable<Sketch['driveline']>;
export type HalfShaft = NonNullable<NonNullable<Sketch['halfShafts']>['left']>;

const article = (noun: string) => (/^[aeiou]/.test(noun) ? `an ${noun}` : `a ${noun}`);
const typeName = (t: string) => (t === 'array' ? 'list' : t);
const quote = (v: unknown) => (typeof v === 'string' ? `'${v}'` : String(v));
const quoteList = (vs: readonly unknown[]) =>
  vs.length === 1 ? `expected ${quote(vs[0])}` : `expected one of ${vs.map(quote).join(', ')}`;

/** One zod issue as one plain line: "<path>: <problem>". */
export function formatIssue(iss: z.core.$ZodIssue): string {
  const where = formatPath(iss.path);
  switch (iss.code) {
    case 'invalid_type': {
      const expected = article(typeName(String(iss.expected)));
      const missing = 'input' in iss ? iss.input === undefined : /received undefined/.test(iss.message);
      return missing && iss.path.length > 0
        ? `${where}: required, expected ${expected}`
        : `${where}: expected ${expected}`;
    }
    case 'invalid_value':
      return `${where}: ${quoteList(iss.values)}`;
    case 'invalid_union':
      if ('options' in iss && Array.isArray((iss as { options?: unknown[] }).options)) {
        return `${where}: ${quoteList((iss as unknown as { options: unknown[] }).options)}`;
      }
      return `${where}: not a valid value`;
    case 'too_small': {
      const bound = Number(iss.minimum);
      if (iss.origin === 'array') return `${where}: at least ${bound} item${bound === 1 ? '' : 's'}`;
      if (iss.origin === 'string')
        return bound <= 1 ? `${where}: must not be empty` : `${where}: at least ${bound} characters`;
      return `${where}: must be ${iss.inclusive ? 'at least' : 'greater than'} ${bound}`;
    }
    case 'too_big': {
      const bound = Number(iss.maximum);
      if (iss.origin === 'array') return `${where}: at most ${bound} items`;
      if (iss.origin === 'string') return `${where}: at most ${bound} characters`;
      return `${where}: must be ${iss.inclusive ? 'at most' : 'less than'} ${bound}`;
    }
    default:
      return `${where}: ${iss.message}`;
  }
}

/** Validates a parsed JSON value as a sketch; never throws. */
export function checkSketch(doc: unknown): { ok: true; sketch: Sketch } | { ok: false; problems: string[] } {
  const res = sketchSchema.safeParse(doc, { reportInput: true });
  if (res.success) return { ok: true, sketch: res.data };
  const problems = [...new Set(res.error.issues.map(formatIssue))];
  return { ok: false, problems };
}

/** Validates a parsed JSON value as a sketch; throws SketchValidationError listing every problem. */
export function parseSketch(doc: unknown): Sketch {
  const res = checkSketch(doc);
  if (!res.ok) throw new SketchValidationError(res.problems);
  return res.sketch;
}
