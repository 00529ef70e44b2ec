// @vitest-environment happy-dom
/**
 * The readout's leaf-spring and link-load lines: shackle angle, wind-up, each shock's length
 * change in heave and under wind-up, axial link loads (tension +) with their marks, the sweep's
 * notes, and the axle-torque / link-load-limit inputs that edit the sketch's sweep block.
 */
import { afterEach, describe, expect, it } from 'vitest';
import { useSweepStore } from '../../../src/stores/sweep';
import { starters } from '../../../shared/kinematics';
import type { Sketch } from '../../../shared/schema/sketch';
import { fixed } from '../../../shared/display/format';
import { readoutLines, EMPTY_CONTEXT } from '../../../src/sweep/readout';
import { parseSweepNumber } from '../../../src/sweep/loadInput';
import { fourLink, provideScreenOrientation, settled } from './setup';
import { mountOnBoard, typeInto, valueOf } from './mountReadout';

provideScreenOrientation();

afterEach(() => {
  useSweepStore().dispose();
  localStorage.clear();
});

/** Newtons: the sum of the link forces and the tractive force is round-off of zero. */
const FORCE_BALANCE_TOLERANCE_N = 1e-3;
/** Degrees. */
const ANGLE_TOLERANCE_DEG = 1e-9;

const leafSpring = (): Sketch => starters['leaf-spring']!.build();

describe('the readout on a leaf-sprung axle', () => {
  it('shows the shackle angle, the wind-up and each shock’s length change in heave and in wind-up', async () => {
    const { wrapper, sweep } = await mountOnBoard(leafSpring());
    const result = sweep.result!;
    expect(result.windUp).toBeDefined();
    const w = result.windUp!;
    expect(valueOf(wrapper, 'shackle').text()).toBe(`${fixed(result.ride.shackleAngle!, 1, true)}°`);
    expect(valueOf(wrapper, 'windup').text()).toBe(`${fixed(w.angle, 2, true)}°`);
    expect(wrapper.get('[data-test="readout-windup"]').text()).toContain('4000 N·m');
    // Hooke's law for a torsional spring (any mechanics text): angle = torque / angular rate.
    expect(Math.abs(w.angle - w.torque / w.rate)).toBeLessThan(ANGLE_TOLERANCE_DEG * Math.max(1, Math.abs(w.angle)));
    const shocks = sweep.context.members.filter((m) => m.kind === 'shock');
    expect(shocks.length).toBeGreaterThan(0);
    for (const s of shocks) {
      expect(valueOf(wrapper, `wu-${s.id}`).text()).toMatch(/^([+−]?\d+\.\d mm)$/);
      expect(valueOf(wrapper, `wu-${s.id}`).text()).toBe(`${fixed(w.members[s.id]!.lengthChange, 1, true)} mm`);
      expect(valueOf(wrapper, `dl-${s.id}`).text()).toBe(
        `${fixed(result.ride.members[s.id]!.lengthChange, 1, true)} mm`,
      );
    }
    expect(wrapper.text()).not.toMatch(/NaN|undefined|Infinity/);
  });

  it('lists the sweep’s sentences (the lateral assumption) as notes', async () => {
    const { wrapper, sweep } = await mountOnBoard(leafSpring());
    const leafNotes = sweep.result!.warnings.filter((n) => n.startsWith('Leaf springs'));
    expect(leafNotes.length).toBeGreaterThan(0);
    const shown = wrapper.findAll('[data-test="readout-note"]').map((n) => n.text());
    for (const n of leafNotes) expect(shown).toContain(n);
  });

  it('edits the axle torque through the board store; the wind-up follows and undo brings it back', async () => {
    const { wrapper, sweep, board } = await mountOnBoard(leafSpring());
    const before = sweep.result!.windUp!.angle;
    await typeInto(wrapper, 'readout-axle-torque', '2000');
    await settled(sweep);
    expect(board.sketch!.sweep.axleTorque).toBe(2000);
    // Linear torsional spring: half the torque, half the angle.
    expect(sweep.result!.windUp!.torque).toBe(2000);
    expect(Math.abs(sweep.result!.windUp!.angle - before / 2)).toBeLessThan(1e-6 * Math.max(1, Math.abs(before)));
    board.undo();
    await settled(sweep);
    expect(board.sketch!.sweep.axleTorque).toBeUndefined();
  });

  it('refuses a torque that is not a number and changes nothing', async () => {
    const { wrapper, board } = await mountOnBoard(leafSpring());
    const doc = board.sketch;
    await typeInto(wrapper, 'readout-axle-torque', 'lots');
    expect(wrapper.get('[data-test="readout-axle-torque-error"]').text()).toContain('not a number');
    expect(board.sketch).toBe(doc);
  });
});

