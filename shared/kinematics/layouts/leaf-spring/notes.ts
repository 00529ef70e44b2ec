/** The sentences the readout shows for a leaf-spring sketch (they go into the result's `warnings`). */
import type { LeafSpringPlan } from './rows';

/**
 * The readout's sentences for a leaf-spring sketch: the lateral assumption (always), and where the
 * instant centre and anti-squat come from.
 */
export function leafSpringNotes(plan: LeafSpringPlan): string[] {
  return [
    plan.lateralRod
      ? 'Leaf springs with a lateral rod: the leaves and the rod both locate the axle sideways; where they disagree it shows as bind.'
      : 'Leaf springs: the spring leaves locate the axle sideways (there is no lateral rod); each spring swings in its own fore-aft plane, and the roll centre is taken at the spring seat.',
    "Leaf springs: the axle's pitch follows the springs' bending (SAE three-link model); the side-view instant " +
      'centre and anti-squat are those of that equivalent, where its pitch per mm of heave puts them; see the wind-up.',
  ];
}
