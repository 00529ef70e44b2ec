/**
 * The layout readers in the order rows.ts applies them to every row. Order matters: a later
 * reader's fields replace an earlier one's (the trailing-arm and double-wishbone constructions
 * replace the solid-axle links' instant centre and roll centre), and the fields a row gains
 * keep this order. Half-shafts are not a layout but read the same way, between the trailing
 * arms and the leaf springs. Kept apart from the starters (index.ts) so that the sweep (and the
 * board's sweep worker) carries no validator.
 */
import { halfShaftReader } from '../halfShaft';
import { doubleWishboneReader } from './double-wishbone/reader';
import { leafSpringReader } from './leaf-spring/reader';
import { solidAxleLinksReader } from './solid-axle-links/reader';
import { steeredFrontAxleReader } from './steered-front-axle/reader';
import { trailingArmReader } from './trailing-arm/reader';
import type { LayoutReader } from './types';

export const layoutReaders: readonly LayoutReader[] = [
  solidAxleLinksReader,
  trailingArmReader,
  halfShaftReader,
  leafSpringReader,
  doubleWishboneReader,
  steeredFrontAxleReader,
];
