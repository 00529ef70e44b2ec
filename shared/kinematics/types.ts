/**
 * The sweep result: the contract of docs/sketch-format.md ("Sweep result"), plus the agreed
 * additions (`bodies` per row, `lengthChange` per member, `ride`, event `sweep`, and a
 * few fields marked "addition" below). Every number is finite; "does not apply" or
 * "does not exist" is `null`, never NaN.
 * Lengths mm, angles degrees, rates N/mm, ratios and percentages plain numbers.
 */
import type { Deg, Mm, NPerMm } from '../units';
import type { MovingBodyId, WishboneArmBodyId } from '../schema/sketch';

/**
 * Pose of a moving body relative to its ride position: the translation of the body's
 * reference point (mm) and the rotation R = Rz(yaw)·Ry(pitch)·Rx(roll) about it (deg),
 * ISO 8855 signs: roll positive lifts the left side, pitch positive drops the nose,
 * yaw positive turns the nose left. The axle's reference point is the midpoint of its
 * wheel centres at ride; an arm's or knuckle's is its wheel centre.
 */
export interface Pose {
  x: Mm;
  y: Mm;
  z: Mm;
  roll: Deg;
  pitch: Deg;
  yaw: Deg;
}

export type BodyPoses = Partial<Record<MovingBodyId, Pose>>;

/** Readings of one member at one row. */
export interface MemberReading {
  /** mm, between the member's two points */
  length: Mm;
  /** mm, length minus ride length (addition; for links in an over-constrained linkage this is their share of bind) */
  lengthChange: Mm;
  /** |d length / d travel| for shocks and springs in heave rows; absent otherwise */
  motionRatio?: number;
  /** N/mm, spring rate × motionRatio² (Barton & Fieldhouse §3.9) for springs with a rate, heave rows only (addition) */
  wheelRate?: NPerMm;
}

/** Side-view (x–z) point, mm. */
export interface SidePoint {
  x: Mm;
  z: Mm;
}

/** Front-view (y–z) point, mm (addition, double-wishbone layouts). */
export interface FrontPoint {
  y: Mm;
  z: Mm;
}

/**
 * The left knuckle's steering (kingpin) axis, from the lower to the upper ball joint, at one
 * heave row (addition, double-wishbone layouts; the readout shows the ride row's).
 */
export interface KingpinReading {
  /** deg, front-view angle of the axis from the vertical, positive when its top leans inboard */
  inclination: Deg;
  /** deg, side-view angle of the axis from the vertical, positive when its top leans rearward */
  caster: Deg;
  /**
   * mm, in the ground plane, from where the axis meets the ground to the contact patch (below
   * the wheel centre), positive when the axis meets the ground inboard of the patch
   */
  scrubRadius: Mm;
  /** mm, mechanical trail: how far ahead of the contact patch the axis meets the ground */
  trail: Mm;
}

export interface DrivelineReading {
  /** mm, output joint to pinion joint */
  length: Mm;
  /** mm, length minus ride length (positive: the slip yoke extends) */
  plunge: Mm;
  /** deg, operating angle of the output joint (gearbox shaft to driveshaft, in 3D) */
  outputAngle: Deg;
  /** deg, operating angle of the pinion joint (driveshaft to pinion shaft, in 3D) */
  pinionAngle: Deg;
}

