import type { LayoutModule } from '../types';
import { steeredFrontAxleReader } from './reader';
import { steeredFrontAxle } from './starter';

export const steeredFrontAxleLayout: LayoutModule = {
  layout: 'steered-front-axle',
  starter: steeredFrontAxle,
  reader: steeredFrontAxleReader,
};
