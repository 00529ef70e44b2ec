/**
 * The build sheet of one sketch: the sketch as saved and its sweep (runSweep, the same result
 * the board shows). Read-only; the sheet is printed, not edited.
 */
import { defineStore } from 'pinia';
import { ref, shallowRef } from 'vue';
import { ApiError, api, errorMessage } from '../api/http';
import { SHARED_LINK_GONE } from './board';
import type { SketchDetail } from '../api/types';
import type { SweepResult } from '../../shared/kinematics/types';
import { sweepOnce } from '../../shared/sheet/sweepOnce';

export const useBuildSheetStore = defineStore('buildSheet', () => {
  const detail = shallowRef<SketchDetail | null>(null);
  const result = shallowRef<SweepResult | null>(null);
  /** why the sketch cannot be swept (the sheet still lists its pivots and members) */
  const problem = ref<string | null>(null);
  /** why the sheet could not open at all */
  const error = ref<string | null>(null);
  const loading = ref(false);

  /** Loads a sketch by id (the owner's) or by its read-only link's token (anyone with the link). */
  async function load(which: { id: number } | { token: string }): Promise<void> {
    loading.value = true;
    error.value = null;
    problem.value = null;
    result.value = null;
    detail.value = null;
    try {
      const url = 'token' in which ? `/api/shared/${encodeURIComponent(which.token)}` : `/api/sketches/${which.id}`;
      detail.value = await api.get<SketchDetail>(url);
    } catch (err) {
      // A read-only link that was revoked is worded as on the board.
      const gone = 'token' in which && err instanceof ApiError && err.status === 404;
      error.value = gone ? SHARED_LINK_GONE : `The build sheet could not open: ${errorMessage(err)}.`;
      return;
    } finally {
      loading.value = false;
    }
    const swept = sweepOnce(detail.value.document);
    result.value = swept.result;
    problem.value = swept.problem;
  }

  return { detail, result, problem, error, loading, load };
});
