// @vitest-environment happy-dom
/**
 * The help of each quantity on the screens: every readout line of a registry metric, every plot
 * title and every build-sheet geometry line carries its entry's definition and sign, reachable by
 * keyboard focus (aria-describedby); roll steer follows the sketch's axle end; the link loads and
 * the torque box say which axle torque they assume.
 */
import { afterEach, describe, expect, it } from 'vitest';
import { useSweepStore } from '../../../src/stores/sweep';
import type { Sketch } from '../../../shared/schema/sketch';
import { DEFAULT_AXLE_TORQUE_NM } from '../../../shared/schema/sketchVocabulary';
import {
  isMetricRef,
  metricEntries,
  metricEntry,
  metricHelp,
  readoutHeaveView,
} from '../../../shared/kinematics/metrics/registry';
import { readoutLines } from '../../../src/sweep/readout';
import { buildPlots } from '../../../src/sweep/plots';
import { buildSheet } from '../../../shared/sheet/buildSheet';
import { runSweep } from '../../../shared/kinematics';
import { fourLink, provideScreenOrientation, settled } from './setup';
import { mountOnBoard } from './mountReadout';

provideScreenOrientation();

afterEach(() => {
  useSweepStore().dispose();
  localStorage.clear();
});

const frontAxle = (): Sketch => {
  const doc = fourLink();
  return { ...doc, vehicle: { ...doc.vehicle, axle: 'front' } as Sketch['vehicle'] };
};

describe('the help the screens show', () => {
  it('gives every metric line of the readout its entry’s words, described for the keyboard', async () => {
    const { wrapper, sweep } = await mountOnBoard(fourLink());
    const lines = readoutLines(sweep.rowAtCursor, sweep.context, 'mm', {});
    const metricIds = readoutHeaveView.filter(isMetricRef).map((r) => metricEntry(r).id);
    const shown = lines.filter((l) => metricIds.includes(l.key));
    expect(shown.length).toBeGreaterThan(5);
    for (const line of shown) {
      const entry = metricEntries.find((e) => e.sweep === 'heave' && e.id === line.key)!;
      expect(line.help).toBe(metricHelp(entry));
      const label = wrapper.get(`[data-test="readout-${line.key}"] .board-readout__label .metric-help`);
      expect(label.attributes('tabindex')).toBe('0');
      const described = label.attributes('aria-describedby')!;
      expect(wrapper.get(`[id="${described}"]`).text()).toBe(line.help);
      expect(line.help!.startsWith(entry.definition)).toBe(true);
    }
  });

  it('words roll steer for the rear by default and for the front when the sketch says its axle is in front', async () => {
    const rear = await mountOnBoard(fourLink());
    expect(rear.sweep.context.axleEnd).toBe('rear');
    rear.sweep.dispose();
    const { sweep } = await mountOnBoard(frontAxle());
    await settled(sweep);
    expect(sweep.context.axleEnd).toBe('front');
    const result = sweep.result!;
    const plot = buildPlots(result, sweep.context, {}, [], 'mm').find((p) => p.key === 'rollsteer')!;
    expect(plot.help).toContain('roll understeer');
    const rearPlot = buildPlots(result, { ...sweep.context, axleEnd: 'rear' }, {}, [], 'mm').find(
      (p) => p.key === 'rollsteer',
    )!;
    expect(rearPlot.help).toContain('roll oversteer');
  });

  it('names the default torque the link loads assume when the sketch gives none, and the sketch’s own when it does', async () => {
    const doc = fourLink();
    expect(doc.sweep.axleTorque).toBeUndefined();
    const { wrapper, sweep, board } = await mountOnBoard(doc);
    expect(sweep.result!.loads!.torque).toBe(DEFAULT_AXLE_TORQUE_NM);
    const title = wrapper.get('[data-test="readout-group-loads"]');
    expect(title.text()).toContain(`${DEFAULT_AXLE_TORQUE_NM} N·m (default; tension +)`);
    const box = wrapper.get('[data-test="readout-axle-torque"]');
    expect((box.element as HTMLInputElement).value).toBe('');
    expect(box.attributes('placeholder')).toBe(`default ${DEFAULT_AXLE_TORQUE_NM} N·m`);
    const load = readoutLines(sweep.rowAtCursor, sweep.context, 'mm', {
      loads: sweep.result!.loads,
      torqueIsDefault: true,
    }).find((l) => l.group === 'loads' && l.member)!;
    expect(load.help).toContain(`axle torque of ${DEFAULT_AXLE_TORQUE_NM} N·m, the default`);

    await box.setValue('2500');
    await box.trigger('keydown', { key: 'Enter' });
    await settled(sweep);
    expect(wrapper.get('[data-test="readout-group-loads"]').text()).toContain('2500 N·m (tension +)');
    // Emptying the box goes back to the default.
    await wrapper.get('[data-test="readout-axle-torque"]').setValue('');
    await wrapper.get('[data-test="readout-axle-torque"]').trigger('keydown', { key: 'Enter' });
    await settled(sweep);
    expect(board.sketch!.sweep.axleTorque).toBeUndefined();
    expect(sweep.result!.loads!.torque).toBe(DEFAULT_AXLE_TORQUE_NM);
  });

  it('gives every plot title and every build-sheet geometry line its words', () => {
    const doc = fourLink();
    const result = runSweep(doc);
    const plots = buildPlots(result, { members: doc.members, hasAxle: true }, {}, [], 'mm');
    expect(plots.length).toBeGreaterThan(3);
    for (const p of plots) {
      expect(p.help.length).toBeGreaterThan(20);
      expect(p.help).toContain('Convention:');
    }
    const sheet = buildSheet(doc, result, null, 'mm');
    expect(sheet.geometry.length).toBeGreaterThan(3);
    for (const l of sheet.geometry) expect(l.help).toMatch(/\. Convention: .+\.$/);
  });
});
