import type { Layout, Sketch } from '../../schema/sketch';

/** One number a starter is built from, with its unit and the range the dialog allows. */
export interface StarterParam {
  key: string;
  label: string;
  unit: 'mm' | 'deg' | 'N/mm' | '%';
  default: number;
  min: number;
  max: number;
}

/** A ready layout to begin from: a few parameters in, a complete valid sketch out. */
export interface StarterSpec {
  layout: Layout;
  /** the layout's name as the UI shows it (its one source: the client's layout descriptors take it from here) */
  label: string;
  description: string;
  params: StarterParam[];
  /** Missing parameters take their defaults; values outside [min, max] are clamped. */
  build(p?: Partial<Record<string, number>>): Sketch;
}
