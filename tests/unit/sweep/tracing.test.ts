import { describe, expect, it } from 'vitest';
import {
  centreForRect,
  imageRect,
  initialPlacement,
  photoProblem,
  readTracing,
  rescaleFromPicks,
  withTracing,
} from '../../../src/canvas/tracingGeometry';
import type { TracingImage } from '../../../shared/schema/boardFields';
import { UPLOAD_MAX_BYTES } from '../../../shared/schema/requestLimits';
import { screenToPlane, type ViewTransform } from '../../../src/canvas/transform';

/** Positions round-trip through float arithmetic; anything above this would be a real error (mm, px). */
const TOL = 1e-9;

const photo: TracingImage = {
  upload: '0bf04269-3540-4156-8ecc-6a1731167720',
  url: '/api/uploads/0bf04269-3540-4156-8ecc-6a1731167720',
  width: 2000,
  height: 1000,
  centre: { h: 1600, v: 700 },
  mmPerPx: 2.5,
  opacity: 0.5,
  locked: false,
};

const view: ViewTransform = { scale: 0.2, originX: 900, originY: 400 };

/** The plane point (mm) under an image pixel, read from the rectangle drawn on the stage. */
function planeAtImagePx(img: TracingImage, u: number, w: number, t: ViewTransform) {
  const r = imageRect(img, t);
  return screenToPlane(t, { px: r.x + (u / img.width) * r.width, py: r.y + (w / img.height) * r.height });
}

describe('a tracing photo on the side view', () => {
  it('sits centred on its centre, its size the pixels times the scale', () => {
    const r = imageRect(photo, view);
    expect(r.width).toBeCloseTo(2000 * 2.5 * 0.2, 9);
    expect(r.height).toBeCloseTo(1000 * 2.5 * 0.2, 9);
    const c = screenToPlane(view, { px: r.x + r.width / 2, py: r.y + r.height / 2 });
    expect(Math.abs(c.h - 1600)).toBeLessThan(TOL);
    expect(Math.abs(c.v - 700)).toBeLessThan(TOL);
  });

  it('is drawn unmirrored: its right-hand pixels lie towards the rear (h grows to the left on screen)', () => {
    const left = planeAtImagePx(photo, 0, 500, view);
    const right = planeAtImagePx(photo, 2000, 500, view);
    expect(left.h).toBeGreaterThan(right.h);
  });

  it('moves to where a drag leaves its corner', () => {
    const r = imageRect(photo, view);
    const moved = centreForRect(photo, view, r.x + 40, r.y - 20);
    // 40 px right and 20 px up at 0.2 px/mm: 200 mm towards the rear, 100 mm higher.
    expect(moved.h).toBeCloseTo(1600 - 200, 9);
    expect(moved.v).toBeCloseTo(700 + 100, 9);
  });

  it('takes its scale from two picked points and their real distance, the first point staying put', () => {
    // Two wheel centres on the photo, 1300 px apart; the vehicle's wheelbase is 3250 mm.
    const a = planeAtImagePx(photo, 300, 800, view);
    const b = planeAtImagePx(photo, 1600, 800, view);
    const out = rescaleFromPicks(photo, a, b, 3250);
    expect(out.ok).toBe(true);
    if (!out.ok) return;
    expect(out.image.mmPerPx).toBeCloseTo(3250 / 1300, 12);
    const a2 = planeAtImagePx(out.image, 300, 800, view);
    const b2 = planeAtImagePx(out.image, 1600, 800, view);
    expect(Math.hypot(a2.h - a.h, a2.v - a.v)).toBeLessThan(1e-6);
    expect(Math.hypot(b2.h - a2.h, b2.v - a2.v)).toBeCloseTo(3250, 6);
  });

  it('refuses a scale from points on top of each other, or a distance that is not a length', () => {
    const a = planeAtImagePx(photo, 300, 800, view);
    const near = planeAtImagePx(photo, 301, 800, view);
    expect(rescaleFromPicks(photo, a, near, 3250)).toMatchObject({ ok: false });
    expect(rescaleFromPicks(photo, a, planeAtImagePx(photo, 1600, 800, view), 0)).toMatchObject({
      ok: false,
      error: 'The real distance must be a length above zero.',
    });
  });

  it('starts about the size of a vehicle of that wheelbase, standing on the ground', () => {
    const p = initialPlacement('side', 2000, 1000, { wheelbase: 3250, track: 1580 });
    expect(p.mmPerPx * 2000).toBeCloseTo(1.6 * 3250, 9);
    expect(p.centre.v - (1000 * p.mmPerPx) / 2).toBeCloseTo(0, 9);
  });
});

describe('what may be a tracing', () => {
  it('takes PNG and JPEG up to 10 MB and names the problem otherwise', () => {
    expect(photoProblem({ type: 'image/png', size: 1000, name: 'frame.png' })).toBeNull();
    expect(photoProblem({ type: 'image/jpeg', size: UPLOAD_MAX_BYTES, name: 'frame.jpg' })).toBeNull();
    expect(photoProblem({ type: 'image/gif', size: 1000, name: 'frame.gif' })).toBe(
      '“frame.gif” is not a PNG or JPEG photo.',
    );
    expect(photoProblem({ type: 'image/png', size: UPLOAD_MAX_BYTES + 1, name: 'big.png' })).toBe(
      '“big.png” is 10.0 MB; a tracing may be up to 10 MB.',
    );
  });

  it('reads the document field per view, ignoring a malformed one, and writes it back', () => {
    expect(readTracing({ tracing: { side: photo } }, 'side')).toEqual(photo);
    expect(readTracing({ tracing: { side: { ...photo, opacity: 3 } } }, 'side')).toBeNull();
    expect(readTracing({}, 'side')).toBeNull();
    expect(withTracing({ tracing: { side: photo } }, 'side', null)).toBeUndefined();
    expect(withTracing({}, 'rear', photo)).toEqual({ rear: photo });
  });
});
