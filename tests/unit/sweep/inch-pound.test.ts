// @vitest-environment happy-dom
/**
 * Inches mean inches everywhere: with inches picked, rates show in lbf/in, forces in lbf and torques
 * in lbf·ft on the readout, the flags, the targets editor, the build sheet and the load inputs,
 * while the sketch keeps N/mm, N and N·m.
 *
 * Every expected value below is converted with the definitions written out here, not with the
 * app's table: 1 lbf = 0.45359237 kg × 9.80665 m/s² (international yard and pound agreement, 1959;
 * standard gravity, 3rd CGPM 1901; NIST SP 811 appendix B), 1 in = 25.4 mm, 1 ft = 0.3048 m.
 */
import { afterEach, describe, expect, it } from 'vitest';
import { getActivePinia } from 'pinia';
import { useSweepStore } from '../../../src/stores/sweep';
import { runSweep, starters } from '../../../shared/kinematics';
import type { Sketch } from '../../../shared/schema/sketch';
import { fixed, showForce, showMetric, showRate, showTorque } from '../../../shared/display/format';
import { bandValueFromTyped, bandValueText } from '../../../src/sweep/targetsEditor';
import { parseQuantityInput, quantityInputText } from '../../../src/sweep/quantityInput';
import { buildFlags } from '../../../shared/display/flags';
import { buildSheet } from '../../../shared/sheet/buildSheet';
import { windUpEntry } from '../../../shared/kinematics/metrics/registry';
import { fourLink, provideScreenOrientation, settled } from './setup';
import { mountOnBoard, typeInto, valueOf } from './mountReadout';

provideScreenOrientation();

afterEach(() => {
  // The pure checks run without a store.
  if (getActivePinia()) useSweepStore().dispose();
  localStorage.clear();
});

/** N in one lbf, by definition (see the file's comment). */
const LBF = 0.45359237 * 9.80665;
/** N/mm in one lbf/in. */
const LBF_PER_IN = LBF / 25.4;
/** N·m in one lbf·ft. */
const LBF_FT = LBF * 0.3048;

const leafSpring = (): Sketch => starters['leaf-spring']!.build();

describe('numbers of force, rate and torque', () => {
  it('show in the file’s units with mm picked and in lbf, lbf/in, lbf·ft with inches', () => {
    expect(showRate(38, 'mm').text).toBe('38.0 N/mm');
    expect(showRate(38, 'in').text).toBe(`${(38 / LBF_PER_IN).toFixed(1)} lbf/in`);
    expect(showRate(38, 'in').text).toBe('217.0 lbf/in');
    expect(showForce(-1000, 'mm', undefined, true).text).toBe('\u22121000 N');
    expect(showForce(LBF * 225, 'in', undefined, true).text).toBe('+225 lbf');
    expect(showTorque(4000, 'mm').text).toBe('4000 N·m');
    expect(showTorque(LBF_FT * 2950, 'in').text).toBe('2950 lbf·ft');
    expect(showMetric(windUpEntry('rate'), LBF_FT * 120, 'in').text).toBe('120 lbf·ft/°');
    for (const show of [showRate(null, 'in'), showForce(Number.NaN, 'in'), showTorque(undefined, 'in')])
      expect(show.text).toBe('—');
  });
});

describe('a target band typed in lbf/in', () => {
  it('is stored in N/mm and shows again as typed', () => {
    for (const typed of [228.41, 100, 0.5, 1500.25]) {
      const stored = bandValueFromTyped(typed, 'rate', 'in');
      // Relative round-off of one multiplication.
      expect(Math.abs(stored - typed * LBF_PER_IN)).toBeLessThan(1e-12 * stored);
      expect(bandValueText(stored, 'rate', 'in')).toBe(String(typed));
    }
    // 40 N/mm is 228.4089… lbf/in; the box shows hundredths, and the file keeps 40 until it is retyped.
    expect(bandValueText(40, 'rate', 'in')).toBe((40 / LBF_PER_IN).toFixed(2));
    expect(bandValueText(40, 'rate', 'mm')).toBe('40');
    expect(bandValueFromTyped(40, 'rate', 'mm')).toBe(40);
  });
});

