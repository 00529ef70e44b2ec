// @vitest-environment happy-dom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { nextTick } from 'vue';
import { createPinia, setActivePinia } from 'pinia';
import { intersect } from 'mathjs';
import { runSweep } from '../../../shared/kinematics';
import type { Sketch } from '../../../shared/schema/sketch';
import { startingTargets } from '../../../shared/display/targets';
import { configureSweepRunner, useSweepStore } from '../../../src/stores/sweep';
import { useBoardStore } from '../../../src/stores/board';
import { computeSweep, type SweepAnswer, type SweepRequest } from '../../../src/workers/sweep.protocol';
import { fourLink, onBoard, settled, freshStores, detailOf } from './setup';

/** Solver answers are least-squares residuals far below this; a display difference would be far above (mm, deg, %). */
const CLOSE = 1e-6;

afterEach(() => {
  try {
    useSweepStore().dispose();
  } catch {
    // no active store
  }
});

const point = (doc: Sketch, id: string) => doc.points.find((p) => p.id === id)!;

describe('the sweep store follows the board', () => {
  it('sweeps the sketch on the board and shows ride height first', async () => {
    const { board, sweep } = await onBoard();
    expect(sweep.error).toBeNull();
    expect(sweep.result).not.toBeNull();
    expect(sweep.rowAtCursor?.sweep).toBe('heave');
    expect(sweep.rowAtCursor?.row).toEqual(sweep.result!.ride);
    // What the board shows is what runSweep computes for that very document.
    expect(sweep.result).toEqual(runSweep(board.sketch));
  });

  it('shows the closed-form anti-squat of the starter at ride (Milliken & Milliken, RCVD ch. 17)', async () => {
    const { board, sweep } = await onBoard();
    const doc = board.sketch!;
    // Side-view instant centre: where the left upper and lower link lines cross, by mathjs `intersect`
    // (an independent line-crossing routine, docs/references.md).
    const ul = [point(doc, 'UL.fl'), point(doc, 'UL.al')];
    const ll = [point(doc, 'LL.fl'), point(doc, 'LL.al')];
    const ic = intersect([ul[0].x, ul[0].z], [ul[1].x, ul[1].z], [ll[0].x, ll[0].z], [ll[1].x, ll[1].z]) as number[];
    // %AS = 100 · tanθ / (h/L), θ the angle of the line from the contact patch (wheel-centre x, ground) to the IC.
    const cpX = point(doc, doc.wheels.left).x;
    const expected = (100 * (ic[1] / (ic[0] - cpX))) / (doc.vehicle.cgHeight / doc.vehicle.wheelbase);
    const row = sweep.rowAtCursor!.row as { antiSquat: number | null; instantCenter: { x: number; z: number } | null };
    expect(row.instantCenter!.x).toBeCloseTo(ic[0], 6);
    expect(row.instantCenter!.z).toBeCloseTo(ic[1], 6);
    expect(Math.abs(row.antiSquat! - expected)).toBeLessThan(CLOSE);
  });

  it('re-sweeps on an edit: moving the lateral rod end moves the roll centre to the rod line’s crossing (Heisler fig. 10.28)', async () => {
    const { board, sweep } = await onBoard();
    const r = board.setPointCoordinate('LR.f', 'z', 450);
    expect(r.ok).toBe(true);
    await settled(sweep);
    const doc = board.sketch!;
    const f = point(doc, 'LR.f');
    const a = point(doc, 'LR.a');
    // Rear-view line through the rod's ends, at y = 0 (plain line geometry).
    const expected = f.z + ((0 - f.y) * (a.z - f.z)) / (a.y - f.y);
    const ride = sweep.result!.ride;
    expect(Math.abs(ride.rollCenterHeight! - expected)).toBeLessThan(CLOSE);
    expect(expected).not.toBeCloseTo(380, 3); // the edit did change it
  });

  it('puts the cursor on the row at the slider: travel, then roll (the roll sweep runs at ride height)', async () => {
    const { sweep } = await onBoard();
    sweep.setTravel(50);
    expect(sweep.rowAtCursor).toMatchObject({ sweep: 'heave', row: { travel: 50 } });
    expect(sweep.bodiesAtCursor.axle!.z).toBeCloseTo(50, 6); // travel is imposed on the axle
    sweep.setRoll(4);
    expect(sweep.cursor).toMatchObject({ sweep: 'roll', travel: 0, roll: 4 });
    expect(sweep.rowAtCursor).toMatchObject({ sweep: 'roll', row: { roll: 4 } });
    expect(sweep.bodiesAtCursor.axle!.roll).toBeCloseTo(4, 6);
    sweep.toRide();
    expect(sweep.rowAtCursor?.row).toEqual(sweep.result!.ride);
  });

  it('shows the last row reached, and says so, when the slider is past where the sweep stopped', async () => {
    const { sweep } = await onBoard();
    const lastRow = sweep.result!.heave.at(-1)!;
    sweep.setTravel(lastRow.travel + 40);
    expect(sweep.rowAtCursor?.row).toEqual(lastRow);
    expect(sweep.cursorBeyondReach).toBe(true);
  });

  it('follows a whole drag and ends on the sweep of the last position', async () => {
    const { board, sweep } = await onBoard();
    expect(board.beginDrag('side', 'UL.fl')).toBe(true);
    const start = point(board.sketch!, 'UL.fl');
    for (let k = 1; k <= 12; k++) board.dragTo({ h: start.x + 10 * k, v: start.z + 5 * k });
    board.endDrag();
    await settled(sweep);
    expect(sweep.result).toEqual(runSweep(board.sketch));
    expect(sweep.pending).toBe(false);
  });

  it('says it is still sweeping only once a sweep has taken longer than a moment', async () => {
    vi.useFakeTimers();
    // A worker that answers only when told: the sweep takes as long as the test says.
    const worker = {
      sent: [] as SweepRequest[],
      onmessage: null as ((e: MessageEvent<SweepAnswer>) => void) | null,
      onerror: null,
      postMessage(req: SweepRequest) {
        this.sent.push(req);
      },
      terminate() {},
    };
    try {
      setActivePinia(createPinia());
      configureSweepRunner({ useWorker: true, createWorker: () => worker as unknown as Worker });
      const board = useBoardStore();
      const sweep = useSweepStore();
      board.setLoaded(detailOf(fourLink()));
      await nextTick();
      expect(sweep.pending).toBe(true);
      vi.advanceTimersByTime(200);
      expect(sweep.slow).toBe(false); // a sweep still running after 0.2 s: no indicator yet
      vi.advanceTimersByTime(150);
      expect(sweep.slow).toBe(true);
      worker.onmessage?.({ data: computeSweep(worker.sent[0]) } as MessageEvent<SweepAnswer>);
      vi.advanceTimersByTime(20); // the answer is shown at the next animation frame
      await nextTick();
      expect(sweep.pending).toBe(false);
      expect(sweep.slow).toBe(false);
      expect(sweep.result).toEqual(runSweep(board.sketch));
    } finally {
      vi.useRealTimers();
      configureSweepRunner({ useWorker: false });
    }
  });

  it('keeps the last valid result, marked stale, and lists the problems of an invalid sketch', async () => {
    const { sweep } = await onBoard();
    const good = sweep.result;
    const bad = fourLink();
    bad.points[2] = { ...bad.points[2], x: Number.NaN };
    sweep.run(bad);
    await sweep.whenIdle();
    expect(sweep.result).toBe(good);
    expect(sweep.stale).toBe(true);
    expect(sweep.error!.some((p) => p.startsWith('points[2].x'))).toBe(true);
  });

  it('shows problems, not a crash, for a sketch that never swept', async () => {
    const { board, sweep } = freshStores();
    const bad = fourLink();
    bad.wheels = { left: 'WC.l', right: 'no-such-pivot' };
    board.setLoaded(detailOf(bad));
    await settled(sweep);
    expect(sweep.result).toBeNull();
    expect(sweep.error).toContain("wheels.right: no point 'no-such-pivot'");
    expect(sweep.rowAtCursor).toBeNull();
    expect(sweep.flags).toEqual([]);
  });

  it('does not re-sweep for a change of targets or tracing only', async () => {
    const { sweep } = await onBoard();
    const before = sweep.result;
    sweep.setTargets({ antiSquat: { min: 60, max: 90 } });
    await settled(sweep);
    expect(sweep.result).toBe(before);
  });
});

