/**
 * Turning solved poses into result rows: place the points, then read every metric of
 * docs/sketch-format.md off them. The generic readings (poses, members, driveline) are here; each
 * layout reader (layouts/readers.ts: which links stand for which group, which rod gives the
 * roll centre, the arms, springs and wishbones) adds its own. The plan is made once per sweep.
 */
import type { MovingBodyId, SketchMember } from '../schema/sketch';
import { cleanZero } from './clean';
import { groundPlanBuild, heaveGroundFields, rollGroundFields, type GroundPlan } from './groundReadings';
import { layoutReaders } from './layouts/readers';
import type { LayoutRowPlan, RollCentres } from './layouts/types';
import { drivelineReading } from './metrics/driveline';
import type { LinkageModel, PointModel } from './model';
import { poseFromState } from './pose';
import { BodyRotations, pointPlace, pointVelocity } from './residuals';
import type { SolvedRow } from './march';
import type { BodyPoses, DrivelineReading, HeaveRow, MemberReading, Pose, RollRow } from './types';
import { vec, vecDistance, type Vec3 } from './vec';

/** Module-local copy of an imported binding used per row (see residuals.ts). */
const clean = cleanZero;

function cleanPose(p: Pose): Pose {
  return { x: clean(p.x), y: clean(p.y), z: clean(p.z), roll: clean(p.roll), pitch: clean(p.pitch), yaw: clean(p.yaw) };
}

interface MemberPlan {
  member: SketchMember;
  a: PointModel;
  b: PointModel;
  rideLength: number;
}

export interface RowPlan {
  model: LinkageModel;
  members: MemberPlan[];
  driveline: {
    output: PointModel;
    outputAxis: PointModel;
    pinion: PointModel;
    pinionAxis: PointModel;
    rideLength: number;
  } | null;
  /** the body whose pose is a row's `pose`: the axle, else the body carrying the left wheel */
  primarySlot: number;
  rot: BodyRotations;
  scratch: { va: Float64Array; vb: Float64Array; tmp: Float64Array };
  /** the plans of the layout readers that found their parts, in reading order (layouts/readers.ts) */
  layouts: LayoutRowPlan[];
  /** the ground under the wheels (groundReadings.ts): read after the layouts */
  ground: GroundPlan;
}

export function rowPlanBuild(model: LinkageModel): RowPlan {
  const { sketch, points } = model;
  const members: MemberPlan[] = sketch.members
    .filter((m) => m.kind !== 'hinge')
    .map((m) => {
      const a = points.get(m.a)!;
      const b = points.get(m.b)!;
      return { member: m, a, b, rideLength: vecDistance(a.ride, b.ride) };
    });
  const d = sketch.driveline;
  return {
    model,
    members,
    driveline: d
      ? {
          output: points.get(d.output)!,
          outputAxis: points.get(d.outputAxis)!,
          pinion: points.get(d.pinion)!,
          pinionAxis: points.get(d.pinionAxis)!,
          rideLength: vecDistance(points.get(d.output)!.ride, points.get(d.pinion)!.ride),
        }
      : null,
    primarySlot: model.axle ? model.axle.slot : model.wheelLeft.slot,
    rot: new BodyRotations(model.bodies.length),
    scratch: { va: new Float64Array(3), vb: new Float64Array(3), tmp: new Float64Array(3) },
    layouts: layoutReaders.map((r) => r.plan(model)).filter((p): p is LayoutRowPlan => p !== null),
    ground: groundPlanBuild(model),
  };
}

/** Places points of one row, each once; reuses the plan's rotation buffers. */
class RowPlacer {
  private readonly buf = new Float64Array(3);
  private readonly placed: (Vec3 | undefined)[];
  constructor(
    private readonly plan: RowPlan,
    private readonly state: Float64Array,
  ) {
    plan.rot.update(state);
    this.placed = new Array(plan.model.points.size);
  }
  at(p: PointModel): Vec3 {
    let v = this.placed[p.index];
    if (!v) {
      pointPlace(this.plan.model, p, this.state, this.plan.rot, this.buf, 0);
      v = vec(this.buf[0], this.buf[1], this.buf[2]);
      this.placed[p.index] = v;
    }
    return v;
  }
}

function bodyPoses(model: LinkageModel, state: Float64Array): BodyPoses {
  const out: BodyPoses = {};
  for (const b of model.bodies) out[b.id as MovingBodyId] = cleanPose(poseFromState(state, b.slot));
  return out;
}