/** One row of the heave sweep (travel imposed, roll 0). */
export interface HeaveRow {
  /** mm, axle reference point above its ride position (bump positive) */
  travel: Mm;
  /** pose of the axle (for layouts without one: of the body carrying the left wheel) */
  pose: Pose;
  /** poses of every moving body (addition) */
  bodies: BodyPoses;
  /** deg, −pitch of the axle (positive when the axle's nose rises); null without an axle */
  pinionAngleChange: Deg | null;
  /** mm, pose.y of the axle; null without an axle */
  lateralShift: Mm | null;
  /** mm, pose.x of the axle (without an axle: the left wheel centre's x change) */
  foreAftShift: Mm;
  /** side-view instant centre of the left side's upper and lower links; null when parallel or not defined */
  instantCenter: SidePoint | null;
  /** %, from the left contact patch through the instant centre; null when not defined */
  antiSquat: number | null;
  /** mm, z where the lateral rod's rear-view line crosses y = 0 (without a rod: see DEVELOPERS.md); null when not defined */
  rollCenterHeight: Mm | null;
  /**
   * mm, the roll centre (`rollCenterHeight`, on the centreline) above the ground under the wheels at
   * this row, measured square to that ground (metrics/ground.ts); null where the roll centre or the
   * ground is not defined (addition)
   */
  rollCenterAboveGround?: Mm | null;
  /**
   * mm, the side-view instant centre (`instantCenter`, in the fore-aft plane through the left wheel
   * centre) above the ground under the wheels at this row, measured square to it; null where either
   * is not defined (addition)
   */
  instantCenterAboveGround?: Mm | null;
  /** mm, largest absolute constraint residual */
  bind: Mm;
  members: Record<string, MemberReading>;
  /** absent when the sketch has no driveline */
  driveline?: DrivelineReading;
  /** deg, left wheel, rear view, positive when the top leans out (addition: arms and knuckles; metrics/wheel.ts) */
  camberChange?: Deg;
  /** deg, left wheel, top view, positive toe-in; on a knuckle this is the bump steer (addition: arms and knuckles) */
  toeChange?: Deg;
  /**
   * mm, change from ride of the left tyre's contact point's distance from the centreline, measured
   * along the ground (metrics/ground.ts: the lowest point of the tyre circle of `vehicle.tireRadius`
   * in the wheel plane); positive when the patch moves outward, the scrub a designer keeps small.
   * null when no ground is found (a wheel lying flat) (addition: arms and knuckles)
   */
  contactTrackChange?: Mm | null;
  /** mm, change of the left wheel centre's distance from y = 0 (addition: arms and knuckles) */
  trackChange?: Mm;
  /**
   * deg, each wheel's steer angle change from ride in top view, positive when it turns toward the vehicle's left
   * (as yaw): on a steered solid axle, the bump steer of the drag link against the track bar (addition: steered front
   * axle; layouts/steered-front-axle/rows.ts)
   */
  wheelSteer?: { left: Deg; right: Deg };
  /**
   * deg, change of the left kingpin axis' side-view angle, positive when its top moves rearward (addition: double
   * wishbone, steered front axle)
   */
  casterChange?: Deg | null;
  /** front-view instant centre of the left knuckle (docs/sketch-format.md construction); null when the wishbone lines are parallel (addition: double wishbone) */
  frontViewInstantCenter?: FrontPoint | null;
  /** the left kingpin axis at this row (addition: double wishbone); null when the ball joints are level */
  kingpin?: KingpinReading | null;
  /**
   * %, anti-dive of the left front wheel under braking, from the contact patch through the side-view
   * instant centre (`instantCenter`) with the vehicle's front brake share (addition: double wishbone,
   * and a solid axle at the front; metrics/antiDive.ts names the formula); null when not defined
   */
  antiDive?: number | null;
  /**
   * %, anti-lift of a front solid axle under power, from the contact patch through the side-view
   * instant centre, the axle taking the whole tractive force (addition: solid axles at the front;
   * metrics/antiLift.ts names the formula); null when not defined or when the sketch has no driveline.
   * A front axle's rows carry this field and no anti-squat.
   */
  antiLift?: number | null;
  /**
   * %, anti-lift of a rear solid axle in braking, from the contact patch through the side-view instant
   * centre with the rear brake share (100 − `vehicle.frontBrakeShare`) (addition: solid axles at the
   * rear; metrics/antiLift.ts names the formula); null when not defined
   */
  antiLiftBraking?: number | null;
  /**
   * deg, the left shackle's side-view angle from the vertical through its frame hanger,
   * positive when the spring eye lies rearward of the hanger (addition: leaf springs)
   */
  shackleAngle?: Deg;
  /** half-shaft readings per side (addition: independent wheels with a frame-mounted drive unit) */
  halfShafts?: HalfShaftReadings;
  /**
   * %, roll steer at this row's travel: 100 · yaw / roll of a small roll about this row's pose (the roll
   * sweep's `rollSteer` where roll → 0), positive when the axle turns its nose left as its left side lifts
   * (addition: solid axles, full sweeps; rollSteerInTravel.ts); null where the roll cannot be solved
   */
  rollSteerInTravel?: number | null;
  /**
   * N, axial load of every link and lateral rod (tension positive) by statics at this row from
   * the axle torque (addition: solid axles on links; loads.ts)
   */
  linkLoads?: Record<string, number>;
}

