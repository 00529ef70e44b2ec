import type { LayoutModule } from '../types';
import { doubleWishboneReader } from './reader';
import { doubleWishbone } from './starter';

export const doubleWishboneLayout: LayoutModule = {
  layout: 'double-wishbone',
  starter: doubleWishbone,
  reader: doubleWishboneReader,
};