function memberReadings(plan: RowPlan, at: RowPlacer, rate: Float64Array | null): Record<string, MemberReading> {
  const out: Record<string, MemberReading> = {};
  const { va, vb, tmp } = plan.scratch;
  for (const p of plan.members) {
    const a = at.at(p.a),
      b = at.at(p.b);
    const dx = a.x - b.x,
      dy = a.y - b.y,
      dz = a.z - b.z;
    const length = Math.sqrt(dx * dx + dy * dy + dz * dz);
    const reading: MemberReading = { length, lengthChange: clean(length - p.rideLength) };
    const kind = p.member.kind;
    if (rate && (kind === 'shock' || kind === 'spring')) {
      // d length / d travel = u · (vA − vB), with the point velocities from the pose sensitivity.
      pointVelocity(p.a, rate, plan.rot, va, 0, tmp);
      pointVelocity(p.b, rate, plan.rot, vb, 0, tmp);
      const mr = Math.abs((dx * (va[0] - vb[0]) + dy * (va[1] - vb[1]) + dz * (va[2] - vb[2])) / length);
      reading.motionRatio = clean(mr);
      if (kind === 'spring' && p.member.rate !== undefined) {
        // Wheel rate k_w = k_s · MR² (Barton & Fieldhouse, Automotive Chassis Engineering, §3.9).
        reading.wheelRate = clean(p.member.rate * mr * mr);
      }
    }
    out[p.member.id] = reading;
  }
  return out;
}

function drivelineAt(plan: RowPlan, at: RowPlacer): DrivelineReading | undefined {
  const d = plan.driveline;
  if (!d) return undefined;
  const r = drivelineReading(at.at(d.output), at.at(d.outputAxis), at.at(d.pinion), at.at(d.pinionAxis), d.rideLength);
  return {
    length: r.length,
    plunge: clean(r.plunge),
    outputAngle: clean(r.outputAngle),
    pinionAngle: clean(r.pinionAngle),
  };
}

/** A heave row from a solved row whose `rate` is d(state)/d(travel). */
export function heaveRowBuild(plan: RowPlan, solved: SolvedRow): HeaveRow {
  const { model } = plan;
  const at = new RowPlacer(plan, solved.state);
  const pose = cleanPose(poseFromState(solved.state, plan.primarySlot));
  const axle = model.axle;
  const wl = at.at(model.wheelLeft);

  const row: HeaveRow = {
    travel: solved.travel,
    pose,
    bodies: bodyPoses(model, solved.state),
    pinionAngleChange: axle ? clean(-pose.pitch) : null,
    lateralShift: axle ? pose.y : null,
    foreAftShift: axle ? pose.x : clean(wl.x - model.wheelLeft.ride.x),
    // Filled in by the layout readers (the solid-axle links first); null where none applies.
    instantCenter: null,
    antiSquat: null,
    rollCenterHeight: null,
    bind: clean(solved.bind),
    members: memberReadings(plan, at, solved.rate),
  };
  const dl = drivelineAt(plan, at);
  if (dl) row.driveline = dl;
  const place = (p: PointModel) => at.at(p);
  for (const layout of plan.layouts) if (layout.heave) Object.assign(row, layout.heave(place, solved));
  Object.assign(row, heaveGroundFields(plan.ground, row, wl, at.at(model.wheelRight), solved.state));
  return row;
}

/** A roll row from a solved row (travel 0, roll imposed). */
export function rollRowBuild(plan: RowPlan, solved: SolvedRow): RollRow {
  const { model } = plan;
  const at = new RowPlacer(plan, solved.state);
  const pose = cleanPose(poseFromState(solved.state, plan.primarySlot));
  const wl = at.at(model.wheelLeft),
    wr = at.at(model.wheelRight);
  const row: RollRow = {
    roll: solved.roll,
    pose,
    bodies: bodyPoses(model, solved.state),
    leftTravel: clean(wl.z - model.wheelLeft.ride.z),
    rightTravel: clean(wr.z - model.wheelRight.ride.z),
    rollSteer: model.axle && solved.roll !== 0 ? clean((100 * pose.yaw) / solved.roll) : null,
    bind: clean(solved.bind),
    members: memberReadings(plan, at, null),
  };
  const dl = drivelineAt(plan, at);
  if (dl) row.driveline = dl;
  const place = (p: PointModel) => at.at(p);
  for (const layout of plan.layouts) if (layout.roll) Object.assign(row, layout.roll(place, solved));
  const centres: Required<RollCentres> = { rollCenter: null, instantCenter: null };
  for (const layout of plan.layouts) if (layout.rollCentres) Object.assign(centres, layout.rollCentres(place, solved));
  Object.assign(row, rollGroundFields(plan.ground, centres, wl, wr, solved.state, solved.roll));
  return row;
}