describe('targets live in the document', () => {
  it('saves bands as the document’s targets field, checks them, and undo takes them out again exactly', async () => {
    const { board, sweep } = await onBoard();
    const before = board.sketch;
    expect(sweep.setTargets(startingTargets).ok).toBe(true);
    expect((board.sketch as { targets?: unknown }).targets).toEqual(startingTargets);
    expect(sweep.targets).toEqual(startingTargets);
    expect(sweep.targetChecks.map((c) => c.metric).sort()).toEqual([
      'antiSquat',
      'articulation',
      'lateralShift',
      'pinionAngleChange',
    ]);
    board.undo();
    expect(board.sketch).toEqual(before);
    expect(sweep.targets).toEqual({});
  });

  it('raises a flag for a missed target with where it starts', async () => {
    const { sweep } = await onBoard();
    // The starter's anti-squat at ride is about 61 %: a band starting at 70 % is missed right at ride.
    sweep.setTargets({ antiSquat: { min: 70, max: 90 } });
    const flag = sweep.flags.find((f) => f.key === 'target-antiSquat');
    expect(flag).toBeDefined();
    expect(flag!.at).toBe(0);
    expect(flag!.where).toBe('ride height');
    expect(flag!.detail).toContain('wanted 70.0–90.0 %');
  });

  it('a malformed targets field from a hand-edited file still sweeps, and the board names the problem', async () => {
    const doc = { ...fourLink(), targets: { antiSquat: { min: 'lots' } } } as unknown as Sketch;
    const { board, sweep } = await onBoard(doc);
    expect(sweep.targets).toEqual({});
    expect(sweep.result).not.toBeNull();
    expect(sweep.error).toBeNull();
    expect(board.problems.some((p) => p.startsWith('targets.antiSquat.min'))).toBe(true);
  });
});