describe('the readout on a four-link axle', () => {
  it('shows every link’s axial load at the slider row, tension positive, and marks the split indeterminate', async () => {
    const doc = fourLink();
    const { wrapper, sweep } = await mountOnBoard(doc);
    const loads = sweep.result!.loads!;
    const ride = sweep.result!.ride.linkLoads!;
    const linked = doc.members.filter((m) => m.kind === 'link' || m.kind === 'lateral-rod');
    expect(Object.keys(loads.members).sort()).toEqual(linked.map((m) => m.id).sort());
    for (const m of linked)
      expect(valueOf(wrapper, `load-${m.id}`).text()).toContain(`${fixed(ride[m.id]!, 0, true)} N`);
    expect(loads.indeterminate).toBe(true);
    expect(valueOf(wrapper, 'load-split').text()).toBe('indeterminate');
    expect(valueOf(wrapper, `load-${linked[0]!.id}`).text().startsWith('≈')).toBe(true);

    // Static equilibrium of the axle (Newton's first law), fore-aft: the links' pull on the axle
    // (tension f along the link, from its axle end toward its frame end) balances the tractive
    // force F = T / r, applied along +x at the patches (loads.ts's stated convention).
    const at = new Map(doc.points.map((p) => [p.id, p]));
    let sumX = loads.tractiveForce;
    for (const m of linked) {
      const a = at.get(m.a)!,
        b = at.get(m.b)!;
      const [axleEnd, frameEnd] = a.body === 'frame' ? [b, a] : [a, b];
      const len = Math.hypot(frameEnd.x - axleEnd.x, frameEnd.y - axleEnd.y, frameEnd.z - axleEnd.z);
      sumX += (ride[m.id]! * (frameEnd.x - axleEnd.x)) / len;
    }
    expect(Math.abs(sumX)).toBeLessThan(FORCE_BALANCE_TOLERANCE_N);
    expect(wrapper.text()).not.toMatch(/NaN|undefined|Infinity/);
  });

  it('marks a load over the user’s limit, set and cleared through the input', async () => {
    const { wrapper, sweep, board } = await mountOnBoard(fourLink());
    const loads = sweep.result!.loads!;
    const biggest = Object.entries(loads.members).sort(
      (x, y) => Math.max(Math.abs(y[1].min), Math.abs(y[1].max)) - Math.max(Math.abs(x[1].min), Math.abs(x[1].max)),
    )[0]!;
    const peak = Math.max(Math.abs(biggest[1].min), Math.abs(biggest[1].max));
    await typeInto(wrapper, 'readout-load-limit', String(Math.floor(peak / 2)));
    await settled(sweep);
    expect(board.sketch!.sweep.linkLoadLimit).toBe(Math.floor(peak / 2));
    expect(sweep.result!.loads!.members[biggest[0]]!.overLimit).toBe(true);
    const line = valueOf(wrapper, `load-${biggest[0]}`);
    expect(line.text()).toContain('over limit');
    expect(line.classes()).toContain('text-negative');
    await typeInto(wrapper, 'readout-load-limit', '');
    await settled(sweep);
    expect(board.sketch!.sweep.linkLoadLimit).toBeUndefined();
    await typeInto(wrapper, 'readout-load-limit', '-5');
    expect(wrapper.get('[data-test="readout-load-limit-error"]').text()).toContain('above 0');
  });
});

describe('load lines without numbers', () => {
  it('shows "—" with a reason for a row where the links do not locate the axle', () => {
    const row = { travel: 0, members: {}, linkLoads: {} } as never;
    const ctx = { ...EMPTY_CONTEXT, hasAxle: true, members: [{ id: 'LL', kind: 'link', a: 'p', b: 'q' }] as never };
    const loads = {
      torque: 4000,
      tractiveForce: 12000,
      limit: null,
      indeterminate: false,
      members: { LL: { ride: 1, min: 1, max: 1, reverses: false, overLimit: false } },
    };
    const lines = readoutLines({ sweep: 'heave', row }, ctx, 'mm', { loads });
    const l = lines.find((x) => x.key === 'load-LL')!;
    expect(l.text).toBe('—');
    expect(l.reason).toMatch(/do not locate/);
  });

  it('reads typed loads with named problems', () => {
    const rule = { name: 'Axle torque', unit: 'N·m', min: -200000, max: 200000, allowEmpty: false };
    expect(parseSweepNumber(' −1 500 ', rule)).toEqual({ ok: true, value: -1500 });
    expect(parseSweepNumber('', rule)).toEqual({ ok: false, error: 'Axle torque needs a number (N·m).' });
    expect(parseSweepNumber('300000', rule).ok).toBe(false);
  });
});
