/** Invented hand-in rows for the classes tests: a workshop class's students, numbers made up for the checks. */
import type { HandInRow, KeyNumber } from '../../../shared/schema/classes';

export const solidAxleKeys = (antiSquat: number | null, lateral: number | null, articulation: number): KeyNumber[] => [
  { key: 'antiSquat', label: 'Anti-squat', at: 'ride', value: antiSquat, unit: '%' },
  { key: 'pinionAngleChange', label: 'Pinion angle change', at: 'bump', value: 1.5, unit: '°' },
  { key: 'lateralShift', label: 'Lateral shift', at: 'bump', value: lateral, unit: 'mm' },
  { key: 'articulation', label: 'Articulation', at: 'articulation', value: articulation, unit: '°' },
];

export function handInRow(id: number, over: Partial<HandInRow> = {}): HandInRow {
  return {
    id,
    assignmentId: 7,
    student: { id: 100 + id, name: `Student ${id}` },
    sketchId: 200 + id,
    version: 3,
    handedInAt: '2026-12-04T16:00:00.000Z',
    late: false,
    keyNumbers: solidAxleKeys(60, 4, 9),
    flagCount: 0,
    missedTargetCount: 0,
    problem: null,
    feedback: null,
    ...over,
  };
}
