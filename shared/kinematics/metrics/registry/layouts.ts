/** Groups of layouts, by the bodies their sweeps move (shared/schema/sketchVocabulary.ts names them). */
import { layouts, type Layout } from '../../../schema/sketchVocabulary';

export const ALL_LAYOUTS: readonly Layout[] = layouts;
/** Layouts whose wheels sit on one solid axle. */
export const SOLID_AXLE: readonly Layout[] = [
  'four-link-lateral-rod',
  'triangulated-four-link',
  'three-link-lateral-rod',
  'leaf-spring',
];
/** Layouts whose wheels move on their own arms or knuckles. */
export const INDEPENDENT: readonly Layout[] = ['trailing-arm', 'double-wishbone'];
export const WISHBONE: readonly Layout[] = ['double-wishbone'];