/** One row of the roll (articulation) sweep at ride height. */
export interface RollRow {
  /** deg, imposed axle roll (positive lifts the left wheel) */
  roll: Deg;
  pose: Pose;
  bodies: BodyPoses;
  /** mm, left wheel centre's z change */
  leftTravel: Mm;
  /** mm, right wheel centre's z change */
  rightTravel: Mm;
  /** %, 100 · yaw / roll; null at roll 0 */
  rollSteer: number | null;
  /** mm */
  bind: Mm;
  members: Record<string, MemberReading>;
  driveline?: DrivelineReading;
  /**
   * deg, change from ride of each wheel's camber relative to the ground (tilted by the roll in
   * the frame's axes), positive when the top leans out (addition: double wishbone)
   */
  camberToGround?: { left: Deg; right: Deg };
  /**
   * deg, each wheel's steer angle change from ride in top view, positive when it turns toward the vehicle's left
   * (as yaw), the axle's own roll steer included (addition: steered front axle)
   */
  wheelSteer?: { left: Deg; right: Deg };
  /** roll centre in the frame's axes: where the two contact-patch lines through the front-view instant centres cross; null when they do not (addition: double wishbone) */
  rollCenter?: FrontPoint | null;
  /**
   * mm per side, change from ride of each tyre's contact point's distance from the centreline,
   * along the ground under the wheels (as `HeaveRow.contactTrackChange`); null when no ground is
   * found (addition: arms and knuckles)
   */
  contactTrackChange?: { left: Mm; right: Mm } | null;
  /** mm per side, change of each wheel centre's distance from y = 0 in the frame's axes (addition: arms and knuckles) */
  trackChange?: { left: Mm; right: Mm };
  /**
   * deg per side, camber of the wheel plane from the normal of the ground under the wheels (not a
   * change: a sketch's wheels stand square at ride), positive when the top leans out; null when no
   * ground is found (addition: arms and knuckles; metrics/ground.ts)
   */
  groundCamber?: { left: Deg; right: Deg } | null;
  /**
   * mm, the roll centre above the ground under the wheels at this row, measured square to that
   * ground: the roll centre of the row's own construction (`rollCenter`; for a solid axle on links
   * the rod's or the link pairs' crossing of y = 0); null where it or the ground is not defined (addition)
   */
  rollCenterAboveGround?: Mm | null;
  /**
   * mm, the left side's side-view instant centre at this row above the ground under the wheels,
   * taken in the fore-aft plane through the left wheel centre; null where not defined (addition)
   */
  instantCenterAboveGround?: Mm | null;
  /** half-shaft readings per side (addition: independent wheels with a frame-mounted drive unit) */
  halfShafts?: HalfShaftReadings;
}

export type SweepEventKind =
  | 'lock-up'
  | 'shock-extended'
  | 'shock-compressed'
  | 'bind'
  | 'joint-angle'
  // addition: a link's axial load changes sign within the heave sweep / passes sweep.linkLoadLimit
  | 'load-reversal'
  | 'load-limit'
  // addition: a driveshaft joint under driveline.minJointAngle, two single Cardan joints' angles apart by more
  // than driveline.maxJointAngleMismatch (a double-Cardan shaft: its pinion joint over it), the shaft's length
  // outside driveline.slipYoke
  | 'joint-angle-low'
  | 'joint-angle-mismatch'
  | 'slip-yoke'
  // addition: a shock or spring whose line passes through a wishbone arm body's triangle (armClash.ts)
  | 'arm-clash';

