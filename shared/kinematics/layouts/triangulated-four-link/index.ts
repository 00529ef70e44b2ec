import { solidAxleLinksReader } from '../solid-axle-links/reader';
import type { LayoutModule } from '../types';
import { triangulatedFourLink } from './starter';

export const triangulatedFourLinkLayout: LayoutModule = {
  layout: 'triangulated-four-link',
  starter: triangulatedFourLink,
  reader: solidAxleLinksReader,
};
