import { describe, expect, it } from 'vitest';
import { starters } from '../../../shared/kinematics';
import { layouts } from '../../../shared/schema/sketchVocabulary';
import { buildSheet } from '../../../shared/sheet/buildSheet';
import { chooseScale, drawView } from '../../../server/services/buildSheetPdf/drawing';
import { placeLabels, type Box } from '../../../server/services/buildSheetPdf/labels';

/** 72 pt to the inch, 25.4 mm to the inch (by definition). */
const PT_PER_MM = 72 / 25.4;

const overlap = (a: Box, b: Box) => a.x < b.x + b.w && b.x < a.x + a.w && a.y < b.y + b.h && b.y < a.y + a.h;

/** The label boxes (white backgrounds) and the texts of a drawing's SVG. */
function parse(svg: string) {
  const boxes = [
    ...svg.matchAll(/<rect x="([\d.-]+)" y="([\d.-]+)" width="([\d.]+)" height="([\d.]+)" fill="#fff"/g),
  ].map((m) => ({ x: +m[1], y: +m[2], w: +m[3], h: +m[4] }));
  const texts = [...svg.matchAll(/<text[^>]*>([^<]*)<\/text>/g)].map((m) => m[1]);
  return { boxes, texts };
}

describe('the build sheet drawings', () => {
  it('take the largest standard scale at which the parts fit the room', () => {
    // 2000 mm across 500 pt: 1:10 would need 2000 / 10 mm = 566.9 pt, 1:20 needs 283.5 pt.
    expect(chooseScale(2000, 100, 500, 400)).toBe(20);
    // 1000 mm across 300 pt: 1:10 needs 283.5 pt.
    expect(chooseScale(1000, 100, 300, 400)).toBe(10);
    // the height limits too: 900 mm high in 200 pt needs 1:20 (255 pt at 1:10).
    expect(chooseScale(100, 900, 500, 200)).toBe(20);
  });

  for (const layout of layouts) {
    it(`label every pivot of a ${layout} in both views, no two labels over each other, inside the drawing`, () => {
      const doc = starters[layout]!.build();
      const sheet = buildSheet(doc, null, null, 'mm');
      const roles = new Map<string, 'frame' | 'moving' | 'reference'>([
        ...sheet.frame.map((p) => [p.id, 'frame'] as const),
        ...sheet.moving.map((p) => [p.id, 'moving'] as const),
        ...sheet.driveline.map((p) => [p.id, 'reference'] as const),
      ]);
      for (const view of ['side', 'cross'] as const) {
        const d = drawView(doc, view, roles, 'mm', 523, 330);
        const { boxes, texts } = parse(d.svg);
        for (const p of doc.points) expect(texts, `${view}: ${p.id}`).toContain(p.id);
        for (let i = 0; i < boxes.length; i++) {
          const b = boxes[i];
          expect(b.x >= 0 && b.y >= 0 && b.x + b.w <= d.width && b.y + b.h <= d.height, `${view} label ${i}`).toBe(
            true,
          );
          for (let j = i + 1; j < boxes.length; j++)
            expect(overlap(b, boxes[j]), `${view}: labels ${i}, ${j}`).toBe(false);
        }
        // The drawing states its scale beside the scale bar.
        expect(texts).toContain(`scale 1:${d.scale} (print at 100 %)`);
      }
    });
  }

  it('draws the track to the scale it states (wheel centre to wheel centre in the cross view)', () => {
    const doc = starters['double-wishbone']!.build();
    const d = drawView(doc, 'cross', new Map(), 'mm', 523, 330);
    const [l, r] = [doc.wheels.left, doc.wheels.right].map((id) => doc.points.find((p) => p.id === id)!);
    // the wheels' centre planes are drawn as dashed vertical lines from the ground
    const xs = [
      ...d.svg.matchAll(
        /<line x1="([\d.]+)" y1="[\d.]+" x2="\1" y2="[\d.]+" stroke="#000" stroke-width="0.4" stroke-dasharray="3 2"/g,
      ),
    ].map((m) => +m[1]);
    expect(xs).toHaveLength(2);
    const drawnPt = Math.abs(xs[0] - xs[1]);
    expect(drawnPt).toBeCloseTo((Math.abs(l.y - r.y) / d.scale) * PT_PER_MM, 1);
  });

  it('sets apart the labels of a crowd of pivots, each joined to its pivot by a leader when moved away', () => {
    const requests = Array.from({ length: 12 }, (_, i) => ({
      x: 200 + (i % 4) * 3,
      y: 100 + Math.floor(i / 4) * 3,
      lines: [`P${i}.fl`],
    }));
    const placed = placeLabels(requests, [], { x: 0, y: 0, w: 400, h: 200 }, 6.5);
    expect(placed).toHaveLength(12);
    for (let i = 0; i < placed.length; i++)
      for (let j = i + 1; j < placed.length; j++) expect(overlap(placed[i].box, placed[j].box)).toBe(false);
    expect(placed.filter((p) => p.leader).length).toBeGreaterThan(6);
  });
});
