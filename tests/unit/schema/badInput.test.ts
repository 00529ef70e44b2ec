import { describe, expect, it } from 'vitest';
import { checkSketch } from '../../../shared/schema/sketch';
import { badInputCases } from './badInputCases';

describe('checkSketch refuses the bad inputs, naming the field', () => {
  for (const c of badInputCases) {
    it(c.name, () => {
      const res = checkSketch(c.doc());
      expect(res.ok).toBe(false);
      expect(res.ok ? [] : res.problems).toContain(c.problem);
    });
  }
});
