// @vitest-environment happy-dom
/** A leaf half is a member the canvas can pick: a listening line tagged with its id, eye to seat. */
import { beforeEach, describe, expect, it } from 'vitest';
import { createPinia, setActivePinia } from 'pinia';
import { memberLines } from '../../../src/canvas/members';
import { useCanvasPalette } from '../../../src/composables/useCanvasPalette';
import type { Sketch } from '../../../shared/schema/sketch';

type Member = Sketch['members'][number];

beforeEach(() => setActivePinia(createPinia()));

const half = { id: 'LFl', kind: 'leaf-half', a: 'LE.l', b: 'LS.l', seat: 'LS.l' } as unknown as Member;
const eye = { px: 10, py: 20 };
const seat = { px: 110, py: 40 };

describe('a leaf half on the canvas', () => {
  it('draws a clickable chord from its eye to its seat', () => {
    const palette = useCanvasPalette().value;
    const lines = memberLines(half, eye, seat, { palette, length: 100, selected: false, far: false, ghost: false });
    const hit = lines.filter((l) => l.listening !== false && (l as { memberId?: string }).memberId === 'LFl');
    expect(hit).toHaveLength(1);
    expect(hit[0]!.points).toEqual([10, 20, 110, 40]);
    expect(hit[0]!.hitStrokeWidth).toBeGreaterThan(hit[0]!.strokeWidth!);
  });

  it('adds the selection halo when selected, and no pick target as a ghost', () => {
    const palette = useCanvasPalette().value;
    const selected = memberLines(half, eye, seat, { palette, length: 100, selected: true, far: false, ghost: false });
    expect(selected.some((l) => l.stroke === palette.selection)).toBe(true);
    const ghost = memberLines(half, eye, seat, { palette, length: 100, selected: false, far: false, ghost: true });
    expect(ghost.every((l) => l.listening === false)).toBe(true);
  });
});
