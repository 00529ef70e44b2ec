/**
 * The words and bounds of the sketch format (docs/sketch-format.md) that the
 * solver reads as values: layouts, bodies, member kinds, size bounds and defaults. They live
 * apart from the zod schema (sketch.ts, which re-exports them) so that the kinematics core can
 * import them without the validator: the board's sweep worker runs on sketches the page has
 * already validated, and carrying zod there would only add to the download.
 * Lengths in mm, angles in degrees, torques in N·m.
 */
/** The seven layouts a sketch can come from (the starter it was built from). */
export const layouts = [
  'four-link-lateral-rod',
  'triangulated-four-link',
  'three-link-lateral-rod',
  'leaf-spring',
  'trailing-arm',
  'double-wishbone',
  // Addition: a front solid axle on links and a track bar, its knuckles on kingpins, steered by a pitman arm.
  'steered-front-axle',
] as const;
export type Layout = (typeof layouts)[number];

/**
 * Which end of the vehicle a solid axle is (`vehicle.axle`). The sketch keeps its axes (x forward) either
 * way, so a front axle's links run rearward to the frame. Absent means rear, as every earlier file is.
 */
export const axleEnds = ['front', 'rear'] as const;
export type AxleEnd = (typeof axleEnds)[number];
export const DEFAULT_AXLE_END: AxleEnd = 'rear';

/** Bodies a point can belong to. The frame is fixed; the others move. */
export const bodyIds = [
  'frame',
  'axle',
  'arm-left',
  'arm-right',
  'knuckle-left',
  'knuckle-right',
  // Leaf-spring layouts (addition): the shackle carrying each spring's swinging eye.
  'shackle-left',
  'shackle-right',
  // Double-wishbone layouts (addition): each wishbone as a body turning about its two frame pivots (a `hinge`),
  // its ball joint held to the knuckle's by a `ball-joint` member, so a coil-over can sit on the lower arm.
  'upper-arm-left',
  'lower-arm-left',
  'upper-arm-right',
  'lower-arm-right',
] as const;
export type BodyId = (typeof bodyIds)[number];
export type MovingBodyId = Exclude<BodyId, 'frame'>;

export const memberKinds = [
  'link',
  'lateral-rod',
  'tie-rod',
  'shackle',
  'shock',
  'spring',
  'hinge',
  'leaf-half',
  'ball-joint',
] as const;
export type MemberKind = (typeof memberKinds)[number];

/**
 * Bodies that turn about a `hinge`: the trailing arms and the wishbone arm bodies about two frame pivots, and
 * (addition) a solid axle's knuckles about their kingpin axis through two axle points.
 */
export const hingeBodyIds = [
  'arm-left',
  'arm-right',
  'upper-arm-left',
  'lower-arm-left',
  'upper-arm-right',
  'lower-arm-right',
  'knuckle-left',
  'knuckle-right',
] as const;
export type HingeBodyId = (typeof hingeBodyIds)[number];
/** The wishbone arm bodies (each needs its hinge and its ball joint). */
export const wishboneArmBodyIds = ['upper-arm-left', 'lower-arm-left', 'upper-arm-right', 'lower-arm-right'] as const;
export type WishboneArmBodyId = (typeof wishboneArmBodyIds)[number];

/** Member kinds that hold a fixed length between their two points (the solver's constraints). */
export const rigidMemberKinds: readonly MemberKind[] = ['link', 'lateral-rod', 'tie-rod', 'shackle'];

/** Size bounds, so that a document can never make the solver or the server work without end. */
export const MAX_POINTS = 200;
export const MAX_MEMBERS = 200;
/** Heave rows plus roll rows (plus steer rows, when the sketch asks for a steer sweep) of one sweep. */
export const MAX_SWEEP_ROWS = 2000;
/** No coordinate or vehicle dimension beyond 100 m: keeps every derived number finite. */
export const MAX_COORDINATE_MM = 100_000;
/** Heave travel either way, mm. */
export const MAX_TRAVEL_MM = 2000;
/** Articulation either way, degrees (beyond this the small-part geometry of a sketch means nothing). */
export const MAX_ROLL_DEG = 45;
/**
 * mm, the most rack travel a steer sweep may ask for each way: far beyond any rack (a light truck's moves about
 * 75 mm each way), so a slip of a digit is refused rather than marched.
 */
export const MAX_RACK_TRAVEL_MM = 500;
/**
 * Degrees, the most pitman arm swing a steer sweep may ask for each way: a steering box turns its arm about 45°
 * each way, so anything past a quarter turn is a slip of a digit.
 */
export const MAX_PITMAN_SWING_DEG = 90;
/** The layouts whose steer sweep turns a pitman arm (`sweep.steer.pitman`); every other steered layout moves a rack. */
export const pitmanLayouts: readonly Layout[] = ['steered-front-axle'];
export const MAX_ID_LENGTH = 64;
export const MAX_NAME_LENGTH = 200;
/** A member shorter than this is a drawing slip (two pivots on top of each other), not a part. */
export const MIN_MEMBER_LENGTH_MM = 1;

export const DEFAULT_BIND_THRESHOLD_MM = 1.5;
/**
 * N·m, drive torque at the axle for wind-up and link loads when the file gives none: about a
 * light truck in first gear (350 N·m × 3.3 × 3.5). Common practice, no published source.
 */
export const DEFAULT_AXLE_TORQUE_NM = 4000;
/** N·m, the largest axle torque a file may ask for (a heavy truck's first gear is well below). */
export const MAX_AXLE_TORQUE_NM = 200_000;
/** Common practice for smooth running at road speed (docs/references.md, driveline guides); no published source. */
export const DEFAULT_JOINT_ANGLE_LIMIT_DEG = 3;

/** The driveline's four point fields (the rest of the block are settings). */
export const drivelinePointKeys = ['output', 'outputAxis', 'pinion', 'pinionAxis'] as const;
/**
 * Driveshaft types: two single (Cardan) joints whose angles should match, or a double-Cardan (CV)
 * joint at the output with the pinion pointing at it.
 */
export const driveshaftTypes = ['single-cardan', 'double-cardan'] as const;
export type DriveshaftType = (typeof driveshaftTypes)[number];
export const DEFAULT_DRIVESHAFT_TYPE: DriveshaftType = 'single-cardan';
/**
 * Degrees: a Cardan joint running straighter than this keeps its needle bearings in one place, so
 * they wear there. Common practice, no published source.
 */
export const DEFAULT_MIN_JOINT_ANGLE_DEG = 0.5;
/**
 * Degrees: two single Cardan joints whose operating angles differ by more than this no longer cancel
 * each other's speed fluctuation. Common practice, no published source.
 */
export const DEFAULT_MAX_JOINT_ANGLE_MISMATCH_DEG = 1;

/** Share of the braking force on the front axle when a file gives none (%; common practice for road vehicles, no published source). */
export const DEFAULT_FRONT_BRAKE_SHARE_PERCENT = 65;