describe('flags of the sweep', () => {
  it('flags a shock that tops out, from where it starts, naming the shock', async () => {
    const { board, sweep } = await onBoard();
    const rideLen = sweep.result!.ride.members.SHl.length;
    // Leave 20 mm of extension: the shock reaches it in droop.
    expect(board.setMemberField('SHl', 'maxLength', Math.round(rideLen + 20)).ok).toBe(true);
    await settled(sweep);
    const flag = sweep.flags.find((f) => f.kind === 'shock-extended' && f.member === 'SHl' && f.sweep === 'heave');
    expect(flag).toBeDefined();
    expect(flag!.at).toBeLessThan(0);
    // The row just past the flag's start is longer than the limit, the row before it is not.
    const rows = sweep.result!.heave;
    const past = rows.filter((r) => r.travel <= flag!.at!).at(-1)!;
    expect(past.members.SHl.length).toBeGreaterThanOrEqual(Math.round(rideLen + 20) - CLOSE);
    expect(flag!.severity).toBe('negative');
  });

  it('lists driveline joint-angle flags with their joint and position in the user’s units', async () => {
    localStorage.setItem('arcwright.units', 'in');
    const { sweep } = await onBoard();
    const joint = sweep.flags.filter((f) => f.kind === 'joint-angle');
    expect(joint.length).toBeGreaterThan(0);
    for (const f of joint) expect(f.where).toMatch(/^[+\u2212]\d+\.\d{2} in (bump|droop)$/);
    localStorage.removeItem('arcwright.units');
  });
});
