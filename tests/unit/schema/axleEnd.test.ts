/**
 * `vehicle.axle`: which end of the vehicle a solid axle is. Optional, so every earlier file stays valid;
 * anything but "front" or "rear" is refused with the field named.
 */
import { describe, expect, it } from 'vitest';
import { checkSketch } from '../../../shared/schema/sketch';
import { exampleSketch } from '../kinematics/helpers';

function withAxle(axle: unknown): unknown {
  const doc = structuredClone(exampleSketch());
  return { ...doc, vehicle: { ...doc.vehicle, axle } };
}

describe('vehicle.axle', () => {
  it('is optional: a file without it is valid and stays without it', () => {
    const doc = exampleSketch();
    expect('axle' in doc.vehicle).toBe(false);
    const r = checkSketch(doc);
    expect(r.ok).toBe(true);
    if (r.ok) expect('axle' in r.sketch.vehicle).toBe(false);
  });

  it.each(['front', 'rear'])('accepts "%s"', (axle) => {
    const r = checkSketch(withAxle(axle));
    expect(r.ok ? [] : r.problems).toEqual([]);
  });

  it.each([['middle'], ['Front'], [1], [null]])('refuses %j, naming the field', (axle) => {
    const r = checkSketch(withAxle(axle));
    expect(r.ok).toBe(false);
    const problems = r.ok ? [] : r.problems;
    expect(problems).toEqual(["vehicle.axle: expected one of 'front', 'rear'"]);
  });
});
