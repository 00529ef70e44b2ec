/**
 * How the board and the build sheet show every layout type, keyed by layout so that a layout without one
 * is a type error. The name comes from the layout's starter (shared/kinematics/layouts), its
 * one source.
 */
import { starters } from '../kinematics/starters';
import { SOLID_AXLE, STEERED } from '../kinematics/metrics/registry/layouts';
import type { AxleEnd, Layout } from '../schema/sketch';
import type { SuspensionDescriptor } from './types';

const axle = { legend: 'axle', pivotsTitle: 'Axle pivots' };

function solidAxle(layout: Layout, moving = axle): SuspensionDescriptor {
  return {
    layout,
    label: starters[layout].label,
    overlay: null,
    crossView: 'rear',
    moving,
    antiSquatFrom: 'contact-patch',
  };
}

export const suspensions: Record<Layout, SuspensionDescriptor> = {
  'four-link-lateral-rod': solidAxle('four-link-lateral-rod'),
  'triangulated-four-link': solidAxle('triangulated-four-link'),
  'three-link-lateral-rod': solidAxle('three-link-lateral-rod'),
  'leaf-spring': { ...solidAxle('leaf-spring'), overlay: 'leaf-arm' },
  'trailing-arm': {
    layout: 'trailing-arm',
    label: starters['trailing-arm'].label,
    overlay: 'leaf-arm',
    crossView: 'rear',
    moving: { legend: 'arm', pivotsTitle: 'Arm pivots' },
    antiSquatFrom: 'wheel-centre',
  },
  'double-wishbone': {
    layout: 'double-wishbone',
    label: starters['double-wishbone'].label,
    overlay: 'wishbone',
    crossView: 'front',
    moving: { legend: 'arm / knuckle', pivotsTitle: 'Knuckle pivots' },
    antiSquatFrom: 'contact-patch',
  },
  'steered-front-axle': {
    ...solidAxle('steered-front-axle', { legend: 'axle / knuckle', pivotsTitle: 'Axle and knuckle pivots' }),
    crossView: 'front',
  },
};

/** The descriptor of a layout, or null for a name that is not one (a document from elsewhere). */
export function suspensionOf(layout: string | null | undefined): SuspensionDescriptor | null {
  return layout && Object.hasOwn(suspensions, layout) ? suspensions[layout as Layout] : null;
}

/** The layout's name as the UI shows it; an unknown name is shown as it is. */
export function layoutLabel(layout: string): string {
  return suspensionOf(layout)?.label ?? layout;
}

/** Every layout for a select, in the schema's order. */
export const layoutOptions: { value: Layout; label: string }[] = Object.values(suspensions).map((s) => ({
  value: s.layout,
  label: s.label,
}));

/**
 * The cross (y–z) view's name for an open sketch: the layout's, except that a solid axle the vehicle block
 * puts at the front (`vehicle.axle`) is seen in its front view. Rear while no sketch is open.
 */
export function crossViewOf(
  sketch: { layout: string; vehicle: { axle?: AxleEnd } } | null | undefined,
): SuspensionDescriptor['crossView'] {
  const d = suspensionOf(sketch?.layout);
  if (!d) return 'rear';
  if ((SOLID_AXLE as readonly string[]).includes(d.layout) && sketch?.vehicle.axle === 'front') return 'front';
  return d.crossView;
}

/**
 * Whether the layout carries its wheels on one solid axle whose end the sketch chooses (the board offers the front /
 * rear choice); a steered axle is always the front.
 */
export function hasSolidAxle(layout: string | null | undefined): boolean {
  return (
    (SOLID_AXLE as readonly string[]).includes(layout ?? '') && !(STEERED as readonly string[]).includes(layout ?? '')
  );
}
