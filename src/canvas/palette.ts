/**
 * Colours of the board's canvases, for the light and the dark page. Arcwright's own look:
 * workshop steel blue for the frame, signal orange for what moves, a green lateral rod.
 * Against the canvas's background (#f7f6f2 light, #161c22 dark) text reads at 4.5:1 or more and
 * pivots and members at 3:1 or more (WCAG 2.1 AA); tests/unit/board/canvas-palette-contrast.test.ts checks it.
 */

export interface CanvasPalette {
  gridMinor: string;
  gridMajor: string;
  gridLabel: string;
  ground: string;
  groundHatch: string;
  tyre: string;
  tyreFill: string;
  rail: string;
  railFill: string;
  framePivot: string;
  movingPivot: string;
  pivotRing: string;
  pivotLabel: string;
  farSideAlpha: number;
  link: string;
  lateralRod: string;
  tieRod: string;
  shackle: string;
  shock: string;
  shockStroke: string;
  shockOut: string;
  spring: string;
  hinge: string;
  driveline: string;
  selection: string;
  ghost: string;
  geometry: string;
  scaleBar: string;
  /** behind a label that sits over the drawing, so lines under it do not cross its letters */
  labelBackdrop: string;
}

export const LIGHT_PALETTE: CanvasPalette = {
  gridMinor: 'rgba(47, 93, 124, 0.09)',
  gridMajor: 'rgba(47, 93, 124, 0.22)',
  gridLabel: '#5f6e7a',
  ground: '#6f5f4a',
  groundHatch: 'rgba(111, 95, 74, 0.35)',
  tyre: '#3b4148',
  tyreFill: 'rgba(59, 65, 72, 0.05)',
  rail: 'rgba(47, 93, 124, 0.45)',
  railFill: 'rgba(47, 93, 124, 0.07)',
  framePivot: '#2f5d7c',
  movingPivot: '#cc6a14',
  pivotRing: '#ffffff',
  pivotLabel: '#40505c',
  farSideAlpha: 0.35,
  link: '#34495e',
  lateralRod: '#4f7a5e',
  tieRod: '#7d5ba6',
  shackle: '#8a5a3b',
  shock: '#5a6570',
  shockStroke: 'rgba(224, 122, 31, 0.35)',
  shockOut: '#c0392b',
  spring: '#3a87ad',
  hinge: '#5b6b78',
  driveline: '#707d89',
  selection: 'rgba(224, 122, 31, 0.45)',
  ghost: 'rgba(120, 134, 148, 0.85)',
  geometry: '#a0307a',
  scaleBar: '#2b3a45',
  labelBackdrop: 'rgba(247, 246, 242, 0.85)',
};

export const DARK_PALETTE: CanvasPalette = {
  ...LIGHT_PALETTE,
  gridMinor: 'rgba(160, 190, 215, 0.08)',
  gridMajor: 'rgba(160, 190, 215, 0.18)',
  gridLabel: '#8fa1b0',
  ground: '#b39f82',
  groundHatch: 'rgba(179, 159, 130, 0.3)',
  tyre: '#c9d1d8',
  tyreFill: 'rgba(201, 209, 216, 0.05)',
  rail: 'rgba(120, 170, 205, 0.5)',
  railFill: 'rgba(120, 170, 205, 0.08)',
  framePivot: '#5d95bb',
  movingPivot: '#e07a1f',
  pivotRing: '#12181e',
  pivotLabel: '#b8c6d1',
  link: '#c3d0db',
  lateralRod: '#7fb48f',
  tieRod: '#b497d8',
  shackle: '#c48e6a',
  shock: '#a9b4be',
  spring: '#6bb6dc',
  hinge: '#9aaab6',
  driveline: '#6d7c89',
  ghost: 'rgba(170, 184, 196, 0.8)',
  geometry: '#e06ab8',
  scaleBar: '#d5dee5',
  labelBackdrop: 'rgba(22, 28, 34, 0.85)',
};