describe('a typed force, rate or torque', () => {
  const rule = { name: 'Axle torque', min: -200_000, max: 200_000, allowEmpty: false };

  it('is read in the user’s unit and stored in the file’s', () => {
    const r = parseQuantityInput('1475', rule, 'torque', 'in');
    expect(r.ok && r.value).toBeCloseTo(1475 * LBF_FT, 9);
    expect(parseQuantityInput('2000', rule, 'torque', 'mm')).toEqual({ ok: true, value: 2000 });
    expect(quantityInputText(2000, 'torque', 'mm')).toBe('2000');
    expect(quantityInputText(2000, 'torque', 'in')).toBe((2000 / LBF_FT).toFixed(2));
    expect(quantityInputText(undefined, 'force', 'in')).toBe('');
  });

  it('is refused beyond the file’s bounds with the bounds in the user’s unit', () => {
    const r = parseQuantityInput('200000', rule, 'torque', 'in');
    expect(r.ok).toBe(false);
    // 200 000 N·m = 147 512.44… lbf·ft, written rounded toward zero so that number is accepted.
    const bound = String(Math.trunc((200_000 / LBF_FT) * 100) / 100);
    expect(!r.ok && r.error).toBe(`Axle torque must be at least -${bound} and at most ${bound} lbf·ft.`);
    const atBound = parseQuantityInput(bound, rule, 'torque', 'in');
    expect(atBound.ok && atBound.value! <= 200_000).toBe(true);
    const notNumber = parseQuantityInput('lots', rule, 'torque', 'in');
    expect(!notNumber.ok && notNumber.error).toBe('Axle torque: "lots" is not a number (lbf·ft).');
  });
});

describe('the readout in inches', () => {
  it('shows a spring’s wheel rate in lbf/in and each link load in lbf', async () => {
    const { wrapper, sweep } = await mountOnBoard(fourLink(), { units: 'in' });
    const ride = sweep.result!.ride;
    const springs = sweep.context.members.filter((m) => m.kind === 'spring' && m.rate !== undefined);
    expect(springs.length).toBeGreaterThan(0);
    for (const s of springs) {
      const wheelRate = ride.members[s.id]!.wheelRate!;
      expect(valueOf(wrapper, `wr-${s.id}`).text()).toBe(`${fixed(wheelRate / LBF_PER_IN, 1)} lbf/in`);
    }
    const loads = ride.linkLoads!;
    for (const [id, n] of Object.entries(loads))
      expect(valueOf(wrapper, `load-${id}`).text()).toContain(`${fixed(n / LBF, 0, true)} lbf`);
    expect(wrapper.text()).not.toMatch(/N\/mm|NaN|undefined/);
  });

  it('shows the wind-up torque in lbf·ft and reads a typed axle torque in lbf·ft', async () => {
    const { wrapper, sweep, board } = await mountOnBoard(leafSpring(), { units: 'in' });
    const w = sweep.result!.windUp!;
    expect(wrapper.get('[data-test="readout-windup"]').text()).toContain(`${fixed(w.torque / LBF_FT, 0)} lbf·ft`);
    expect(valueOf(wrapper, 'windup-rate').text()).toBe(`${fixed(w.rate / LBF_FT, 0)} lbf·ft/°`);
    expect(wrapper.get('[data-test="readout-axle-torque-unit"]').text()).toBe('lbf·ft');
    await typeInto(wrapper, 'readout-axle-torque', '1475');
    await settled(sweep);
    expect(board.sketch!.sweep.axleTorque).toBeCloseTo(1475 * LBF_FT, 9);
    expect((wrapper.get('[data-test="readout-axle-torque"]').element as HTMLInputElement).value).toBe('1475');
  });
});

describe('the flags and the build sheet in inches', () => {
  it('write a link load over its limit in lbf, the travel in inches and the torque in lbf·ft', () => {
    const doc = fourLink();
    doc.sweep = { ...doc.sweep, linkLoadLimit: 1000 };
    const result = runSweep(doc);
    const flags = buildFlags(result, doc.members, [], 'in').filter((f) => f.kind === 'load-limit');
    expect(flags.length).toBeGreaterThan(0);
    const torque = `${fixed(result.loads!.torque / LBF_FT, 0)} lbf·ft`;
    for (const f of flags) {
      expect(f.detail).toContain(`the ${fixed(1000 / LBF, 0)} lbf limit`);
      expect(f.detail).toContain(`under ${torque}.`);
      expect(f.detail).toMatch(/ in (travel|bump|droop)|ride height/);
      expect(f.detail).not.toMatch(/kN|N·m| mm/);
    }
  });

  it('gives a spring’s rate in lbf/in on the build sheet', () => {
    const doc = fourLink();
    const spring = doc.members.find((m) => m.kind === 'spring' && m.rate !== undefined)!;
    const rate = spring.kind === 'spring' ? spring.rate! : 0;
    const note = buildSheet(doc, runSweep(doc), null, 'in').members.find((m) => m.id === spring.id)!.note;
    expect(note.startsWith(`${fixed(rate / LBF_PER_IN, 1)} lbf/in;`)).toBe(true);
    expect(buildSheet(doc, null, null, 'mm').members.find((m) => m.id === spring.id)!.note).toMatch(
      new RegExp(`^${rate.toFixed(1)} N/mm;`),
    );
  });
});
