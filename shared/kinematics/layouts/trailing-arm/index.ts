import type { LayoutModule } from '../types';
import { trailingArmReader } from './reader';
import { trailingArm } from './starter';

export const trailingArmLayout: LayoutModule = {
  layout: 'trailing-arm',
  starter: trailingArm,
  reader: trailingArmReader,
};
