/**
 * Every layout type of the sketch format with its module (starter and readings), keyed by
 * layout so that a layout without a module is a type error. rows.ts reads through the ordered
 * reader list (readers.ts), which holds each module's reader.
 */
import type { Layout } from '../../schema/sketch';
import { doubleWishboneLayout } from './double-wishbone';
import { fourLinkLateralRodLayout } from './four-link-lateral-rod';
import { leafSpringLayout } from './leaf-spring';
import { steeredFrontAxleLayout } from './steered-front-axle';
import { threeLinkLateralRodLayout } from './three-link-lateral-rod';
import { trailingArmLayout } from './trailing-arm';
import { triangulatedFourLinkLayout } from './triangulated-four-link';
import type { LayoutModule } from './types';

export const layoutModules: Record<Layout, LayoutModule> = {
  'four-link-lateral-rod': fourLinkLateralRodLayout,
  'triangulated-four-link': triangulatedFourLinkLayout,
  'three-link-lateral-rod': threeLinkLateralRodLayout,
  'leaf-spring': leafSpringLayout,
  'trailing-arm': trailingArmLayout,
  'double-wishbone': doubleWishboneLayout,
  'steered-front-axle': steeredFrontAxleLayout,
};

export type { LayoutModule, LayoutReader, LayoutRowPlan, PlacePoint } from './types';
