/**
 * Where each screen shows which metrics, in order. A screen walks its view and takes labels,
 * units and readers from the registry; it holds no list of its own. Items starting with `*`
 * stand for the readings a screen builds itself around the metrics (the cursor position,
 * per-member readings, the leaf-spring and load sections, the shock plot).
 */
import type { MetricSweep } from './types';

/** A metric of one sweep, by key (the sweep's own key names are unique, not across sweeps). */
export interface MetricRef {
  sweep: MetricSweep;
  key: string;
}

const heave = (key: string): MetricRef => ({ sweep: 'heave', key });
const roll = (key: string): MetricRef => ({ sweep: 'roll', key });
const limits = (key: string): MetricRef => ({ sweep: 'limits', key });
const steer = (key: string): MetricRef => ({ sweep: 'steer', key });

export type ViewItem<M extends string> = MetricRef | M;

const DRIVELINE = ['driveline.outputAngle', 'driveline.pinionAngle', 'driveline.plunge', 'driveline.length'];

/** The readout of a heave row: the metrics first, then the sections built around them. */
export const readoutHeaveView: ViewItem<'*position' | '*leaf' | '*loads' | '*members'>[] = [
  '*position',
  ...[
    'pinionAngleChange',
    'lateralShift',
    'foreAftShift',
    'antiSquat',
    'antiLiftBraking',
    'antiLift',
    'instantCenter.x',
    'instantCenterAboveGround',
    'rollCenterAboveGround',
    'bind',
    'camberChange',
    'toeChange',
    'wheelSteer.left',
    'wheelSteer.right',
    'contactTrackChange',
    'trackChange',
    'casterChange',
    'antiDive',
    'kingpin.inclination',
    'kingpin.caster',
    'kingpin.scrubRadius',
    'kingpin.trail',
  ].map(heave),
  '*leaf',
  '*loads',
  '*members',
  ...DRIVELINE.map(heave),
];

/** The readout of a roll row. */
export const readoutRollView: ViewItem<'*position' | '*leaf' | '*loads' | '*members'>[] = [
  '*position',
  ...[
    'leftTravel',
    'rightTravel',
    'rollSteer',
    'wheelSteer.left',
    'wheelSteer.right',
    'bind',
    'contactTrackChange.left',
    'contactTrackChange.right',
    'trackChange.left',
    'trackChange.right',
    'groundCamber.left',
    'groundCamber.right',
    'rollCenterAboveGround',
    'instantCenterAboveGround',
  ].map(roll),
  '*leaf',
  '*loads',
  '*members',
  ...DRIVELINE.map(roll),
];

/** The readout's leaf-spring section starts with this metric (the wind-up lines follow). */
export const readoutLeafMetric = heave('shackleAngle');

/** Travel plots for a layout with a solid axle, in board order: travel quantities, the shocks, then roll. */
export const plotsAxleView: ViewItem<'*shocks'>[] = [
  ...[
    'pinionAngleChange',
    'lateralShift',
    'antiSquat',
    'antiLiftBraking',
    'antiLift',
    'foreAftShift',
    'rollCenterAboveGround',
    'instantCenterAboveGround',
    'camberChange',
    'toeChange',
    'wheelSteer.left',
    'wheelSteer.right',
    'contactTrackChange',
    'trackChange',
    'antiDive',
    'casterChange',
  ].map(heave),
  '*shocks',
  ...['bind', 'rollSteer', 'wheelSteer.left', 'wheelSteer.right'].map(roll),
  heave('rollSteerInTravel'),
];

/** Travel plots for independent layouts: the wheel's own attitude first. */
export const plotsIndependentView: ViewItem<'*shocks'>[] = [
  ...[
    'camberChange',
    'toeChange',
    'contactTrackChange',
    'trackChange',
    'antiSquat',
    'antiDive',
    'rollCenterAboveGround',
    'instantCenterAboveGround',
    'foreAftShift',
  ].map(heave),
  '*shocks',
  ...['bind', 'rollSteer'].map(roll),
];

/**
 * The readout of a steer row (a layout that steers, at the steer slider): the rack or the pitman arm, both wheels, Ackermann and
 * the turning radius there, then the worst bump steer of the map out to lock.
 */
export const readoutSteerView: MetricRef[] = [
  ...['rack', 'pitman', 'leftSteer', 'rightSteer', 'ackermann', 'turningRadius'].map(steer),
  { sweep: 'bumpSteer', key: 'worst' },
];

/**
 * Steer plots against rack travel, then `*bumpSteerMap`: toe change against travel, one curve per rack position
 * of `steer.bumpSteer.curves`, each wheel.
 */
export const plotsSteerView: ViewItem<'*bumpSteerMap'>[] = [
  ...['leftSteer', 'rightSteer', 'ackermann', 'turningRadius'].map(steer),
  '*bumpSteerMap',
];

