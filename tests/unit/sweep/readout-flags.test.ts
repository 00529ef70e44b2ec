// @vitest-environment happy-dom
import { afterEach, describe, expect, it } from 'vitest';
import { flushPromises } from '@vue/test-utils';
import BoardReadout from '../../../src/components/BoardReadout.vue';
import BoardFlags from '../../../src/components/BoardFlags.vue';
import { useSweepStore } from '../../../src/stores/sweep';
import { usePrefsStore } from '../../../src/stores/prefs';
import { fourLink, settled, provideScreenOrientation } from './setup';
import { mountOnBoard, valueOf } from './mountReadout';

provideScreenOrientation();

afterEach(() => {
  useSweepStore().dispose();
  localStorage.clear();
});

describe('the readout', () => {
  it('shows the ride row by default, in mm, with the sweep’s own numbers', async () => {
    const { wrapper, sweep } = await mountOnBoard(undefined, { component: BoardReadout });
    expect(wrapper.get('[data-test="readout-position"]').text()).toBe('at ride height');
    const ride = sweep.result!.ride;
    expect(valueOf(wrapper, 'antisquat').text()).toBe(`${ride.antiSquat!.toFixed(1)} %`);
    expect(valueOf(wrapper, 'rc').text()).toBe(`${ride.rollCenterAboveGround!.toFixed(1)} mm`);
    expect(wrapper.text()).not.toMatch(/NaN|undefined|Infinity/);
  });

  it('follows the travel slider and the user’s unit', async () => {
    const { wrapper, sweep } = await mountOnBoard(undefined, { component: BoardReadout });
    usePrefsStore().setUnits('in');
    sweep.setTravel(50);
    await flushPromises();
    expect(wrapper.get('[data-test="readout-position"]').text()).toBe('at +1.97 in bump');
    const row = sweep.result!.heave.find((r) => r.travel === 50)!;
    // 1 in = 25.4 mm exactly (international inch, 1959).
    expect(valueOf(wrapper, 'rc').text()).toBe(`${(row.rollCenterAboveGround! / 25.4).toFixed(2)} in`);
  });

  it('shows a dash with the reason for the instant centre of parallel links, and anti-squat from their slope', async () => {
    const doc = fourLink();
    // Make the upper links parallel to the lower ones in side view (same slope), so no instant centre exists.
    const p = (id: string) => doc.points.find((q) => q.id === id)!;
    const ll = [p('LL.fl'), p('LL.al')];
    const slope = (ll[0].z - ll[1].z) / (ll[0].x - ll[1].x);
    for (const side of ['l', 'r']) {
      const f = p(`UL.f${side}`);
      const a = p(`UL.a${side}`);
      f.z = a.z + slope * (f.x - a.x);
    }
    const { wrapper } = await mountOnBoard(doc, { component: BoardReadout });
    for (const key of ['ic-x', 'ic-height']) {
      const cell = valueOf(wrapper, key);
      expect(cell.text()).toBe('—');
      expect(cell.attributes('data-reason')).toBe('upper and lower links parallel in side view: no instant centre');
    }
    // Parallel links: the anti-squat line from the contact patch runs parallel to them, tanθ = their slope;
    // %AS = 100 · tanθ / (h/L) (Milliken & Milliken, RCVD ch. 17; formula form from memory, unverified).
    const expected = (100 * slope) / (doc.vehicle.cgHeight / doc.vehicle.wheelbase);
    expect(valueOf(wrapper, 'antisquat').text()).toBe(`${expected.toFixed(1)} %`);
    expect(wrapper.text()).not.toMatch(/NaN/);
  });

  it('selects the member when its line is clicked', async () => {
    const { wrapper, board } = await mountOnBoard(undefined, { component: BoardReadout });
    await wrapper.get('[data-test="readout-member-SHl"]').trigger('click');
    expect(board.selectedMember).toBe('SHl');
  });

  it('lists the problems of an invalid sketch instead of numbers from nowhere', async () => {
    const { wrapper, sweep } = await mountOnBoard(undefined, { component: BoardReadout });
    const bad = fourLink();
    bad.members[1] = { ...bad.members[1], b: 'missing' };
    sweep.run(bad);
    await sweep.whenIdle();
    await flushPromises();
    const banner = wrapper.get('[data-test="readout-problems"]');
    expect(banner.text()).toContain("members[1].b: no point 'missing'");
    expect(banner.text()).toContain('last valid version');
  });
});

describe('the flags', () => {
  it('lists each flag with where it starts, and a click selects the member concerned', async () => {
    const { wrapper, board, sweep } = await mountOnBoard(undefined, { component: BoardFlags });
    const rideLen = sweep.result!.ride.members.SHl.length;
    board.setMemberField('SHl', 'maxLength', Math.round(rideLen + 20));
    await settled(sweep);
    await flushPromises();
    const item = wrapper
      .findAll('[data-test="flag-shock-extended"]')
      .find((w) => w.attributes('data-member') === 'SHl');
    expect(item).toBeDefined();
    expect(item!.text()).toContain('Shock tops out');
    expect(item!.find('.board-flags__where').text()).toMatch(/^(\u2212\d+\.\d mm droop|[+\u2212]\d+\.\d° roll)$/);
    await item!.trigger('click');
    expect(board.selectedMember).toBe('SHl');
  });

  it('counts the flags that ask for action, and says so when there are none', async () => {
    const { wrapper, board, sweep } = await mountOnBoard(undefined, { component: BoardFlags });
    const count = Number(wrapper.get('[data-test="flags-count"]').text());
    expect(count).toBe(sweep.flags.filter((f) => f.severity !== 'info').length);
    expect(count).toBeGreaterThan(0);
    // A generous joint-angle limit, no minimum joint angle (the starter's shaft runs straight at ride)
    // and a short sweep leave nothing to flag.
    board.commit('Quiet sweep', (d) => ({
      ...d,
      driveline: { ...d.driveline!, minJointAngle: 0 },
      sweep: { ...d.sweep, droop: -20, bump: 20, roll: 1, jointAngleLimit: 20 },
    }));
    await settled(sweep);
    await flushPromises();
    expect(sweep.flags).toEqual([]);
    expect(wrapper.find('[data-test="flags-none"]').exists()).toBe(true);
  });
});
