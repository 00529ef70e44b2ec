import { describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { heaveRowsCsv, runSweep, starters, sweepCsv } from '../../../shared/kinematics';

const rowsOf = (text: string) => Papa.parse<string[]>(text.trimEnd()).data;

/**
 * Inch-system factors from their definitions (1959 international yard and pound, standard gravity):
 * 1 in = 25.4 mm, 1 lbf = 4.4482216152605 N.
 */
const MM_PER_IN = 25.4;
const N_PER_LBF = 4.4482216152605;
const FACTOR_FROM_FILE: Record<string, number> = {
  mm: 1,
  '%': 1,
  '°': 1,
  'N/mm': 1,
  N: 1,
  in: 1 / MM_PER_IN,
  'lbf/in': MM_PER_IN / N_PER_LBF,
  lbf: 1 / N_PER_LBF,
};

describe('the sweep CSV with units', () => {
  for (const layout of ['four-link-lateral-rod', 'double-wishbone', 'leaf-spring'] as const) {
    it(`${layout}: has the command line's columns and rows, each header naming its unit, numbers converted`, () => {
      const result = runSweep(starters[layout]!.build(), { heaveOnly: true });
      const plain = rowsOf(heaveRowsCsv(result));
      for (const units of ['mm', 'in'] as const) {
        const rows = rowsOf(sweepCsv(result, units));
        expect(rows.length).toBe(plain.length);
        expect(rows[0][0]).toBe(`travel (${units})`);
        rows[0].forEach((name, col) => {
          const m = / \(([^)]+)\)$/.exec(name);
          // A plain ratio (a motion ratio) has no unit.
          if (!m) {
            expect(name).toMatch(/\.motionRatio$/);
            expect(name).toBe(plain[0][col]);
            return;
          }
          expect(name.slice(0, m.index)).toBe(plain[0][col]);
          const factor = FACTOR_FROM_FILE[m[1]];
          expect(factor, `unit of ${name}`).toBeDefined();
          for (let r = 1; r < rows.length; r++) {
            if (plain[r][col] === '') expect(rows[r][col]).toBe('');
            else expect(Number(rows[r][col])).toBeCloseTo(Number(plain[r][col]) * factor, 9);
          }
        });
      }
    });
  }
});
