// @vitest-environment happy-dom
/**
 * The board with a steer sweep: the steer slider and the store's cursor, the readout's steering lines, the
 * flags' wording of lock and toggle, the steer plots with the bump-steer map, and a drag's preview sweep that
 * leaves the map out until the drag ends.
 */
import { afterEach, describe, expect, it } from 'vitest';
import { flushPromises } from '@vue/test-utils';
import BoardReadout from '../../../src/components/BoardReadout.vue';
import BoardSliders from '../../../src/components/BoardSliders.vue';
import BoardFlags from '../../../src/components/BoardFlags.vue';
import { useSweepStore } from '../../../src/stores/sweep';
import { usePrefsStore } from '../../../src/stores/prefs';
import { buildFlags } from '../../../shared/display/flags';
import { buildSteerPlots } from '../../../src/sweep/plots';
import { computeSweep } from '../../../src/workers/sweep.protocol';
import { starters } from '../../../shared/kinematics';
import { checkSketch, type Sketch } from '../../../shared/schema/sketch';
import { metricEntry, metricHelp } from '../../../shared/kinematics/metrics/registry';
import { fourLink, onBoard, provideScreenOrientation, settled } from './setup';
import { mountOnBoard, valueOf } from './mountReadout';

provideScreenOrientation();

afterEach(() => {
  useSweepStore().dispose();
  localStorage.clear();
});

const wishbone = (): Sketch => starters['double-wishbone']!.build();
const DEG = Math.PI / 180;

describe('the steer cursor in the sweep store', () => {
  it('follows the steer slider, puts travel and roll back to ride, and moves the rack’s points with the rack', async () => {
    const { sweep, board } = await onBoard(wishbone());
    expect(sweep.steerInput?.key).toBe('rack');
    sweep.setTravel(20);
    sweep.setSteer(60);
    expect(sweep.cursor).toMatchObject({ sweep: 'steer', travel: 0, roll: 0, steer: 60 });
    expect(sweep.steering).toBe(true);
    expect(sweep.steerRow!.rack).toBe(60);
    expect(sweep.rowAtCursor).toBeNull();
    const st = sweep.result!.steer!;
    for (const id of st.rackPoints) {
      const ride = board.sketch!.points.find((p) => p.id === id)!;
      expect(sweep.steerPoints![id].y - ride.y).toBeCloseTo(60 * st.rackDirection!.y, 9);
    }
    // The knuckle is where the steer row's pose puts it: its ball joints keep their wishbones' lengths.
    const at = sweep.steerPoints!;
    const link = board.sketch!.members.find((m) => m.kind === 'tie-rod')!;
    const ride = (id: string) => board.sketch!.points.find((p) => p.id === id)!;
    const len = (p: { x: number; y: number; z: number }, q: typeof p) => Math.hypot(p.x - q.x, p.y - q.y, p.z - q.z);
    expect(len(at[link.a], at[link.b])).toBeCloseTo(len(ride(link.a), ride(link.b)), 3);
    sweep.setTravel(10);
    expect(sweep.cursor.steer).toBe(0);
    expect(sweep.steering).toBe(false);
    sweep.setSteer(-30);
    sweep.toRide();
    expect(sweep.cursor).toMatchObject({ sweep: 'heave', travel: 0, roll: 0, steer: 0 });
  });

  it('has no steer input for a sketch without a steer sweep', async () => {
    const { sweep } = await onBoard(fourLink());
    expect(sweep.steerInput).toBeNull();
    sweep.setSteer(40);
    expect(sweep.steering).toBe(false);
    expect(sweep.rowAtCursor?.sweep).toBe('heave');
  });
});

