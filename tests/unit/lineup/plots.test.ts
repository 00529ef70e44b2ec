import { describe, expect, it } from 'vitest';
import { runSweep, starters } from '../../../shared/kinematics';
import { lineupPlots, VARIANT_COLORS } from '../../../src/lineup/plots';
import { buildPlots } from '../../../src/sweep/plots';
import { parseLineupIds } from '../../../src/stores/lineup/ids';

const fourLink = () => starters['four-link-lateral-rod']!.build();

describe('the line-up plots', () => {
  it('overlay one curve per variant, each the very curve its own board plots, in the variant colour', () => {
    const a = fourLink();
    const b = fourLink();
    for (const p of b.points) if (p.id.startsWith('UL.f')) p.z += 60;
    const variants = [a, b].map((document, i) => ({ name: `variant ${i + 1}`, document, result: runSweep(document) }));
    const plots = lineupPlots(variants, 'mm');
    const antiSquat = plots.find((p) => p.key === 'antisquat')!;
    expect(antiSquat.series.map((s) => s.label)).toEqual(['variant 1', 'variant 2']);
    expect(antiSquat.series.map((s) => s.color)).toEqual(VARIANT_COLORS.slice(0, 2));
    variants.forEach((v, i) => {
      const own = buildPlots(v.result, { members: v.document.members, hasAxle: true }, {}, [], 'mm').find(
        (p) => p.key === 'antisquat',
      )!;
      expect(antiSquat.series[i].points).toEqual(own.series[0].points);
    });
    // Raising the upper links' frame ends changes the anti-squat: the two curves differ.
    expect(antiSquat.series[0].points[0].y).not.toBeCloseTo(antiSquat.series[1].points[0].y!, 3);
    // Stroke limits belong to one sketch: no shock plot, and no dashed limit anywhere.
    expect(plots.some((p) => p.key === 'shocks')).toBe(false);
    expect(plots.every((p) => p.series.every((s) => !s.dash))).toBe(true);
  });

  it('leave out a variant that could not be swept, keeping the others', () => {
    const a = fourLink();
    const plots = lineupPlots(
      [
        { name: 'ok', document: a, result: runSweep(a) },
        { name: 'broken', document: a, result: null },
      ],
      'mm',
    );
    expect(plots.find((p) => p.key === 'pinion')!.series.map((s) => s.label)).toEqual(['ok']);
  });

  it('leave out a variant the user hides, the others keeping their colours', () => {
    const a = fourLink();
    const result = runSweep(a);
    const plots = lineupPlots(
      [
        { name: 'first', document: a, result, hidden: true },
        { name: 'second', document: a, result },
      ],
      'mm',
    );
    const pinion = plots.find((p) => p.key === 'pinion')!;
    expect(pinion.series.map((s) => [s.label, s.color])).toEqual([['second', VARIANT_COLORS[1]]]);
  });
});

describe('a line-up address', () => {
  it('takes two to four distinct sketch ids and names anything else', () => {
    expect(parseLineupIds('3,7')).toEqual({ ok: true, ids: [3, 7] });
    expect(parseLineupIds('3, 7, 7, 12')).toEqual({ ok: true, ids: [3, 7, 12] });
    expect(parseLineupIds('3')).toMatchObject({ ok: false, error: expect.stringContaining('2 to 4') });
    expect(parseLineupIds('1,2,3,4,5')).toMatchObject({ ok: false });
    expect(parseLineupIds('3,x')).toMatchObject({ ok: false, error: expect.stringContaining('not a sketch') });
    expect(parseLineupIds(undefined)).toMatchObject({ ok: false });
  });
});
