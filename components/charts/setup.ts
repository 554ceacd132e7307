'use client';

// Chart.js pieces used by Outturn's charts, registered once, and the shared look.
import {
  BarController,
  BarElement,
  CategoryScale,
  Chart as ChartJS,
  Filler,
  Legend,
  LinearScale,
  LineController,
  LineElement,
  PointElement,
  ScatterController,
  Tooltip,
  type Plugin,
} from 'chart.js';

ChartJS.register(BarController, BarElement, CategoryScale, Filler, Legend, LinearScale);
ChartJS.register(LineController, LineElement, PointElement, ScatterController, Tooltip);
ChartJS.defaults.font.family = 'var(--font-inter), system-ui, sans-serif';
ChartJS.defaults.font.size = 11;
ChartJS.defaults.color = '#4a5261';
ChartJS.defaults.borderColor = '#e6e1d6';
ChartJS.defaults.animation = false;

export const COLORS = {
  cost: '#16607a',
  costLight: 'rgba(22, 96, 122, 0.28)',
  costBand: 'rgba(22, 96, 122, 0.14)',
  time: '#7a3f86',
  timeLight: 'rgba(122, 63, 134, 0.28)',
  timeBand: 'rgba(122, 63, 134, 0.14)',
  caution: '#b7791f',
  ink: '#1d2430',
  inkSoft: '#4a5261',
  rule: '#d9d3c5',
  compare: '#b7791f',
};

export type Marker = { value: number; label: string; color: string; dash?: number[]; axis?: 'x' | 'y' };

/**
 * Draws labelled reference lines (P50, P80, a target…) across the plot area, vertical at an x
 * value or horizontal at a y value. Markers come in through `options.plugins.markers.lines`.
 */
export const markerPlugin: Plugin = {
  id: 'markers',
  afterDatasetsDraw(chart, _args, options) {
    const lines = (options as { lines?: Marker[] }).lines ?? [];
    const { ctx, chartArea: area, scales } = chart;
    ctx.save();
    lines.forEach((m, i) => {
      const vertical = (m.axis ?? 'x') === 'x';
      const scale = vertical ? scales.x : scales.y;
      if (!scale) return;
      const at = scale.getPixelForValue(m.value);
      if (vertical ? at < area.left || at > area.right : at < area.top || at > area.bottom) return;
      ctx.strokeStyle = m.color;
      ctx.lineWidth = 1.5;
      ctx.setLineDash(m.dash ?? []);
      ctx.beginPath();
      if (vertical) {
        ctx.moveTo(at, area.top);
        ctx.lineTo(at, area.bottom);
      } else {
        ctx.moveTo(area.left, at);
        ctx.lineTo(area.right, at);
      }
      ctx.stroke();
      ctx.setLineDash([]);
      ctx.font = '600 11px system-ui, sans-serif';
      // Stagger vertical markers' labels so that close markers stay readable.
      const right = vertical ? at > area.right - 90 : true;
      const x = vertical ? at + (right ? -4 : 4) : area.right - 4;
      const y = vertical ? area.top + 12 + (i % 3) * 14 : at - 4;
      const width = ctx.measureText(m.label).width;
      // A paper-coloured box behind the text keeps it legible over bars and curves.
      ctx.fillStyle = 'rgba(255, 253, 248, 0.85)';
      ctx.fillRect(right ? x - width - 2 : x - 2, y - 10, width + 4, 13);
      ctx.fillStyle = m.color;
      ctx.textAlign = right ? 'right' : 'left';
      ctx.fillText(m.label, x, y);
    });
    ctx.restore();
  },
};

ChartJS.register(markerPlugin);
