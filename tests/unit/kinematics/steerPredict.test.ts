/**
 * The steer march's predictor (steer/predict.ts) on paths written in closed form in this file: a cubic Hermite
 * through two points with their slopes reproduces any cubic exactly (the interpolation error term has the fourth
 * derivative; any numerical analysis text, e.g. Burden & Faires, "Numerical Analysis", §3.4; from memory,
 * unverified), so a path whose pose and input are cubics of one coordinate is predicted exactly, even next to a
 * turning point of the input where no polynomial in the input fits.
 */
import { describe, expect, it } from 'vitest';
import { predictPose, type PredictorRow } from '../../../shared/kinematics/steer/predict';

/** Free coordinates: body 0's x and y (mm) and yaw (rad, index 5). */
const FREE = Int32Array.of(0, 1, 5);

/** A row of a path given as functions of a parameter s: each coordinate and its derivative in s, and the input's. */
interface Path {
  input: (s: number) => number;
  inputSlope: (s: number) => number;
  coords: Record<number, [(s: number) => number, (s: number) => number]>;
}

function rowAt(path: Path, s: number): PredictorRow {
  const state = new Float64Array(6);
  const rate = new Float64Array(6);
  for (const c of FREE) {
    const [f, df] = path.coords[c];
    state[c] = f(s);
    rate[c] = df(s) / path.inputSlope(s);
  }
  return { at: path.input(s), state, rate };
}

describe('the steer predictor', () => {
  // The input stops growing at s = 3 (slope 1 − s²/9 = 0), as a rack does where a tie rod comes into line with
  // its arm; the yaw moves fastest (a radian counts as 1000 mm), and every coordinate is a cubic in s.
  const toggle: Path = {
    input: (s) => s - s ** 3 / 27,
    inputSlope: (s) => 1 - s ** 2 / 9,
    coords: {
      0: [(s) => 3 * s * s, (s) => 6 * s],
      1: [(s) => 2 * s - s ** 3 / 5, (s) => 2 - (3 * s * s) / 5],
      5: [(s) => s / 20, () => 1 / 20],
    },
  };

  it('near a turning point of the input, predicts a pose cubic in the fastest coordinate exactly', () => {
    const out = new Float64Array(6);
    const to = toggle.input(2.6);
    predictPose(FREE, rowAt(toggle, 2.2), rowAt(toggle, 2.4), to, out);
    const exact = rowAt(toggle, 2.6).state;
    for (const c of FREE) expect(out[c], `coordinate ${c}`).toBeCloseTo(exact[c], 9);
  });

  it('there, a cubic in the input itself would miss by far more (what the guide coordinate is for)', () => {
    // The same two rows with the guide's rate flipped at one of them: the guide no longer moves steadily, so the
    // predictor takes its cubic in the input.
    const out = new Float64Array(6);
    const before = rowAt(toggle, 2.2);
    const from = rowAt(toggle, 2.4);
    predictPose(FREE, before, from, toggle.input(2.6), out);
    const exact = rowAt(toggle, 2.6).state;
    const guided = Math.abs(out[0] - exact[0]);
    from.rate[5] = -from.rate[5];
    predictPose(FREE, before, from, toggle.input(2.6), out);
    expect(Math.abs(out[0] - exact[0])).toBeGreaterThan(1e3 * Math.max(guided, 1e-9));
  });

  it('where the fastest coordinate turns back between the rows, predicts a pose cubic in the input exactly', () => {
    // Parameter = input; the yaw's rate changes sign between the rows at 1 and 2.
    const path: Path = {
      input: (s) => s,
      inputSlope: () => 1,
      coords: {
        0: [(s) => s ** 3 - 2 * s, (s) => 3 * s * s - 2],
        1: [(s) => 4 - s * s, (s) => -2 * s],
        5: [(s) => (s - 1.5) ** 2 / 10, (s) => (s - 1.5) / 5],
      },
    };
    const out = new Float64Array(6);
    predictPose(FREE, rowAt(path, 1), rowAt(path, 2), 2.5, out);
    const exact = rowAt(path, 2.5).state;
    for (const c of FREE) expect(out[c], `coordinate ${c}`).toBeCloseTo(exact[c], 9);
  });
});
