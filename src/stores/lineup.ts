/**
 * The line-up: two to four sketches side by side, read-only. It loads them from the API,
 * sweeps each with runSweep (the very result the board shows for it), and builds the bracket
 * list of their frame pivots. It edits nothing: a variant is changed on its own board.
 */
import { defineStore } from 'pinia';
import { computed, ref, shallowRef } from 'vue';
import { api, errorMessage } from '../api/http';
import { sweepOnce } from '../../shared/sheet/sweepOnce';
import type { SketchDetail } from '../api/types';
import type { SweepResult } from '../../shared/kinematics/types';
import { bracketList } from '../../shared/lineup/brackets';
import { parseLineupIds } from './lineup/ids';

export interface LineupVariant {
  detail: SketchDetail;
  /** the sweep, or null with the reason when the sketch cannot be swept */
  result: SweepResult | null;
  problem: string | null;
}

export const useLineupStore = defineStore('lineup', () => {
  const variants = shallowRef<LineupVariant[]>([]);
  const loading = ref(false);
  /** why the line-up could not open (a missing sketch, a bad address) */
  const error = ref<string | null>(null);

  const brackets = computed(() => bracketList(variants.value.map((v) => v.detail.document)));

  async function load(raw: unknown): Promise<void> {
    error.value = null;
    const parsed = parseLineupIds(raw);
    if (!parsed.ok) {
      variants.value = [];
      error.value = parsed.error;
      return;
    }
    loading.value = true;
    try {
      const details = await Promise.all(parsed.ids.map((id) => api.get<SketchDetail>(`/api/sketches/${id}`)));
      variants.value = details.map((detail) => ({ detail, ...sweepOnce(detail.document) }));
    } catch (err) {
      variants.value = [];
      error.value = `The line-up could not open: ${errorMessage(err)}.`;
    } finally {
      loading.value = false;
    }
  }

  return { variants, loading, error, brackets, load };
});
