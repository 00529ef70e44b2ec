/**
 * The live sweep of the open sketch. Every change of the board's sketch (each pointer move
 * of a drag included) asks for a new sweep; the runner keeps it latest-wins in a Web Worker.
 * The store holds the last result, the problems of an invalid sketch, the travel, roll and
 * steer slider positions, the row and body poses at the slider (for the readout and the ghost),
 * the targets and the flags. It applies no sketch edits itself: targets go through the
 * board store, the one place that edits the document.
 */
import { defineStore } from 'pinia';
import { computed, ref, shallowRef, watch } from 'vue';
import type { BodyPoses, HeaveRow, RollRow, SweepResult } from '../../shared/kinematics';
import type { SteerRow } from '../../shared/kinematics/types';
import type { Vec3 } from '../../shared/vec3';
import type { Sketch } from '../../shared/schema/sketch';
import type { Deg, Mm } from '../../shared/units';
import { axleEndOf } from '../../shared/kinematics/metrics/registry/help';
import { createSweepRunner, type SweepRunner, type RunnerOptions } from '../sweep/runner';
import type { SweepAnswer } from '../workers/sweep.protocol';
import { checkTargets, readTargets, type Targets } from '../../shared/display/targets';
import { buildFlags, nearestRow } from '../../shared/display/flags';
import { EMPTY_CONTEXT, type CursorRow, type SweepContext } from '../sweep/readout';
import { sweepRange } from '../sweep/range';
import { steerAt, steerInputOf } from '../../shared/display/steerInput';
import { steerRowPoints } from '../canvas/planView';
import { useBoardStore, type EditResult } from './board';
import { usePrefsStore } from './prefs';
import { useFrameBatch } from '../composables/useFrameBatch';

/** The parts of a document the sweep reads; targets, tracing and the name do not need a new sweep. */
const SWEPT_FIELDS = ['layout', 'vehicle', 'points', 'members', 'wheels', 'driveline', 'sweep'] as const;

/** How long a sweep may be pending before the board says it is still sweeping (ms). */
const SLOW_SWEEP_MS = 300;

let runnerOptions: RunnerOptions = {};
/** Tests choose the main-thread path (or a fake worker) before the store is first used. */
export function configureSweepRunner(options: RunnerOptions): void {
  runnerOptions = options;
}

