/** Member kinds as the board names them, and the id stem a new member of each kind gets. */
import type { MemberKind } from '../schema/sketch';

export const KIND_OPTIONS: { value: MemberKind; label: string; stem: string }[] = [
  { value: 'link', label: 'link', stem: 'L' },
  { value: 'lateral-rod', label: 'lateral rod', stem: 'LR' },
  { value: 'tie-rod', label: 'tie rod', stem: 'TR' },
  { value: 'shackle', label: 'shackle', stem: 'SK' },
  // A leaf half also names its axle seat point; re-kinding to it is refused until the seat is given.
  { value: 'leaf-half', label: 'leaf spring half', stem: 'LH' },
  { value: 'shock', label: 'shock', stem: 'SH' },
  { value: 'spring', label: 'spring', stem: 'SP' },
  { value: 'hinge', label: 'hinge axis', stem: 'H' },
  // A wishbone arm's ball joint: the arm's point first, the knuckle's second.
  { value: 'ball-joint', label: 'ball joint', stem: 'BJ' },
];

export function kindLabel(kind: string): string {
  return KIND_OPTIONS.find((k) => k.value === kind)?.label ?? kind;
}
