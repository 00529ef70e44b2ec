/**
 * The linkage at the slider position, for the ghost drawing: every point of the shown sketch
 * placed by the body poses of the sweep row at the cursor (the sweep store's), or null while
 * the sliders sit at ride height, no roll, straight ahead (then the ghost would only cover the
 * linkage itself). At the steer slider the steering input's frame points move too, and `row`
 * (the heave or roll row the overlays draw their geometry from) is null: the steer sweep's
 * turned wheels are drawn from `steering` instead.
 */
import { computed } from 'vue';
import { pointsAt } from '../../shared/kinematics/points';
import { useBoardStore } from '../stores/board';
import { useSweepStore } from '../stores/sweep';
import type { Vec3 } from '../../shared/vec3';

export function useBoardGhost() {
  const board = useBoardStore();
  const sweep = useSweepStore();
  const atRide = computed(() => sweep.cursor.travel === 0 && sweep.cursor.roll === 0 && sweep.cursor.steer === 0);
  const ghost = computed<Record<string, Vec3> | null>(() => {
    const sketch = board.sketch;
    if (!sketch || atRide.value) return null;
    if (sweep.steering) return sweep.steerPoints;
    if (!sweep.rowAtCursor) return null;
    return pointsAt(sketch, sweep.bodiesAtCursor);
  });
  return { ghost, row: computed(() => sweep.rowAtCursor), atRide, steering: computed(() => sweep.steering) };
}
