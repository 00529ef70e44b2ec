/**
 * The board's views as one PNG picture: each view's stage drawn at twice its screen resolution, side by
 * side on a white background, each under its title, so the picture reads the same printed or pasted into
 * a document whatever the page's own background.
 */
import type { ViewStage } from '../composables/useViewStage';

/** Pixels per screen pixel: sharp enough to print and to zoom into. */
export const VIEW_IMAGE_PIXEL_RATIO = 2;
/** Screen px around and between the views, and the height of a line of text (the caption, a view's title). */
const GAP_PX = 16;
const LINE_PX = 24;

/** One PNG of the given views under `caption` (the sketch's name); rejects when no view is drawn. */
export async function viewsPng(views: ViewStage[], caption: string): Promise<Blob> {
  const shots = views.flatMap((v) => {
    const stage = v.stage();
    return stage ? [{ title: v.title(), canvas: stage.toCanvas({ pixelRatio: VIEW_IMAGE_PIXEL_RATIO }) }] : [];
  });
  if (!shots.length) throw new Error('No view is drawn to take a picture of.');
  const r = VIEW_IMAGE_PIXEL_RATIO;
  const top = (GAP_PX + 2 * LINE_PX) * r;
  const out = document.createElement('canvas');
  out.width = shots.reduce((w, s) => w + s.canvas.width, 0) + GAP_PX * r * (shots.length + 1);
  out.height = top + Math.max(...shots.map((s) => s.canvas.height)) + GAP_PX * r;
  const ctx = out.getContext('2d');
  if (!ctx) throw new Error('This browser cannot draw the picture.');
  ctx.fillStyle = '#ffffff';
  ctx.fillRect(0, 0, out.width, out.height);
  ctx.fillStyle = '#1d2a33';
  ctx.textBaseline = 'middle';
  ctx.font = `600 ${15 * r}px sans-serif`;
  ctx.fillText(caption, GAP_PX * r, (GAP_PX + LINE_PX / 2) * r);
  ctx.font = `${13 * r}px sans-serif`;
  let x = GAP_PX * r;
  for (const s of shots) {
    ctx.fillText(s.title, x, (GAP_PX + (LINE_PX * 3) / 2) * r);
    ctx.drawImage(s.canvas, x, top);
    x += s.canvas.width + GAP_PX * r;
  }
  return new Promise((resolve, reject) =>
    out.toBlob((b) => (b ? resolve(b) : reject(new Error('This browser cannot make a PNG.'))), 'image/png'),
  );
}