export interface SweepEvent {
  kind: SweepEventKind;
  /** which sweep the event is in (addition): `at` is mm of travel for heave, deg of roll for roll */
  sweep: 'heave' | 'roll';
  /** mm (heave) or deg (roll), interpolated where a limit is crossed between rows */
  at: number;
  /** the shock, for shock events */
  member?: string;
  /** the joint, for joint-angle events */
  joint?: 'output' | 'pinion' | 'half-shaft-inner' | 'half-shaft-outer';
  /** the side of a half-shaft joint event (addition) */
  side?: 'left' | 'right';
  /** the driveshaft type, for joint-angle-mismatch events (addition) */
  shaft?: 'single-cardan' | 'double-cardan';
  /** the wishbone arm body a shock or spring passes through, for arm-clash events (addition) */
  body?: WishboneArmBodyId;
  /** which end of the slip yoke's travel, for slip-yoke events (addition) */
  end?: 'collapsed' | 'extended';
  /**
   * the value that crossed: bind in mm, joint angle in deg, shock length in mm (addition); for the driveshaft's
   * rules the setting crossed: minJointAngle or maxJointAngleMismatch in deg, the slip yoke's length in mm
   */
  value?: number;
  /** one plain sentence for the flags list (addition) */
  message: string;
}

export interface SweepLimits {
  /** mm, the most droop reached */
  droop: Mm;
  /** mm, the most bump reached */
  bump: Mm;
  /** deg, the articulation reached both ways (the smaller side) */
  articulation: Deg;
  /** deg, the roll reached each way (addition) */
  rollMin: Deg;
  rollMax: Deg;
  events: SweepEvent[];
}

export interface SweepResult {
  /** ordered droop → bump */
  heave: HeaveRow[];
  /** ordered −roll → +roll */
  roll: RollRow[];
  limits: SweepLimits;
  /** plain sentences for the flags list */
  warnings: string[];
  /** the travel-0 row (addition) */
  ride: HeaveRow;
  /** leaf springs: the axle's wind-up at ride height under the axle torque (addition; windUp.ts) */
  windUp?: WindUpReading;
  /** solid axles on links: axial link loads by statics from the axle torque (addition; loads.ts) */
  loads?: LinkLoadSummary;
  /** the steer sweep, when the sketch's `sweep.steer` asks for one (addition; steer/sweep.ts) */
  steer?: SteerResult;
}

/**
 * One row of the steer sweep (addition): the steering input moved, the body at ride height (each wheel
 * centre held at its ride height), the knuckles solved on their links.
 */
export interface SteerRow {
  /**
   * mm, rack travel from centre along the line through the tie rods' inner ends, positive toward the vehicle's left
   * (+y); present when the input is a rack (`SteerResult.input`), absent for a pitman arm
   */
  rack?: Mm;
  /**
   * deg, the pitman arm's swing from straight ahead about the steering box's output axis, positive when its ball
   * moves toward the vehicle's left (+y); present when the input is a pitman arm (addition), absent for a rack
   */
  pitman?: Deg;
  /** deg, the left wheel's steer angle from straight ahead in top view, positive when it turns toward the vehicle's left (yaw) */
  leftSteer: Deg;
  /** deg, the right wheel's steer angle, same sign as `leftSteer` */
  rightSteer: Deg;
  /**
   * %, 100 · (inner − outer) / (ideal inner − outer), the ideal inner angle the Ackermann condition gives for the
   * outer wheel's angle (steer/readings.ts names the source); null at straight ahead, where it is not defined
   */
  ackermann: number | null;
  /**
   * mm, from the turning centre (where the outer front wheel's axle line in the ground meets the rear axle line,
   * `vehicle.wheelbase` behind the front wheel centres) to the outer front wheel's contact patch; null straight ahead
   */
  turningRadius: Mm | null;
  /** mm, largest absolute constraint residual */
  bind: Mm;
  /**
   * poses of every moving body, for drawing the wheels turned (the rack's points move by `rack` along `rackDirection`;
   * the pitman arm's ball turns by `pitman` about `SteerResult.pitmanArm`'s axis)
   */
  bodies: BodyPoses;
}