describe('the steer slider', () => {
  it('is shown beside travel and roll when the result steers, hidden otherwise', async () => {
    const steered = await mountOnBoard(wishbone(), { component: BoardSliders });
    expect(steered.wrapper.find('[data-test="slider-steer"]').exists()).toBe(true);
    steered.wrapper.unmount();
    useSweepStore().dispose();
    const plain = await mountOnBoard(fourLink(), { component: BoardSliders });
    expect(plain.wrapper.find('[data-test="slider-travel"]').exists()).toBe(true);
    expect(plain.wrapper.find('[data-test="slider-steer"]').exists()).toBe(false);
  });

  it('steps through the steer rows to each lock and names the ends by the way the wheels turn', async () => {
    const { wrapper, sweep } = await mountOnBoard(wishbone(), { component: BoardSliders });
    const rows = sweep.result!.steer!.rows;
    const slider = wrapper
      .findAllComponents({ name: 'QSlider' })
      .find((s) => s.vm.$attrs['data-test'] === 'slider-steer')!;
    expect(slider.props('max')).toBe(rows.length - 1);
    expect(slider.props('modelValue')).toBe(rows.findIndex((r) => r.rack === 0));
    slider.vm.$emit('update:modelValue', rows.length - 1);
    await flushPromises();
    expect(sweep.cursor).toMatchObject({ sweep: 'steer', steer: rows.at(-1)!.rack });
    expect(wrapper.get('[data-test="slider-steer-value"]').text()).toBe('+60.0 mm rack');
    // The starter's rack turns the wheels right for positive travel (tie rods behind the wheel centres).
    const end = (r: (typeof rows)[number]) => (r.leftSteer + r.rightSteer > 0 ? 'left' : 'right');
    expect(wrapper.get('[data-test="slider-steer-max"]').text()).toBe(end(rows.at(-1)!));
    expect(wrapper.get('[data-test="slider-steer-min"]').text()).toBe(end(rows[0]));
    expect(end(rows[0])).not.toBe(end(rows.at(-1)!));
    usePrefsStore().setUnits('in');
    await flushPromises();
    // 60 mm / 25.4 mm per inch (international inch, 1959).
    expect(wrapper.get('[data-test="slider-steer-value"]').text()).toBe(`+${(60 / 25.4).toFixed(2)} in rack`);
  });
});

describe('the readout at the steer slider', () => {
  it('shows both angles named inner and outer, Ackermann %, turning radius and the worst bump steer, with help', async () => {
    const { wrapper, sweep } = await mountOnBoard(wishbone(), { component: BoardReadout });
    const lock = sweep.result!.steer!.rows.at(-1)!;
    sweep.setSteer(lock.rack!);
    await flushPromises();
    expect(wrapper.get('[data-test="readout-position"]').text()).toBe('at +60.0 mm rack, ride height');
    // The inner wheel turns more (the turn's centre is nearer it): the larger angle is labelled inner.
    const leftInner = Math.abs(lock.leftSteer) > Math.abs(lock.rightSteer);
    const label = (key: string) => wrapper.get(`[data-test="readout-${key}"] .board-readout__label`).text();
    expect(label('steer-left')).toContain(leftInner ? '(inner)' : '(outer)');
    expect(label('steer-right')).toContain(leftInner ? '(outer)' : '(inner)');
    const signed = (v: number, d: number) => `${v < 0 ? '\u2212' : '+'}${Math.abs(v).toFixed(d)}`;
    expect(valueOf(wrapper, 'steer-left').text()).toBe(`${signed(lock.leftSteer, 2)}°`);
    expect(valueOf(wrapper, 'steer-right').text()).toBe(`${signed(lock.rightSteer, 2)}°`);
    expect(valueOf(wrapper, 'turning-radius').text()).toBe(`${lock.turningRadius!.toFixed(1)} mm`);
    expect(valueOf(wrapper, 'bump-steer-worst').text()).toMatch(/°$/);
    // Ackermann % by the Ackermann condition cot δo − cot δi = t / L (Gillespie, "Fundamentals of Vehicle Dynamics",
    // SAE 1992, ch. 8; from memory, unverified): ideal inner = atan(L / (L / tan δo − t)), t the distance between the
    // steering axes (lower to upper ball joint, placed at the row) where they meet the ground, a tyre radius below
    // the wheel centres' ride height.
    const doc = wishbone();
    const at = sweep.steerPoints!;
    const groundZ = doc.points.find((p) => p.id === 'WC.l')!.z - doc.vehicle.tireRadius;
    const foot = (s: 'l' | 'r') => {
      const lo = at[`LW.bj.${s}`],
        hi = at[`UW.bj.${s}`];
      const k = (groundZ - lo.z) / (hi.z - lo.z);
      return { x: lo.x + k * (hi.x - lo.x), y: lo.y + k * (hi.y - lo.y) };
    };
    const t = Math.hypot(foot('l').x - foot('r').x, foot('l').y - foot('r').y);
    const L = doc.vehicle.wheelbase;
    const inner = Math.abs(leftInner ? lock.leftSteer : lock.rightSteer) * DEG;
    const outer = Math.abs(leftInner ? lock.rightSteer : lock.leftSteer) * DEG;
    const ideal = Math.atan(L / (L / Math.tan(outer) - t));
    const pct = (100 * (inner - outer)) / (ideal - outer);
    expect(valueOf(wrapper, 'ackermann').text()).toBe(`${signed(pct, 1)} %`);
    for (const key of ['steer-left', 'ackermann', 'turning-radius', 'bump-steer-worst']) {
      const help = wrapper.get(`[data-test="readout-${key}"] [data-help]`).attributes('data-help');
      expect(help, key).toBeTruthy();
    }
    expect(wrapper.get('[data-test="readout-ackermann"] [data-help]').attributes('data-help')).toBe(
      metricHelp(metricEntry({ sweep: 'steer', key: 'ackermann' })),
    );
    expect(wrapper.text()).not.toMatch(/NaN|undefined|Infinity/);
  });

  it('says why Ackermann and the radius are missing straight ahead, and goes back to heave with the travel slider', async () => {
    const { wrapper, sweep } = await mountOnBoard(wishbone(), { component: BoardReadout });
    sweep.setSteer(0);
    await flushPromises();
    expect(wrapper.get('[data-test="readout-position"]').text()).toBe('at straight ahead, ride height');
    for (const key of ['ackermann', 'turning-radius']) {
      expect(valueOf(wrapper, key).text()).toBe('—');
      expect(valueOf(wrapper, key).attributes('data-reason')).toBe('not defined straight ahead');
    }
    sweep.setTravel(20);
    await flushPromises();
    expect(wrapper.find('[data-test="readout-ackermann"]').exists()).toBe(false);
    expect(wrapper.get('[data-test="readout-position"]').text()).toBe('at +20.0 mm bump');
  });
});

