import { describe, expect, it } from 'vitest';
import { poseApply, rotationSetCreate, rotationSetFill } from '../../../shared/kinematics/pose';
import { degToRad } from '../../../shared/units';

describe('pose maths', () => {
  it('follows ISO 8855 signs: roll lifts the left side, pitch drops the nose, yaw turns the nose left', () => {
    const ref = { x: 0, y: 0, z: 0 };
    const still = { x: 0, y: 0, z: 0, roll: 0, pitch: 0, yaw: 0 };
    expect(poseApply({ ...still, roll: 10 }, ref, { x: 0, y: 1000, z: 0 }).z).toBeGreaterThan(0);
    expect(poseApply({ ...still, pitch: 10 }, ref, { x: 1000, y: 0, z: 0 }).z).toBeLessThan(0);
    expect(poseApply({ ...still, yaw: 10 }, ref, { x: 1000, y: 0, z: 0 }).y).toBeGreaterThan(0);
  });

  it('rotates about the reference point, then translates', () => {
    const ref = { x: 100, y: 200, z: 300 };
    const p = poseApply({ x: 1, y: 2, z: 3, roll: 90, pitch: 0, yaw: 0 }, ref, { x: 100, y: 300, z: 300 });
    expect(p.x).toBeCloseTo(101, 9);
    expect(p.y).toBeCloseTo(202, 9);
    expect(p.z).toBeCloseTo(403, 9);
  });

  it('composes R = Rz(yaw)·Ry(pitch)·Rx(roll)', () => {
    const [r, p, y] = [degToRad(7), degToRad(-4), degToRad(11)];
    const rs = rotationSetCreate();
    rotationSetFill(rs, r, p, y);
    const Rx = [1, 0, 0, 0, Math.cos(r), -Math.sin(r), 0, Math.sin(r), Math.cos(r)];
    const Ry = [Math.cos(p), 0, Math.sin(p), 0, 1, 0, -Math.sin(p), 0, Math.cos(p)];
    const Rz = [Math.cos(y), -Math.sin(y), 0, Math.sin(y), Math.cos(y), 0, 0, 0, 1];
    const mul = (a: number[], b: number[]) =>
      Array.from({ length: 9 }, (_, k) => {
        const i = Math.floor(k / 3),
          j = k % 3;
        return a[i * 3] * b[j] + a[i * 3 + 1] * b[3 + j] + a[i * 3 + 2] * b[6 + j];
      });
    const R = mul(Rz, mul(Ry, Rx));
    R.forEach((v, k) => expect(rs[k]).toBeCloseTo(v, 12));
  });

  it('has derivative matrices that match central differences', () => {
    const angles = [0.3, -0.2, 0.5];
    const h = 1e-6;
    const rs = rotationSetCreate();
    rotationSetFill(rs, angles[0], angles[1], angles[2]);
    for (let k = 0; k < 3; k++) {
      const plus = rotationSetCreate(),
        minus = rotationSetCreate();
      const a1 = [...angles],
        a2 = [...angles];
      a1[k] += h;
      a2[k] -= h;
      rotationSetFill(plus, a1[0], a1[1], a1[2]);
      rotationSetFill(minus, a2[0], a2[1], a2[2]);
      for (let e = 0; e < 9; e++) expect(rs[9 * (k + 1) + e]).toBeCloseTo((plus[e] - minus[e]) / (2 * h), 7);
    }
  });
});
