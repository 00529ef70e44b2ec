import { solidAxleLinksReader } from '../solid-axle-links/reader';
import type { LayoutModule } from '../types';
import { fourLinkLateralRod } from './starter';

export const fourLinkLateralRodLayout: LayoutModule = {
  layout: 'four-link-lateral-rod',
  starter: fourLinkLateralRod,
  reader: solidAxleLinksReader,
};