describe('steer flags', () => {
  it('lists the lock each way as a note worded in rack travel, never heave travel', async () => {
    const { sweep } = await onBoard(wishbone());
    const locks = sweep.flags.filter((f) => f.kind === 'steer-lock');
    expect(locks.map((f) => f.where).sort()).toEqual(['+60.0 mm rack', '−60.0 mm rack']);
    for (const f of locks) {
      expect(f.severity).toBe('info');
      expect(f.sweep).toBe('steer');
      expect(f.detail).toMatch(/^The steering reaches the end of its travel at [+−]60\.0 mm rack: left wheel/);
      expect(f.detail).not.toMatch(/bump|droop|roll/);
    }
  });

  it('flags the tie rod in line with its steering arm where the rack travel asked for is past its reach', async () => {
    const doc = wishbone();
    doc.sweep = { ...doc.sweep, steer: { rack: 90, step: 5 } };
    const { wrapper, sweep } = await mountOnBoard(doc, { component: BoardFlags });
    const toggles = sweep.flags.filter((f) => f.kind === 'steer-toggle');
    expect(toggles).toHaveLength(2);
    for (const f of toggles) {
      expect(f.severity).toBe('warning');
      // The design note puts the starter's toggle at about 78.4 mm of rack.
      expect(Math.abs(f.at!)).toBeGreaterThan(70);
      expect(Math.abs(f.at!)).toBeLessThan(85);
      expect(f.where).toMatch(/mm rack$/);
      expect(f.detail).toMatch(/tie rod and steering arm come into line at [+−]\d+\.\d mm rack/);
      expect(f.detail).toContain('sweep.steer.rack');
    }
    expect(wrapper.findAll('[data-test="flag-steer-toggle"]')).toHaveLength(2);
  });

  it('warns that a layout that does not steer has no steer sweep, and still shows its heave and roll', async () => {
    const doc = fourLink();
    doc.sweep = { ...doc.sweep, steer: { rack: 50, step: 5 } };
    const { wrapper, sweep } = await mountOnBoard(doc, { component: BoardFlags });
    const problem = sweep.flags.find((f) => f.kind === 'steer-problem')!;
    expect(problem.severity).toBe('warning');
    expect(problem.detail).toContain('sweep.steer');
    expect(wrapper.find('[data-test="flag-steer-problem"]').exists()).toBe(true);
    expect(sweep.result!.heave.length).toBeGreaterThan(10);
    expect(sweep.result!.roll.length).toBeGreaterThan(2);
    expect(sweep.steerInput).toBeNull();
  });

  it('words the positions in inches for an inch user', async () => {
    const { sweep } = await onBoard(wishbone());
    const flags = buildFlags(sweep.result, [], [], 'in');
    expect(flags.filter((f) => f.kind === 'steer-lock').map((f) => f.where)).toContain(
      `+${(60 / 25.4).toFixed(2)} in rack`,
    );
  });
});

