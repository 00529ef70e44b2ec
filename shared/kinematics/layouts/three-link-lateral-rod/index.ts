import { solidAxleLinksReader } from '../solid-axle-links/reader';
import type { LayoutModule } from '../types';
import { threeLinkLateralRod } from './starter';

export const threeLinkLateralRodLayout: LayoutModule = {
  layout: 'three-link-lateral-rod',
  starter: threeLinkLateralRod,
  reader: solidAxleLinksReader,
};