/** Toe change over heave at one steering position (addition: the bump-steer map). */
export interface BumpSteerCurve {
  /** mm, the rack position the curve is taken at (0: straight ahead); absent for a pitman arm */
  rack?: Mm;
  /** deg, the pitman arm's swing the curve is taken at (0: straight ahead); absent for a rack (addition) */
  pitman?: Deg;
  /** ordered droop → bump; rows past a lock-up at this rack position are left out */
  points: {
    /** mm, heave travel */
    travel: Mm;
    /** deg, left wheel's toe change from travel 0 at this rack position, positive toe-in */
    left: Deg;
    /** deg, right wheel's toe change, positive toe-in */
    right: Deg;
  }[];
}

/** Bump steer at straight ahead and out to lock (addition). */
export interface BumpSteerMap {
  /** one curve per rack position, ordered by rack (−lock … 0 … +lock) */
  curves: BumpSteerCurve[];
  /** deg, the toe change of largest size over every curve and both wheels (signed, positive toe-in); null without points */
  worst: Deg | null;
  /** where the worst value is (at `rack` or `pitman`, as the rows); null with `worst` */
  worstAt: { rack?: Mm; pitman?: Deg; travel: Mm; side: 'left' | 'right' } | null;
}

export type SteerEventKind =
  // the rack reaches the end of the travel asked for: the steering lock
  | 'steer-lock'
  // a tie rod and its steering arm come into line before the rack's end: the lock (and the end of the tie rods' reach)
  | 'steer-toggle'
  // the linkage cannot follow the rack any further for another reason (a wishbone or the wheel's height)
  | 'steer-lock-up';

/** A steer sweep event (addition): shaped like SweepEvent, `at` in the input's unit (mm of rack, degrees of pitman arm). */
export interface SteerEvent {
  kind: SteerEventKind;
  sweep: 'steer';
  /** mm of rack travel, or degrees of pitman arm (the toggle's interpolated by bisection) */
  at: number;
  /** the side whose tie rod comes into line, for steer-toggle (the drag link's knuckle side for the drag link) */
  side?: 'left' | 'right';
  /** which rod and arm come into line, for steer-toggle (addition; absent: a tie rod) */
  part?: 'tie-rod' | 'drag-link' | 'pitman-arm';
  /** deg, the wheels' steer angles at the lock */
  leftSteer: Deg;
  rightSteer: Deg;
  /** one plain sentence for the flags list, naming the field (`sweep.steer.rack`, `.pitman`) where the travel asked is past reach */
  message: string;
}

/** The steer sweep (addition; docs/sketch-format.md, "The steer sweep"). */
export interface SteerResult {
  /**
   * what the steering input is, and so the rows' field that holds its position: a rack moved along a line (`rack`,
   * mm), or a pitman arm swung about the steering box's output axis (`pitman`, degrees; addition)
   */
  input: 'rack' | 'pitman';
  /** ordered −travel → +travel, the 0 row (straight ahead) included; empty when the sketch does not steer */
  rows: SteerRow[];
  /** unit vector the rack moves along for positive travel (y > 0); null when the sketch does not steer */
  rackDirection: { x: number; y: number; z: number } | null;
  /** ids of the frame points the rack moves (the tie rods' inner ends) */
  rackPoints: string[];
  /** mm, the rack travel reached each way (the lock): the first and last rows' `rack`; 0 for a pitman arm */
  rackMin: Mm;
  rackMax: Mm;
  /**
   * the pitman arm (addition; when `input` is 'pitman'): the ball's point id, the box pivot, the unit output axis
   * (oriented so that a positive swing moves the ball toward +y), the arm's length, and the swing reached each way
   */
  pitmanArm?: {
    ball: string;
    pivot: { x: Mm; y: Mm; z: Mm };
    axis: { x: number; y: number; z: number };
    length: Mm;
    min: Deg;
    max: Deg;
  };
  /** lock and toggle, one event each way */
  events: SteerEvent[];
  /**
   * toe change over heave at straight ahead and at steering positions out to lock; null when the sketch does not steer,
   * or when the sweep was asked to leave it out (sweepSketch's `bumpSteerMap: false`, the board's drag preview)
   */
  bumpSteer: BumpSteerMap | null;
  /** why there is no steer sweep, naming the field (the sentence is in `warnings` too); null when there is one */
  problem: string | null;
}

