import type { Layout } from '../../shared/schema/sketch';
import { startingTargets, type Targets } from '../../shared/display/targets';

/**
 * Demo sketches built from the starters, with invented vehicle names. `owner` is a demo
 * account's e-mail; `params` override the starter's defaults (mm, deg).
 */
export interface DemoSketch {
  owner: string;
  layout: Layout;
  name: string;
  params?: Record<string, number>;
  /** target bands the sketch carries (file units) */
  targets?: Targets;
}

export const demoSketches: DemoSketch[] = [
  { owner: 'maker@demo.test', layout: 'four-link-lateral-rod', name: 'Kettle Creek shop truck, rear four-link' },
  {
    owner: 'maker@demo.test',
    layout: 'triangulated-four-link',
    name: 'Gravel Hopper buggy, rear triangulated',
    params: { wheelbase: 2900, track: 1650, tireRadius: 430 },
  },
  { owner: 'maker@demo.test', layout: 'three-link-lateral-rod', name: 'Marsh Wren crawler, rear three-link' },
  {
    owner: 'maker@demo.test',
    layout: 'double-wishbone',
    name: 'Juniper Flats runabout, front double wishbone',
    params: { track: 1560, tireRadius: 360, wheelbase: 2750, cgHeight: 560, rackHalfLength: 330 },
  },
  {
    owner: 'maker@demo.test',
    layout: 'leaf-spring',
    name: 'Tallow Ridge hauler, rear leaf springs',
    params: { wheelbase: 3600, track: 1680, tireRadius: 410, springLength: 1500, springRate: 180, shockStagger: 140 },
  },
  {
    owner: 'maker@demo.test',
    layout: 'trailing-arm',
    name: 'Brindle Point coupe, rear semi-trailing arms',
    params: { track: 1500, tireRadius: 320, wheelbase: 2600, cgHeight: 520, sweepAngle: 20 },
  },
  {
    owner: 'maker@demo.test',
    layout: 'steered-front-axle',
    name: 'Marsh Wren crawler, steered front axle',
    params: { track: 1700, tireRadius: 445, wheelbase: 2850, ballHeight: 560, trackBarHeight: 450 },
  },
  {
    owner: 'instructor@demo.test',
    layout: 'four-link-lateral-rod',
    name: 'Chassis 210 starter: four-link with lateral rod',
    targets: startingTargets,
  },
  { owner: 'instructor@demo.test', layout: 'three-link-lateral-rod', name: 'Chassis 210 starter: three-link' },
  {
    owner: 'student@demo.test',
    layout: 'four-link-lateral-rod',
    name: 'Lab 2 variant: lower link angle 10°',
    params: { lowerAngle: 10 },
  },
];
