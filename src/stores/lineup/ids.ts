/**
 * Which sketches a line-up compares: the address's ids and their bounds. Pure and apart from the
 * line-up store, so the library can use them without loading the line-up's solver.
 */
/** How many sketches one line-up compares: enough for a choice, few enough to read one plot. */
export const LINEUP_MIN = 2;
export const LINEUP_MAX = 4;

/** The ids in a line-up address (`?ids=3,7,12` or `?handIns=4,9`), or why they cannot be lined up. */
/** What a line-up compares, in the words its refusals use: library sketches, or an assignment's hand-ins. */
export interface LineupWords {
  /** one of them ("sketch") and many ("sketches") */
  one: string;
  many: string;
  /** where they are picked */
  where: string;
}

export const SKETCH_WORDS: LineupWords = { one: 'sketch', many: 'sketches', where: 'in the library' };
export const HAND_IN_WORDS: LineupWords = { one: 'hand-in', many: 'hand-ins', where: "on the assignment's page" };

export function parseLineupIds(
  raw: unknown,
  words: LineupWords = SKETCH_WORDS,
): { ok: true; ids: number[] } | { ok: false; error: string } {
  const text = Array.isArray(raw) ? raw.join(',') : String(raw ?? '');
  const parts = text
    .split(',')
    .map((s) => s.trim())
    .filter(Boolean);
  const ids = parts.map(Number);
  if (ids.some((n) => !Number.isInteger(n) || n <= 0))
    return { ok: false, error: `This line-up address names something that is not a ${words.one}.` };
  const unique = [...new Set(ids)];
  if (unique.length < LINEUP_MIN || unique.length > LINEUP_MAX) {
    return {
      ok: false,
      error: `A line-up compares ${LINEUP_MIN} to ${LINEUP_MAX} ${words.many}; pick them ${words.where}.`,
    };
  }
  return { ok: true, ids: unique };
}