export const useSweepStore = defineStore('sweep', () => {
  const board = useBoardStore();
  const prefs = usePrefsStore();

  /** The last successful sweep. Kept (marked stale) while the sketch has problems, so the plots do not blank mid-edit. */
  const result = shallowRef<SweepResult | null>(null);
  /** Problems of the sketch as it is now, one line each naming the field; null when it sweeps. */
  const error = shallowRef<string[] | null>(null);
  /** True when the result shown is from an earlier, valid version of the sketch. */
  const stale = computed(() => error.value !== null && result.value !== null);
  /** True while a newer sweep has been asked for than the one shown. */
  const pending = ref(false);
  /**
   * True once a sweep has been pending for longer than SLOW_SWEEP_MS. A sweep takes a few ms,
   * so during a drag `pending` flips at every pointer move; an indicator bound to it would
   * flicker and repaint the page each time for nothing a user could read.
   */
  const slow = ref(false);
  let slowTimer: ReturnType<typeof setTimeout> | null = null;
  watch(pending, (now) => {
    if (now && slowTimer === null) {
      slowTimer = setTimeout(() => {
        slowTimer = null;
        slow.value = pending.value;
      }, SLOW_SWEEP_MS);
    } else if (!now) {
      if (slowTimer !== null) clearTimeout(slowTimer);
      slowTimer = null;
      slow.value = false;
    }
  });
  /** ms runSweep took for the result shown. */
  const lastMs = ref(0);
  /** Slider position in heave, mm of travel (0 = ride). */
  const travel = ref<Mm>(0);
  /** Slider position in roll, deg (0 = no roll). */
  const roll = ref<Deg>(0);
  /** Slider position in steer, in the steer input's unit (mm of rack; 0 = straight ahead). */
  const steer = ref(0);
  /** Which slider the user moved last: the readout and the ghost follow it. */
  const cursorSweep = ref<'heave' | 'roll' | 'steer'>('heave');

  let asked = 0;
  /** True when the result shown is a drag's preview (its bump-steer map, if any, is an earlier one). */
  let previewShown = false;
  let answered = 0;
  let runner: SweepRunner | null = null;
  /** An answer waiting for the next animation frame; a newer one replaces it. */
  const answerFrame = useFrameBatch(applyAnswer);
  let appliedWaiters: Array<() => void> = [];

  /**
   * Answers from the worker are shown at most once per animation frame: during a drag the
   * worker can answer faster than the page paints, and a result nobody sees is work for nothing.
   */
  function onAnswer(a: SweepAnswer) {
    if (runner?.mode !== 'worker') {
      applyAnswer(a);
      return;
    }
    answerFrame.schedule(a);
  }

  function applyAnswer(a: SweepAnswer) {
    answered = a.id;
    pending.value = answered < asked;
    lastMs.value = a.ms;
    if (a.ok) {
      // A drag's preview leaves the bump-steer map out: the last one is kept until the drag's end sweeps it again.
      const map = result.value?.steer?.bumpSteer;
      const steer = a.result.steer;
      const kept =
        a.preview && steer && steer.rows.length && !steer.bumpSteer && map
          ? { ...a.result, steer: { ...steer, bumpSteer: map } }
          : a.result;
      result.value = Object.freeze(kept);
      previewShown = !!a.preview;
      error.value = null;
    } else {
      error.value = a.problems;
    }
    const waiters = appliedWaiters;
    appliedWaiters = [];
    waiters.forEach((w) => w());
  }

  function ensureRunner(): SweepRunner {
    runner ??= createSweepRunner(onAnswer, runnerOptions);
    return runner;
  }

  /**
   * Asks for a sweep of this document (latest wins). While a pivot is dragged of a sketch with a steer sweep,
   * the sweep is a preview without the bump-steer map (most of a steered sketch's sweep time).
   */
  function run(doc: unknown) {
    if (doc === null || doc === undefined) {
      result.value = null;
      error.value = null;
      return;
    }
    asked++;
    pending.value = true;
    const preview = board.dragging && !!(doc as { sweep?: { steer?: unknown } }).sweep?.steer;
    ensureRunner().request(doc, preview);
  }

  /** Resolves when the sweep of the latest document is shown. */
  async function whenIdle(): Promise<void> {
    if (runner) await runner.whenIdle();
    if (answerFrame.pending()) await new Promise<void>((resolve) => appliedWaiters.push(resolve));
  }

  const sketch = computed(() => (board.sketch ?? null) as Sketch | null);

  // The board's documents are immutable, so these keep their identity while a drag changes
  // only points: what depends on them is not redone until a new sweep arrives.
  const members = computed(() => sketch.value?.members ?? EMPTY_CONTEXT.members);
  const hasAxle = computed(() => (sketch.value?.points ?? []).some((p) => p.body === 'axle'));
  /** Members and layout facts the readout, flags and plots read besides the sweep. */
  const axleEnd = computed(() => axleEndOf(sketch.value?.vehicle));
  const context = computed<SweepContext>(() => ({
    members: members.value,
    hasAxle: hasAxle.value,
    axleEnd: axleEnd.value,
  }));
  const sweepBlock = computed(() => sketch.value?.sweep);
  /** The sweep range of the sketch (defaults filled in), for the sliders. */
  const range = computed(() => sweepRange({ sweep: sweepBlock.value }));

  // The board's documents are immutable (every edit builds a new one sharing untouched parts),
  // so comparing the swept parts by reference sees every edit that matters and skips the rest.
  watch(
    SWEPT_FIELDS.map((k) => () => (sketch.value as Record<string, unknown> | null)?.[k]),
    () => run(sketch.value),
    { immediate: true },
  );
  // The drag's end fills in the bump-steer map its previews left out, even if the last move changed nothing.
  watch(
    () => board.dragging,
    (now) => {
      if (!now && (previewShown || pending.value) && sketch.value?.sweep?.steer) run(sketch.value);
    },
  );

  const heaveRow = computed<HeaveRow | null>(() =>
    result.value ? nearestRow(result.value.heave, (r) => r.travel, travel.value) : null,
  );
  const rollRow = computed<RollRow | null>(() =>
    result.value ? nearestRow(result.value.roll, (r) => r.roll, roll.value) : null,
  );

  /** What moves the wheels in the steer sweep (rack, …); null when the result has no steer rows. */
  const steerInput = computed(() => steerInputOf(result.value?.steer));
  /** The steer row nearest the steer slider; null without steer rows. */
  const steerRow = computed<SteerRow | null>(() => {
    const input = steerInput.value;
    const rows = result.value?.steer?.rows;
    return input && rows ? nearestRow(rows, (r) => steerAt(r, input), steer.value) : null;
  });
  /** True while the steer slider is the one moved last (and the result steers). */
  const steering = computed(() => cursorSweep.value === 'steer' && steerRow.value !== null);

  /** The heave or roll row the readout shows and the ghost draws: of the slider moved last; null while steering. */
  const rowAtCursor = computed<CursorRow | null>(() => {
    if (cursorSweep.value === 'steer')
      return steerRow.value ? null : heaveRow.value && { sweep: 'heave', row: heaveRow.value };
    if (cursorSweep.value === 'roll' && rollRow.value) return { sweep: 'roll', row: rollRow.value };
    return heaveRow.value ? { sweep: 'heave', row: heaveRow.value } : null;
  });

  /** Poses of every moving body at the cursor, for the ghost drawing. */
  const bodiesAtCursor = computed<BodyPoses>(() =>
    steering.value ? (steerRow.value?.bodies ?? {}) : (rowAtCursor.value?.row.bodies ?? {}),
  );

  /**
   * Every point of the sketch at the steer slider: bodies placed by the steer row's poses, and the steering
   * input's frame points (the rack's tie-rod ends) moved by the row's travel along its direction. null when
   * the steer slider is not the cursor.
   */
  const steerPoints = computed<Record<string, Vec3> | null>(() => {
    const s = sketch.value;
    const row = steerRow.value;
    const st = result.value?.steer;
    if (!s || !row || !st || !steering.value) return null;
    return steerRowPoints(s, st, row);
  });

  /** The cursor as plots use it: heave plots at the travel, roll plots at the roll (roll sweeps run at ride). */
  const cursor = computed(() => ({
    sweep: cursorSweep.value,
    at: cursorSweep.value === 'roll' ? roll.value : cursorSweep.value === 'steer' ? steer.value : travel.value,
    travel: cursorSweep.value === 'heave' ? travel.value : 0,
    roll: cursorSweep.value === 'roll' ? roll.value : 0,
    steer: cursorSweep.value === 'steer' ? steer.value : 0,
  }));

  /** True when the cursor sits past where the sweep stopped (lock-up): the row shown is the last one reached. */
  const cursorBeyondReach = computed(() => {
    const r = result.value;
    if (!r) return false;
    if (cursorSweep.value === 'steer') {
      const rows = r.steer?.rows ?? [];
      const input = steerInput.value;
      if (!input || !rows.length) return false;
      return steer.value < steerAt(rows[0], input) - 1e-9 || steer.value > steerAt(rows[rows.length - 1], input) + 1e-9;
    }
    if (cursorSweep.value === 'roll')
      return roll.value < r.limits.rollMin - 1e-9 || roll.value > r.limits.rollMax + 1e-9;
    return travel.value < r.limits.droop - 1e-9 || travel.value > r.limits.bump + 1e-9;
  });

  const targetsField = computed(() => (sketch.value as { targets?: unknown } | null)?.targets);
  /** The targets, kept in the document's optional `targets` field (so they save and export with it). */
  const targets = computed<Targets>(() => readTargets({ targets: targetsField.value }));

  const targetChecks = computed(() => (result.value ? checkTargets(result.value, targets.value) : []));

  const flags = computed(() => buildFlags(result.value, members.value, targetChecks.value, prefs.units));

  function setTravel(v: Mm) {
    travel.value = v;
    roll.value = 0;
    steer.value = 0;
    cursorSweep.value = 'heave';
  }

  function setRoll(v: Deg) {
    roll.value = v;
    travel.value = 0;
    steer.value = 0;
    cursorSweep.value = 'roll';
  }

  /** The steer slider (the steer input's unit: mm of rack); travel and roll go back to ride, where the steer sweep runs. */
  function setSteer(v: number) {
    steer.value = v;
    travel.value = 0;
    roll.value = 0;
    cursorSweep.value = 'steer';
  }

  /** Back to ride height, no roll, straight ahead. */
  function toRide() {
    travel.value = 0;
    roll.value = 0;
    steer.value = 0;
    cursorSweep.value = 'heave';
  }

  /** Replaces the targets (empty bands dropped; a band with only a window is kept but checks nothing), as one undo step. */
  function setTargets(next: Targets): EditResult {
    const clean: Targets = {};
    for (const [k, band] of Object.entries(next)) {
      if (band && Object.values(band).some((v) => v !== undefined)) clean[k as keyof Targets] = { ...band };
    }
    return board.setTargets(Object.keys(clean).length ? clean : undefined, { label: 'Change targets' });
  }

  function dispose() {
    if (slowTimer !== null) clearTimeout(slowTimer);
    slowTimer = null;
    runner?.dispose();
    runner = null;
    answerFrame.cancel();
  }

  return {
    result,
    error,
    stale,
    pending,
    slow,
    lastMs,
    travel,
    roll,
    steer,
    cursorSweep,
    cursor,
    cursorBeyondReach,
    heaveRow,
    rollRow,
    rowAtCursor,
    bodiesAtCursor,
    steerInput,
    steerRow,
    steering,
    steerPoints,
    context,
    range,
    targets,
    targetChecks,
    flags,
    run,
    whenIdle,
    setTravel,
    setRoll,
    setSteer,
    toRide,
    setTargets,
    dispose,
    /** for tests and the benchmark: how the sweep runs and how many requests latest-wins dropped */
    runnerMode: () => runner?.mode ?? null,
    droppedRequests: () => runner?.dropped ?? 0,
  };
});
