/** Groups of layouts, by the bodies their sweeps move (shared/schema/sketchVocabulary.ts names them). */
import { layouts, type Layout } from '../../../schema/sketchVocabulary';

export const ALL_LAYOUTS: readonly Layout[] = layouts;
/** Layouts whose wheels sit on one solid axle. */
export const SOLID_AXLE: readonly Layout[] = [
  'four-link-lateral-rod',
  'triangulated-four-link',
  'three-link-lateral-rod',
  'leaf-spring',
  'steered-front-axle',
];
/** Solid axles located by links (the leaf spring's axle is located by its springs). */
export const LINKED_AXLE: readonly Layout[] = [
  'four-link-lateral-rod',
  'triangulated-four-link',
  'three-link-lateral-rod',
  'steered-front-axle',
];
/**
 * Layouts whose wheels move on their own arms or knuckles. The contact patch's track change and the
 * camber to the ground are theirs alone: a solid axle carries both tyres on one rigid body, so the
 * track between its contact patches never changes (its sideways movement is the lateral shift) and
 * it stands square to the ground through its own contact points.
 */
export const INDEPENDENT: readonly Layout[] = ['trailing-arm', 'double-wishbone'];
export const WISHBONE: readonly Layout[] = ['double-wishbone'];
/** A solid front axle whose knuckles turn about kingpins on it, steered by a pitman arm and drag link. */
export const STEERED_AXLE: readonly Layout[] = ['steered-front-axle'];
/** Layouts that steer: their sketches may carry `sweep.steer` (steer/sweep.ts). */
export const STEERED: readonly Layout[] = ['double-wishbone', ...STEERED_AXLE];
/** Steered layouts whose steer sweep moves a rack (`sweep.steer.rack`); the others turn a pitman arm. */
export const RACK_STEERED: readonly Layout[] = ['double-wishbone'];
/** Layouts with a kingpin axis on each knuckle (inclination, caster, scrub radius, trail). */
export const KINGPIN: readonly Layout[] = [...WISHBONE, ...STEERED_AXLE];