describe('steer plots', () => {
  it('plots each steer quantity against rack travel and the bump-steer map, one curve per rack position', async () => {
    const { sweep } = await onBoard(wishbone());
    const steer = sweep.result!.steer!;
    const plots = buildSteerPlots(sweep.result, 'mm');
    expect(plots.map((p) => p.key)).toEqual([
      'steer-left',
      'steer-right',
      'ackermann',
      'turning-radius',
      'bump-steer-map-left',
      'bump-steer-map-right',
    ]);
    const angle = plots[0];
    expect(angle.sweep).toBe('steer');
    expect(angle.xTitle).toBe('rack travel (mm)');
    expect(angle.series[0].points).toEqual(steer.rows.map((r) => ({ x: r.rack, y: r.leftSteer })));
    const map = plots.find((p) => p.key === 'bump-steer-map-right')!;
    const curves = steer.bumpSteer!.curves;
    expect(map.series).toHaveLength(curves.length);
    expect(map.series[0].label).toBe('straight ahead');
    for (const c of curves) {
      const s = map.series.find(
        (x) =>
          x.label ===
          (c.rack === 0 ? 'straight ahead' : `${c.rack! > 0 ? '+' : '−'}${Math.abs(c.rack!).toFixed(1)} mm rack`),
      )!;
      expect(s.points).toEqual(c.points.map((p) => ({ x: p.travel, y: p.right })));
    }
    // The left wheel's straight-ahead curve is the heave sweep's toe change (the map's centre row is a heave march).
    const centre = plots.find((p) => p.key === 'bump-steer-map-left')!.series[0].points;
    let compared = 0;
    for (const p of centre) {
      const row = sweep.result!.heave.find((r) => r.travel === p.x);
      if (!row) continue;
      expect(p.y!).toBeCloseTo(row.toeChange!, 6);
      compared++;
    }
    expect(compared).toBeGreaterThan(3);
  });

  it('keeps the map’s plots while a drag’s previews keep the map, and makes new ones for a new map or unit', async () => {
    const { sweep } = await onBoard(wishbone());
    const r = sweep.result!;
    const preview = { ...r, steer: { ...r.steer!, rows: r.steer!.rows.slice() } };
    const key = (p: { key: string }) => p.key.startsWith('bump-steer-map');
    const first = buildSteerPlots(r, 'mm').filter(key);
    const again = buildSteerPlots(preview, 'mm').filter(key);
    expect(again[0]).toBe(first[0]);
    expect(again[1]).toBe(first[1]);
    expect(buildSteerPlots(r, 'in').filter(key)[0]).not.toBe(first[0]);
    const newMap = { ...r, steer: { ...r.steer!, bumpSteer: { ...r.steer!.bumpSteer! } } };
    expect(buildSteerPlots(newMap, 'mm').filter(key)[0]).not.toBe(first[0]);
  });

  it('has none without steer rows', async () => {
    const { sweep } = await onBoard(fourLink());
    expect(buildSteerPlots(sweep.result, 'mm')).toEqual([]);
  });
});

describe('the live sweep while a pivot is dragged', () => {
  it('leaves the bump-steer map out of a preview and sweeps it in the full request', () => {
    const c = checkSketch(wishbone());
    if (!c.ok) throw new Error('the starter does not check');
    const preview = computeSweep({ id: 1, sketch: c.sketch, preview: true });
    const full = computeSweep({ id: 2, sketch: c.sketch });
    if (!preview.ok || !full.ok) throw new Error('the sweep failed');
    expect(preview.preview).toBe(true);
    expect(preview.result.steer!.bumpSteer).toBeNull();
    expect(preview.result.steer!.rows).toEqual(full.result.steer!.rows);
    expect(full.result.steer!.bumpSteer!.curves.length).toBeGreaterThan(2);
  });

  it('keeps the last map during a drag and sweeps a new one when the drag ends', async () => {
    const { sweep, board } = await onBoard(wishbone());
    const before = sweep.result!.steer!.bumpSteer!;
    const id = board.sketch!.points.find(
      (p) => p.id === board.sketch!.members.find((m) => m.kind === 'tie-rod')!.b,
    )!.id;
    expect(board.beginDrag('rear', id)).toBe(true);
    const p = board.sketch!.points.find((q) => q.id === id)!;
    board.dragTo({ h: p.y, v: p.z + 15 });
    await settled(sweep);
    // The preview's rows are of the moved pivot; its map is the one from before the drag.
    expect(sweep.result!.steer!.bumpSteer).toBe(before);
    board.endDrag();
    await settled(sweep);
    await settled(sweep);
    const after = sweep.result!.steer!.bumpSteer!;
    expect(after).not.toBe(before);
    // Raising the steering arm's end 15 mm changes the bump steer at straight ahead.
    expect(after.worst).not.toBeCloseTo(before.worst!, 3);
  });
});
