/**
 * Lateral rod (track bar) arc: rod length L, axle end h0 above the frame end,
 * Δy(z) = √(L² − h0²) − √(L² − (h0+z)²) (plain arc geometry; table in docs/references.md).
 * Roll centre: where the rod's rear-view line crosses the vehicle centreline (course notes on
 * rigid-axle roll centres; Heisler, Advanced Vehicle Technology, fig. 10.28).
 * The rig translates the axle on four 20 m parallel links, so the rod alone sets y; the
 * axle's fore-aft arc (≤ 0.25 mm at 100 mm) changes Δy by under 1e-4 mm.
 */
import { describe, expect, it } from 'vitest';
import { runSweep } from '../../shared/kinematics';
import { translatingAxle } from './rigs';

/** Table values are given to four decimals (±5e-5) and the rig adds < 1e-4 mm. */
const TABLE_TOL_MM = 2e-4;

const arc = (L: number, h0: number, z: number) => Math.sqrt(L * L - h0 * h0) - Math.sqrt(L * L - (h0 + z) ** 2);

describe('lateral rod arc', () => {
  it('level rod, L = 1000: z = 25/50/75/100 → 0.3125/1.2508/2.8165/5.0126 mm (references.md)', () => {
    const r = runSweep(
      translatingAxle(
        { frame: [-100, 500, 400], axle: [-100, -500, 400] },
        {},
        { sweep: { droop: -100, bump: 100, step: 25, roll: 0, rollStep: 1 } },
      ),
    );
    const table: [number, number][] = [
      [25, 0.3125],
      [50, 1.2508],
      [75, 2.8165],
      [100, 5.0126],
    ];
    for (const [z, dy] of table) {
      // The axle end swings towards the frame end (+y here) both ways from level.
      for (const t of [z, -z]) {
        const row = r.heave.find((h) => h.travel === t)!;
        expect(Math.abs(row.lateralShift! - dy)).toBeLessThan(TABLE_TOL_MM);
      }
    }
  });

  it('tilted rod follows the closed form through the travel', () => {
    const L = Math.hypot(1100, 120);
    const r = runSweep(
      translatingAxle(
        { frame: [-100, 550, 480], axle: [-100, -550, 360] },
        {},
        { sweep: { droop: -150, bump: 150, step: 10, roll: 0, rollStep: 1 } },
      ),
    );
    for (const row of r.heave) {
      expect(Math.abs(row.lateralShift! - arc(L, -120, row.travel))).toBeLessThan(1e-3);
    }
  });

  it('roll centre: rod (y 600, z 450) to (y −600, z 350) crosses the centreline at 400', () => {
    const r = runSweep(translatingAxle({ frame: [-100, 600, 450], axle: [-100, -600, 350] }));
    expect(r.ride.rollCenterHeight!).toBeCloseTo(400, 9);
  });
});
