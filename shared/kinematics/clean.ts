/** How the result writes a number that is round-off of a zero. */

/** Magnitudes below this are round-off of a zero (mm, deg or %) and are written as 0. */
export const OUTPUT_ZERO_TOLERANCE = 1e-10;

/** `v`, or 0 when it is round-off of a zero. */
export const cleanZero = (v: number): number => (Math.abs(v) < OUTPUT_ZERO_TOLERANCE ? 0 : v);
