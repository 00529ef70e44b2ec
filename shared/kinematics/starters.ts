/**
 * The starter of every layout (each lives in its layout's folder, layouts/<layout>/starter.ts),
 * in the order the starter dialog lists them. The same objects as layoutModules[layout].starter;
 * kept apart from the modules so that a page that only builds starters carries no sweep code.
 */
import type { Layout } from '../schema/sketch';
import { doubleWishbone } from './layouts/double-wishbone/starter';
import { fourLinkLateralRod } from './layouts/four-link-lateral-rod/starter';
import { leafSpring } from './layouts/leaf-spring/starter';
import { steeredFrontAxle } from './layouts/steered-front-axle/starter';
import type { StarterSpec } from './layouts/starterTypes';
import { threeLinkLateralRod } from './layouts/three-link-lateral-rod/starter';
import { trailingArm } from './layouts/trailing-arm/starter';
import { triangulatedFourLink } from './layouts/triangulated-four-link/starter';

export const starters: Record<Layout, StarterSpec> = {
  'four-link-lateral-rod': fourLinkLateralRod,
  'triangulated-four-link': triangulatedFourLink,
  'three-link-lateral-rod': threeLinkLateralRod,
  'double-wishbone': doubleWishbone,
  'trailing-arm': trailingArm,
  'leaf-spring': leafSpring,
  'steered-front-axle': steeredFrontAxle,
};

export type { StarterParam, StarterSpec } from './layouts/starterTypes';
