import { describe, expect, it } from 'vitest';
import { createSweepRunner } from '../../../src/sweep/runner';
import { computeSweep, type SweepAnswer, type SweepRequest } from '../../../src/workers/sweep.protocol';
import { starters } from '../../../shared/kinematics';

/** A stand-in worker that answers only when the test says so, to see what the runner sends and when. */
class HeldWorker {
  sent: SweepRequest[] = [];
  onmessage: ((e: MessageEvent<SweepAnswer>) => void) | null = null;
  onerror: ((e: ErrorEvent) => void) | null = null;
  terminated = false;
  postMessage(req: SweepRequest) {
    this.sent.push(req);
  }
  terminate() {
    this.terminated = true;
  }
  /** Answers the oldest unanswered request with the real computation. */
  answer(index: number) {
    this.onmessage?.({ data: computeSweep(this.sent[index]) } as MessageEvent<SweepAnswer>);
  }
  fail() {
    this.onerror?.({ preventDefault() {} } as ErrorEvent);
  }
}

const fourLink = () => starters['four-link-lateral-rod']!.build();

function docWithTrack(track: number) {
  const d = fourLink();
  return { ...d, name: `track ${track}`, vehicle: { ...d.vehicle, track } };
}

describe('latest-wins sweep runner', () => {
  it('keeps one request in the worker and drops those a newer one supersedes', () => {
    const w = new HeldWorker();
    const answers: SweepAnswer[] = [];
    const runner = createSweepRunner((a) => answers.push(a), {
      useWorker: true,
      createWorker: () => w as unknown as Worker,
    });

    runner.request(docWithTrack(1500));
    runner.request(docWithTrack(1510));
    runner.request(docWithTrack(1520));
    runner.request(docWithTrack(1530));
    // Only the first went out; the three after it replaced each other while it ran.
    expect(w.sent.map((r) => r.sketch.name)).toEqual(['track 1500']);
    expect(runner.dropped).toBe(2);

    w.answer(0);
    // The newest waiting request goes out next; 1510 and 1520 never run.
    expect(w.sent.map((r) => r.sketch.name)).toEqual(['track 1500', 'track 1530']);
    w.answer(1);
    expect(answers.map((a) => a.id)).toEqual([1, 4]);
    expect(answers.every((a) => a.ok)).toBe(true);
  });

  it('throws away an answer older than the one already shown', () => {
    const w = new HeldWorker();
    const answers: SweepAnswer[] = [];
    const runner = createSweepRunner((a) => answers.push(a), {
      useWorker: true,
      createWorker: () => w as unknown as Worker,
    });
    runner.request(docWithTrack(1500));
    const stale = computeSweep(w.sent[0]);
    w.answer(0);
    // The same answer arriving twice (or late) must not replace the result shown.
    w.onmessage?.({ data: stale } as MessageEvent<SweepAnswer>);
    expect(answers).toHaveLength(1);
  });

  it('copies the document when asked, so later edits do not leak into a running sweep', () => {
    const w = new HeldWorker();
    const runner = createSweepRunner(() => {}, { useWorker: true, createWorker: () => w as unknown as Worker });
    const doc = docWithTrack(1500);
    runner.request(doc);
    doc.vehicle.track = 9999;
    expect(w.sent[0].sketch.vehicle.track).toBe(1500);
  });

  it('runs on the main thread, once per macrotask, when there is no worker', async () => {
    const answers: SweepAnswer[] = [];
    const runner = createSweepRunner((a) => answers.push(a), { useWorker: false });
    expect(runner.mode).toBe('main-thread');
    runner.request(docWithTrack(1500));
    runner.request(docWithTrack(1600));
    runner.request(docWithTrack(1700));
    await runner.whenIdle();
    expect(answers).toHaveLength(1);
    expect(answers[0].id).toBe(3);
    expect(runner.dropped).toBe(2);
  });

  it('falls back to the main thread when the worker fails to load, and still answers the request', async () => {
    const w = new HeldWorker();
    const answers: SweepAnswer[] = [];
    const runner = createSweepRunner((a) => answers.push(a), {
      useWorker: true,
      createWorker: () => w as unknown as Worker,
    });
    runner.request(docWithTrack(1500));
    w.fail();
    expect(w.terminated).toBe(true);
    expect(runner.mode).toBe('main-thread');
    await runner.whenIdle();
    expect(answers).toHaveLength(1);
    expect(answers[0].ok).toBe(true);
  });

  it('turns bad input into named problems, never a thrown error', async () => {
    const answers: SweepAnswer[] = [];
    const runner = createSweepRunner((a) => answers.push(a), { useWorker: false });
    const bad = fourLink();
    bad.members[0] = { ...bad.members[0], a: 'nowhere' };
    runner.request(bad);
    await runner.whenIdle();
    expect(answers[0].ok).toBe(false);
    if (!answers[0].ok)
      expect(answers[0].problems.some((p) => p.includes('members[0].a') && p.includes("'nowhere'"))).toBe(true);
  });

  it('validates on the page: the worker gets the parsed sketch, an invalid one never reaches it', () => {
    const w = new HeldWorker();
    const answers: SweepAnswer[] = [];
    const runner = createSweepRunner((a) => answers.push(a), {
      useWorker: true,
      createWorker: () => w as unknown as Worker,
    });
    // A document without its sweep block: the schema fills in the defaults the solver reads.
    const { sweep: _omitted, ...withoutSweep } = docWithTrack(1500);
    runner.request(withoutSweep);
    expect(w.sent[0].sketch.sweep.step).toBeGreaterThan(0);

    runner.request(docWithTrack(1510)); // waits behind the first
    const bad = { ...docWithTrack(1520), vehicle: { ...fourLink().vehicle, track: -5 } };
    runner.request(bad);
    // The problems are answered at once and replace the waiting request; the worker saw neither.
    expect(w.sent).toHaveLength(1);
    expect(answers).toHaveLength(1);
    expect(answers[0].ok).toBe(false);
    if (!answers[0].ok) expect(answers[0].problems.some((p) => p.startsWith('vehicle.track'))).toBe(true);
    // The first sweep finishing late must not cover the problems with an older result.
    w.answer(0);
    expect(answers).toHaveLength(1);
    expect(w.sent).toHaveLength(1);
  });

  it('uses the main thread by itself where Worker does not exist (as in Node)', () => {
    expect(typeof Worker).toBe('undefined');
    const runner = createSweepRunner(() => {});
    expect(runner.mode).toBe('main-thread');
  });
});
