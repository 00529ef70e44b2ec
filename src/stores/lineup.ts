/**
 * The line-up: two to four sketches (or hand-ins of one assignment) side by side, read-only. It loads them from the API,
 * sweeps each with runSweep (the very result the board shows for it), and matches their frame
 * pivots by position into brackets. It edits no sketch: a variant is changed on its own board; what
 * it holds of its own is how the line-up is looked at (the tolerance, which variants are drawn,
 * whether front and rear layouts are matched together).
 */
import { defineStore } from 'pinia';
import { computed, ref, shallowRef } from 'vue';
import { api, errorMessage } from '../api/http';
import { sweepOnce } from '../../shared/sheet/sweepOnce';
import type { SketchDetail } from '../api/types';
import type { SweepResult } from '../../shared/kinematics/types';
import { DEFAULT_BRACKET_TOLERANCE_MM, matchBrackets, type BracketMatch } from '../../shared/lineup/brackets';
import { framePivots } from '../../shared/lineup/framePivots';
import { matchGroups, suspensionEnd, type MatchGroup } from '../../shared/lineup/ends';
import { HAND_IN_WORDS, parseLineupIds } from './lineup/ids';
import { useClassesStore } from './classes';
import { handInAsSketch } from '../classes/handInSketch';
import { whenText } from '../classes/due';

/** What a line-up compares: the user's sketches (`?ids=`) or an assignment's hand-ins (`?handIns=`). */
export type LineupSource = 'sketches' | 'handIns';

export interface LineupVariant {
  detail: SketchDetail;
  /** the board address that opens it (a sketch, or a hand-in read-only) */
  open: string;
  /** the sweep, or null with the reason when the sketch cannot be swept */
  result: SweepResult | null;
  problem: string | null;
}

const LIBRARY = { to: '/library', label: 'Back to the library' };

export const useLineupStore = defineStore('lineup', () => {
  const variants = shallowRef<LineupVariant[]>([]);
  const loading = ref(false);
  /** why the line-up could not open (a missing sketch, a bad address) */
  const error = ref<string | null>(null);
  /** where the user came from: the library, or the assignment whose hand-ins are lined up */
  const back = ref<{ to: string; label: string }>(LIBRARY);

  /** mm: frame pivots at most this far apart share a bracket */
  const tolerance = ref(DEFAULT_BRACKET_TOLERANCE_MM);
  /** match front and rear layouts together (the user insists) */
  const acrossEnds = ref(false);
  /** the variants (by place) left out of the side view and the plots; the brackets still count them */
  const hidden = ref<number[]>([]);

  const ends = computed(() => variants.value.map((v) => suspensionEnd(v.detail.document)));
  const pivots = computed(() => variants.value.map((v) => framePivots(v.detail.document)));
  /** one match per group of variants compared together (one group unless front and rear are kept apart) */
  const matches = computed<(MatchGroup & { match: BracketMatch })[]>(() =>
    matchGroups(ends.value, acrossEnds.value).map((g) => ({
      ...g,
      match: matchBrackets(
        g.variants.map((i) => pivots.value[i]),
        tolerance.value,
        g.variants,
      ),
    })),
  );

  /** mm; the page checks it against MIN/MAX_BRACKET_TOLERANCE_MM before it sets it */
  function setTolerance(mm: number): void {
    tolerance.value = mm;
  }

  function setAcrossEnds(on: boolean): void {
    acrossEnds.value = on;
  }

  function toggleHidden(place: number): void {
    hidden.value = hidden.value.includes(place) ? hidden.value.filter((i) => i !== place) : [...hidden.value, place];
  }

  async function load(raw: unknown, source: LineupSource = 'sketches'): Promise<void> {
    error.value = null;
    back.value = LIBRARY;
    const parsed = source === 'handIns' ? parseLineupIds(raw, HAND_IN_WORDS) : parseLineupIds(raw);
    if (!parsed.ok) {
      variants.value = [];
      error.value = parsed.error;
      return;
    }
    loading.value = true;
    try {
      const opened = source === 'handIns' ? await openHandIns(parsed.ids) : await openSketches(parsed.ids);
      variants.value = opened.map(({ detail, open }) => ({ detail, open, ...sweepOnce(detail.document) }));
      hidden.value = [];
    } catch (err) {
      variants.value = [];
      error.value = `The line-up could not open: ${errorMessage(err)}.`;
    } finally {
      loading.value = false;
    }
  }

  async function openSketches(ids: number[]) {
    const details = await Promise.all(ids.map((id) => api.get<SketchDetail>(`/api/sketches/${id}`)));
    return details.map((detail) => ({ detail, open: `/sketches/${detail.id}` }));
  }

  /** Hand-ins are named by their student (and the time, for two of one student's). */
  async function openHandIns(ids: number[]) {
    const classes = useClassesStore();
    const handIns = await Promise.all(ids.map((id) => classes.fetchHandIn(id)));
    const students = handIns.map((h) => h.student.id);
    back.value = { to: `/assignments/${handIns[0].assignmentId}`, label: 'Back to the assignment' };
    return handIns.map((h) => {
      const twice = students.filter((s) => s === h.student.id).length > 1;
      const name = twice ? `${h.student.name} (${whenText(h.handedInAt)})` : h.student.name;
      const detail = handInAsSketch(h);
      return { detail: { ...detail, name, document: { ...detail.document, name } }, open: `/hand-ins/${h.id}` };
    });
  }

  return {
    variants,
    loading,
    error,
    back,
    tolerance,
    acrossEnds,
    hidden,
    ends,
    matches,
    setTolerance,
    setAcrossEnds,
    toggleHidden,
    load,
  };
});
