/**
 * The board's drawn colours against the canvas's own background, in both themes: the words drawn on it (grid
 * numbers, pivot names, geometry labels, the scale bar) at 4.5:1 or more, the pivots and members at 3:1 or more
 * (WCAG 2.1 success criteria 1.4.3 and 1.4.11). The contrast ratio is axe-core's own (axe.commons.color), the
 * same arithmetic the browser tests' axe run applies to the page's text.
 */
import { describe, expect, it } from 'vitest';
import axe from 'axe-core';
import { DARK_PALETTE, LIGHT_PALETTE, type CanvasPalette } from '../../../src/canvas/palette';

/** The canvas's background in each theme: `.board-canvas` and `.body--dark .board-canvas` in BoardCanvas.vue. */
const BACKGROUND = { light: '#f7f6f2', dark: '#161c22' };

const TEXT: (keyof CanvasPalette)[] = ['gridLabel', 'pivotLabel', 'geometry', 'scaleBar'];
const GRAPHICS: (keyof CanvasPalette)[] = [
  'ground',
  'tyre',
  'framePivot',
  'movingPivot',
  'link',
  'lateralRod',
  'tieRod',
  'shackle',
  'shock',
  'shockOut',
  'spring',
  'hinge',
  'driveline',
];

/** The part of axe-core's colour helpers used here; its type declarations leave axe.commons.color out. */
interface AxeColour {
  parseString(text: string): void;
}
interface AxeColourHelpers {
  Color: new () => AxeColour;
  getContrast(background: AxeColour, foreground: AxeColour): number;
}

function contrast(foreground: string, background: string): number {
  const { Color, getContrast } = (axe.commons as unknown as { color: AxeColourHelpers }).color;
  const fg = new Color();
  fg.parseString(foreground);
  const bg = new Color();
  bg.parseString(background);
  return getContrast(bg, fg);
}

describe('the board canvas colours against its background', () => {
  it('uses axe-core’s contrast ratio: black on white is 21:1, a colour on itself 1:1 (the WCAG definition)', () => {
    expect(contrast('#000000', '#ffffff')).toBeCloseTo(21, 6);
    expect(contrast('#2f5d7c', '#2f5d7c')).toBeCloseTo(1, 6);
  });

  for (const [theme, palette] of [
    ['light', LIGHT_PALETTE],
    ['dark', DARK_PALETTE],
  ] as const) {
    it.each(TEXT)(`${theme}: the text colour %s reads at 4.5:1 or more`, (key) => {
      expect(contrast(palette[key] as string, BACKGROUND[theme])).toBeGreaterThanOrEqual(4.5);
    });
    it.each(GRAPHICS)(`${theme}: the drawing colour %s stands out at 3:1 or more`, (key) => {
      expect(contrast(palette[key] as string, BACKGROUND[theme])).toBeGreaterThanOrEqual(3);
    });
  }
});
