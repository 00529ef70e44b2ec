/**
 * A hand-in's key numbers as the assignment page shows them. The server reads them from the registry when
 * the work is handed in and sends each in the registry's base unit (mm, degrees, %); here each is shown in
 * the user's unit by the registry entry it names, the way the line-up writes the same quantity, so one
 * number reads alike on both pages. Pure.
 */
import type { KeyNumber } from '../../shared/schema/classes';
import { heaveEntries, limitsEntries, rollEntries } from '../../shared/kinematics/metrics/registry';
import type { AnyEntry } from '../../shared/kinematics/metrics/registry';
import { fixed, showAngle, showLength, showMetric, showPercent, type Shown } from '../../shared/display/format';
import type { LengthUnit } from '../../shared/units';

/** Where along the travel a key number was read, in words (none for a whole-sweep reading). */
export const KEY_NUMBER_AT: Record<string, string> = {
  ride: 'at ride',
  bump: 'at full bump',
  droop: 'at full droop',
};

/** The registry entry a key number names: read at a point of the heave sweep, or over the whole sweep. */
function entryOf(k: Pick<KeyNumber, 'key' | 'at'>): AnyEntry | undefined {
  const pool: readonly AnyEntry[] = k.at in KEY_NUMBER_AT ? heaveEntries : [...limitsEntries, ...rollEntries];
  return pool.find((e) => e.key === k.key);
}

/** Why a key number has no value. */
const NOT_DEFINED = 'Not defined for this hand-in';

/** One key number in the user's unit ("+12.0 mm", "0.42 in", "38.5 %", "4.2°"), or "—" with the reason. */
export function showKeyNumber(k: KeyNumber, u: LengthUnit): Shown {
  const entry = entryOf(k);
  if (entry) return showMetric(entry, k.value, u, NOT_DEFINED);
  // A quantity this client's registry does not know (a newer server): shown by its unit.
  if (k.unit === 'mm') return showLength(k.value, u, NOT_DEFINED);
  if (k.unit === '°' || k.unit === 'deg' || k.unit === 'degrees') return showAngle(k.value, NOT_DEFINED);
  if (k.unit === '%') return showPercent(k.value, NOT_DEFINED);
  if (k.value === null || !Number.isFinite(k.value)) return { text: '—', reason: NOT_DEFINED };
  return { text: `${fixed(k.value, 2)}${k.unit ? ` ${k.unit}` : ''}` };
}

/** A key number's name with where it was read: "Anti-squat at ride", "Articulation". */
export function keyNumberLabel(k: Pick<KeyNumber, 'label' | 'at'>): string {
  return [k.label, KEY_NUMBER_AT[k.at]].filter(Boolean).join(' ');
}

/** A key-number column of the hand-ins table: one quantity at one point of the travel. */
export interface KeyColumn {
  /** `${key}@${at}`: the same quantity at the same point in every row */
  id: string;
  label: string;
}

export const keyColumnId = (k: Pick<KeyNumber, 'key' | 'at'>) => `${k.key}@${k.at}`;

/** The key-number columns the rows hold between them, in the order they first come (the server's order). */
export function keyColumns(rows: readonly { keyNumbers: readonly KeyNumber[] }[]): KeyColumn[] {
  const seen = new Map<string, KeyColumn>();
  for (const row of rows)
    for (const k of row.keyNumbers) {
      const id = keyColumnId(k);
      if (!seen.has(id)) seen.set(id, { id, label: keyNumberLabel(k) });
    }
  return [...seen.values()];
}