export interface SweepOptions {
  /** override the file's sweep settings (e.g. the bench's fixed range, or a coarse drag preview) */
  sweep?: Partial<{
    droop: Mm;
    bump: Mm;
    step: Mm;
    roll: Deg;
    rollStep: Deg;
    bindThreshold: Mm;
    jointAngleLimit: Deg;
    /** N·m */
    axleTorque: number;
    /** N */
    linkLoadLimit: number;
  }>;
  /** skip the roll sweep (roll: []) and the steer sweep (no `steer`) */
  heaveOnly?: boolean;
}

/** One half-shaft at one row (addition): the frame-mounted drive unit's inner joint to the wheel's outer joint. */
export interface HalfShaftReading {
  /** mm, inner joint to outer joint */
  length: Mm;
  /** mm, length minus ride length (positive: the shaft must extend) */
  plunge: Mm;
  /** deg, operating angle of the inner joint (drive unit output axis to shaft, in 3-D) */
  innerAngle: Deg;
  /** deg, operating angle of the outer joint (shaft to the wheel's spin axis, in 3-D) */
  outerAngle: Deg;
}

export interface HalfShaftReadings {
  left?: HalfShaftReading;
  right?: HalfShaftReading;
}

/** One leaf spring's part in the wind-up (addition). */
export interface LeafSpringWindUp {
  side: 'left' | 'right';
  /** member ids of the spring's front and rear halves */
  front: string;
  rear: string;
  /** N/mm, vertical rate of the whole spring at its seat (sum of the halves' rates) */
  verticalRate: NPerMm;
  /** mm, cantilever lengths, seat to front eye and seat to rear eye (side view, at ride) */
  frontLength: Mm;
  rearLength: Mm;
  /** N·m per degree, this spring's wind-up rate Σ k_i·L_i² (windUp.ts) */
  rate: number;
}

/**
 * Axle wind-up of a leaf-sprung axle at ride height (addition; windUp.ts): the axle torque
 * turns the axle housing against the springs' bending by `angle`; the linkage is then solved
 * with that pitch imposed, so shocks and the driveshaft show what the wind-up does to them.
 */
export interface WindUpReading {
  /** N·m, axle torque (positive driving forward) */
  torque: number;
  /** N·m per degree, the axle's wind-up rate (both springs) */
  rate: number;
  /** deg, wind-up angle of the axle housing, positive when the pinion nose rises (= pinionAngleChange) */
  angle: Deg;
  springs: LeafSpringWindUp[];
  /** pose of the axle wound up at ride height */
  pose: Pose;
  /** poses of every moving body wound up (for drawing) */
  bodies: BodyPoses;
  /** mm, length change from ride of every shock and spring under the wind-up */
  members: Record<string, { lengthChange: Mm }>;
  /** the driveline wound up, when the sketch has one */
  driveline?: DrivelineReading;
  /** largest residual of the wound-up solve (mm); above the bind threshold the linkage fights the wind-up */
  bind: Mm;
}

/** One link's axial load over the heave sweep (addition; loads.ts). Newtons, tension positive. */
export interface LinkLoadReading {
  /** N, at ride height */
  ride: number;
  /** N, smallest and largest over the heave rows */
  min: number;
  max: number;
  /** the load changes sign within the heave sweep */
  reverses: boolean;
  /** |load| passes sweep.linkLoadLimit somewhere in the heave sweep */
  overLimit: boolean;
}

/** Link loads by statics from the axle torque (addition; loads.ts). */
export interface LinkLoadSummary {
  /** N·m, axle torque used (positive driving forward) */
  torque: number;
  /** N, total tractive force at the two contact patches, torque / tyre radius */
  tractiveForce: number;
  /** N, the flag limit; null when none is set */
  limit: number | null;
  /**
   * more links than the coordinates they locate: the split among them depends on bushing
   * stiffness; the loads shown are the least-squares split (equal axial stiffness)
   */
  indeterminate: boolean;
  members: Record<string, LinkLoadReading>;
}
