import type { LayoutModule } from '../types';
import { leafSpringReader } from './reader';
import { leafSpring } from './starter';

export const leafSpringLayout: LayoutModule = { layout: 'leaf-spring', starter: leafSpring, reader: leafSpringReader };
