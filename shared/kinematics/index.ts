/**
 * The kinematics core of Arcwright: pure TypeScript, no framework. Everything the
 * client, the server and the command line use comes from here.
 */
export type {
  Pose,
  BodyPoses,
  HeaveRow,
  RollRow,
  SweepEvent,
  SweepEventKind,
  SweepLimits,
  SweepResult,
  SweepOptions,
  MemberReading,
  DrivelineReading,
  SidePoint,
} from './types';
export type {
  Sketch,
  SketchInput,
  Layout,
  BodyId,
  MovingBodyId,
  MemberKind,
  SketchPoint,
  SketchMember,
} from '../schema/sketch';
export type { StarterParam, StarterSpec } from './layouts/starterTypes';
export { starters } from './starters';
export { runSweep } from './run';
export { sweepSketch } from './sweep';
export { pointsAt } from './points';
export { poseApply } from './pose';
export type { Vec3 } from './vec';
export { heaveRowsCsv, sweepCsv } from './csv';
export { sweepEnvelope } from './envelope';
export type { EnvelopeCell, EnvelopeSettings } from './envelope';
