/**
 * The product's caution (product.md, "Cautions to show"): Arcwright computes geometry, not
 * strength. Shown on the board (see useCaution) and at the top of the build sheet.
 */

export const CAUTION_TITLE = 'Geometry only';

export const CAUTION_TEXT =
  'Arcwright computes where parts move, not whether they are strong enough. Link, bracket and weld design, ' +
  'rod-end and bushing ratings, and the vehicle’s road legality are for a qualified person and local regulations; ' +
  'a modified suspension must be checked on the vehicle before it is driven.';
