import { describe, expect, it } from 'vitest';
import { handInKeys, handInNumbers, layoutFamily } from '../../../shared/classes/handInNumbers';
import { metricEntry } from '../../../shared/kinematics/metrics/registry';
import { runSweep, starters } from '../../../shared/kinematics';
import { layouts, type Layout } from '../../../shared/schema/sketchVocabulary';
import { checkSketch } from '../../../shared/schema/sketch';

function starterDoc(layout: Layout) {
  const checked = checkSketch({ ...starters[layout]!.build(), name: `Hand-in test, ${layout}` });
  if (!checked.ok) throw new Error(checked.problems.join('; '));
  return checked.sketch;
}

describe('the key numbers of a hand-in', () => {
  it('are chosen per family: four for a solid axle, camber and toe change for an independent layout', () => {
    const named = (family: keyof typeof handInKeys) =>
      handInKeys[family].map((k) => `${metricEntry(k.metric).label} @ ${k.at}`);
    expect(named('solid-axle')).toEqual([
      'Anti-squat @ ride',
      'Pinion angle change @ bump',
      'Lateral shift @ bump',
      'Articulation @ articulation',
    ]);
    expect(named('independent')).toEqual(['Camber change @ bump', 'Toe change (bump steer) @ bump']);
  });

  it('cover every layout, each in one family', () => {
    const families = Object.fromEntries(layouts.map((l) => [l, layoutFamily(l)]));
    expect(families).toEqual({
      'four-link-lateral-rod': 'solid-axle',
      'triangulated-four-link': 'solid-axle',
      'three-link-lateral-rod': 'solid-axle',
      'leaf-spring': 'solid-axle',
      'steered-front-axle': 'solid-axle',
      'trailing-arm': 'independent',
      'double-wishbone': 'independent',
    });
  });

  it('are numbers in the file unit for each starter, and no number where the quantity means nothing', () => {
    for (const layout of layouts) {
      if (!starters[layout]) continue;
      const doc = starterDoc(layout);
      const { keyNumbers } = handInNumbers(doc, runSweep(doc), {});
      const byKey = Object.fromEntries(keyNumbers.map((k) => [k.key, k]));
      if (layoutFamily(layout) === 'independent') {
        expect(byKey.camberChange.unit, layout).toBe('°');
        expect(Number.isFinite(byKey.camberChange.value), layout).toBe(true);
        expect(Number.isFinite(byKey.toeChange.value), layout).toBe(true);
        continue;
      }
      expect(byKey.lateralShift.unit).toBe('mm');
      expect(byKey.antiSquat.unit).toBe('%');
      expect(Number.isFinite(byKey.pinionAngleChange.value), layout).toBe(true);
      // Articulation is the smaller roll reached each way: never negative (the registry's sign words).
      expect(byKey.articulation.value!, layout).toBeGreaterThanOrEqual(0);
      // A steered axle sits at the front, where anti-squat means nothing (its rows give anti-lift instead).
      if (layout === 'steered-front-axle') expect(byKey.antiSquat.value).toBeNull();
      else expect(Number.isFinite(byKey.antiSquat.value), layout).toBe(true);
    }
  });

  it('count a band no design can meet as one missed target and one more flag', () => {
    const doc = starterDoc('four-link-lateral-rod');
    const result = runSweep(doc);
    const free = handInNumbers(doc, result, {});
    expect(free.missedTargetCount).toBe(0);
    // Anti-squat above 10 000 % cannot be reached by any linkage swept here.
    const missed = handInNumbers(doc, result, { antiSquat: { min: 10_000 } });
    expect(missed.missedTargetCount).toBe(1);
    expect(missed.flagCount).toBe(free.flagCount + 1);
    // A band everything meets adds nothing.
    const met = handInNumbers(doc, result, { pinionAngleChange: { min: -90, max: 90 } });
    expect(met).toEqual({ ...free });
  });
});