/** The targets table, in order (the schema's target metrics, which a test holds equal). */
export const targetsView: MetricRef[] = [
  heave('antiSquat'),
  heave('pinionAngleChange'),
  heave('lateralShift'),
  heave('foreAftShift'),
  heave('rollCenterHeight'),
  roll('bind'),
  roll('rollSteer'),
  limits('articulation'),
];

/**
 * The heave rows' CSV columns, in order. `*members` is each member's readings, `*linkLoads`
 * each link's load; a metric the sweep does not give for the sketch (judged on the ride row)
 * has no column.
 */
export const csvView: ViewItem<'*members' | '*linkLoads'>[] = [
  ...[
    'travel',
    'pose.x',
    'pose.y',
    'pose.z',
    'pose.roll',
    'pose.pitch',
    'pose.yaw',
    'pinionAngleChange',
    'lateralShift',
    'foreAftShift',
    'instantCenter.x',
    'instantCenter.z',
    'instantCenterAboveGround',
    'antiSquat',
    'rollCenterHeight',
    'rollCenterAboveGround',
    'bind',
  ].map(heave),
  '*members',
  ...[
    'camberChange',
    'toeChange',
    'wheelSteer.left',
    'wheelSteer.right',
    'contactTrackChange',
    'trackChange',
    'casterChange',
    'frontViewInstantCenter.y',
    'frontViewInstantCenter.z',
    'antiDive',
    'antiLift',
    'antiLiftBraking',
    'kingpin.inclination',
    'kingpin.caster',
    'kingpin.scrubRadius',
    'kingpin.trail',
    'driveline.length',
    'driveline.plunge',
    'driveline.outputAngle',
    'driveline.pinionAngle',
    'shackleAngle',
    'halfShafts.left.length',
    'halfShafts.left.plunge',
    'halfShafts.left.innerAngle',
    'halfShafts.left.outerAngle',
    'halfShafts.right.length',
    'halfShafts.right.plunge',
    'halfShafts.right.innerAngle',
    'halfShafts.right.outerAngle',
  ].map(heave),
  '*linkLoads',
];

/**
 * The build sheet's geometry lines: `reached` is the sweep's limit, `ride` the ride row's value,
 * `range` the smallest and largest over the travel; `point` pairs a point's coordinates. A sheet
 * shows only the lines whose metrics the sketch's layout gives (each entry's `layouts`), so a
 * solid axle's sheet has no camber and a double wishbone's no pinion angle.
 */
export type SheetItem =
  | { at: 'reached'; metric: MetricRef }
  | { at: 'ride'; metric: MetricRef }
  | { at: 'range'; metric: MetricRef }
  | { at: 'ride-point'; metrics: [MetricRef, MetricRef] };

export const sheetView: SheetItem[] = [
  { at: 'reached', metric: heave('travel') },
  { at: 'reached', metric: limits('articulation') },
  { at: 'ride', metric: heave('antiSquat') },
  { at: 'ride', metric: heave('antiLiftBraking') },
  { at: 'ride', metric: heave('antiDive') },
  { at: 'ride', metric: heave('antiLift') },
  { at: 'ride-point', metrics: [heave('instantCenter.x'), heave('instantCenter.z')] },
  { at: 'ride', metric: heave('rollCenterAboveGround') },
  { at: 'range', metric: heave('pinionAngleChange') },
  { at: 'range', metric: heave('lateralShift') },
  { at: 'range', metric: heave('camberChange') },
  { at: 'range', metric: heave('toeChange') },
  { at: 'ride', metric: heave('kingpin.caster') },
  { at: 'range', metric: heave('casterChange') },
  { at: 'ride', metric: heave('kingpin.inclination') },
  { at: 'ride', metric: heave('kingpin.scrubRadius') },
  { at: 'ride', metric: heave('kingpin.trail') },
  { at: 'range', metric: heave('contactTrackChange') },
  { at: 'range', metric: heave('trackChange') },
];

/**
 * The line-up's key numbers, one column per variant: a `travel` item at ride, at full bump and at full
 * droop (a change from ride, `signed` in the registry, only at the two ends: it is 0 at ride by
 * definition), a `whole` item once for the sweep; `*flags` is each variant's flags.
 */
export type LineupItem = { at: 'travel'; metric: MetricRef } | { at: 'whole'; metric: MetricRef } | '*flags';

export const lineupView: LineupItem[] = [
  ...[
    'travel',
    'antiSquat',
    'antiLiftBraking',
    'antiDive',
    'antiLift',
    'instantCenterAboveGround',
    'rollCenterAboveGround',
    'pinionAngleChange',
    'lateralShift',
    'camberChange',
    'toeChange',
    'trackChange',
  ].map((key) => ({ at: 'travel' as const, metric: heave(key) })),
  { at: 'whole', metric: limits('articulation') },
  '*flags',
];
