/**
 * Two small Chart.js plugins for the travel plots: the shared cursor (a vertical line at the
 * slider position, with a dot on each curve) and the target bands (shaded, red where the
 * target is missed). Each chart gets its own instances reading its own state through a
 * getter, so moving the slider only redraws (chart.draw()), it does not re-run the layout.
 * Only types come from chart.js here; the library itself loads with the plot chunk.
 */
import type { Chart, Plugin } from 'chart.js';
import type { PlotBand } from './plots';

export interface CursorState {
  /** x of the cursor in plot units, null for none */
  x: number | null;
  /** y of each curve at the cursor (null: no dot) */
  dots: Array<{ y: number | null; color: string }>;
  color: string;
}

export function cursorPlugin(state: () => CursorState): Plugin<'line'> {
  return {
    id: 'awCursor',
    afterDatasetsDraw(chart: Chart<'line'>) {
      const s = state();
      if (s.x === null) return;
      const { ctx, chartArea: area, scales } = chart;
      const px = scales.x.getPixelForValue(s.x);
      if (!(px >= area.left - 0.5 && px <= area.right + 0.5)) return;
      ctx.save();
      ctx.strokeStyle = s.color;
      ctx.lineWidth = 1.5;
      ctx.beginPath();
      ctx.moveTo(px, area.top);
      ctx.lineTo(px, area.bottom);
      ctx.stroke();
      for (const d of s.dots) {
        if (d.y === null) continue;
        const py = scales.y.getPixelForValue(d.y);
        if (!(py >= area.top && py <= area.bottom)) continue;
        ctx.fillStyle = d.color;
        ctx.beginPath();
        ctx.arc(px, py, 3.5, 0, Math.PI * 2);
        ctx.fill();
      }
      ctx.restore();
    },
  };
}

export interface BandColors {
  met: string;
  missed: string;
  edge: string;
}

export function bandsPlugin(bands: () => PlotBand[], colors: BandColors): Plugin<'line'> {
  return {
    id: 'awBands',
    beforeDatasetsDraw(chart: Chart<'line'>) {
      const list = bands();
      if (!list.length) return;
      const { ctx, chartArea: area, scales } = chart;
      ctx.save();
      for (const b of list) {
        const left = b.xMin === undefined ? area.left : Math.max(area.left, scales.x.getPixelForValue(b.xMin));
        const right = b.xMax === undefined ? area.right : Math.min(area.right, scales.x.getPixelForValue(b.xMax));
        // y pixels grow downwards: the band's upper end is the smaller pixel.
        const top = b.yMax === undefined ? area.top : Math.max(area.top, scales.y.getPixelForValue(b.yMax));
        const bottom = b.yMin === undefined ? area.bottom : Math.min(area.bottom, scales.y.getPixelForValue(b.yMin));
        if (!(right > left && bottom > top)) continue;
        ctx.fillStyle = b.missed ? colors.missed : colors.met;
        ctx.fillRect(left, top, right - left, bottom - top);
        ctx.strokeStyle = colors.edge;
        ctx.setLineDash([4, 3]);
        ctx.lineWidth = 1;
        ctx.beginPath();
        if (b.yMax !== undefined) {
          ctx.moveTo(left, top);
          ctx.lineTo(right, top);
        }
        if (b.yMin !== undefined) {
          ctx.moveTo(left, bottom);
          ctx.lineTo(right, bottom);
        }
        ctx.stroke();
      }
      ctx.restore();
    },
  };
}
