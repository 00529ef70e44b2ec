import type { Layout } from '../../schema/sketch';
import { doubleWishbone } from './doubleWishbone';
import { fourLinkLateralRod } from './fourLinkLateralRod';
import { leafSpring } from './leafSpring';
import { threeLinkLateralRod } from './threeLinkLateralRod';
import { trailingArm } from './trailingArm';
import { triangulatedFourLink } from './triangulatedFourLink';
import type { StarterSpec } from './types';

/** Starters by layout; only the layouts that exist so far are present. */
export const starters: Partial<Record<Layout, StarterSpec>> = {
  'four-link-lateral-rod': fourLinkLateralRod,
  'triangulated-four-link': triangulatedFourLink,
  'three-link-lateral-rod': threeLinkLateralRod,
  'double-wishbone': doubleWishbone,
  'trailing-arm': trailingArm,
  'leaf-spring': leafSpring,
};

export type { StarterParam, StarterSpec } from './types';
