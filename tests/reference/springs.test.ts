/**
 * Wheel rate from motion ratio: k_w = k_s · MR² for small motions (Barton & Fieldhouse,
 * Automotive Chassis Engineering, Springer 2018, §3.9): 50 N/mm at MR 0.6 → 18 N/mm.
 * The rig's axle moves straight up at ride; a spring laid along a 3-4-5 triangle (0.8
 * across, 0.6 up) then has MR = 0.6 exactly, installation angle included.
 */
import { describe, expect, it } from 'vitest';
import { runSweep } from '../../shared/kinematics';
import { translatingAxle } from './rigs';

describe('wheel rate from motion ratio', () => {
  const r = runSweep(
    translatingAxle(
      { frame: [-100, 550, 400], axle: [-100, -550, 400] },
      {
        points: [
          { id: 'SP.a', body: 'axle', x: -200, y: 500, z: 300 },
          { id: 'SP.f', body: 'frame', x: -200, y: 900, z: 600 },
        ],
        members: [{ id: 'SP', kind: 'spring', a: 'SP.f', b: 'SP.a', rate: 50 }],
      },
    ),
  );

  it('50 N/mm at MR 0.6 → 18 N/mm', () => {
    expect(r.ride.members.SP.length).toBeCloseTo(500, 9);
    expect(r.ride.members.SP.motionRatio!).toBeCloseTo(0.6, 6);
    expect(r.ride.members.SP.wheelRate!).toBeCloseTo(18, 4);
  });

  it('motion ratio matches the slope of the spring length between rows', () => {
    const i = r.heave.findIndex((h) => h.travel === 0);
    const slope =
      (r.heave[i + 1].members.SP.length - r.heave[i - 1].members.SP.length) /
      (r.heave[i + 1].travel - r.heave[i - 1].travel);
    // Central difference over ±5 mm: error of order (5 mm)² × curvature, well under 1e-3 here.
    expect(Math.abs(slope)).toBeCloseTo(r.ride.members.SP.motionRatio!, 3);
  });
});
