import {
  Chart,
  Legend,
  LinearScale,
  LineController,
  LineElement,
  LogarithmicScale,
  PointElement,
  ScatterController,
  Tooltip,
  type Plugin,
} from 'chart.js';
import { chartAsSvg } from '@/components/chart-svg';

// The decay plots add the log counts axis to what the other plots register (chart.js keeps one registry).
Chart.register(
  LinearScale,
  LogarithmicScale,
  PointElement,
  LineElement,
  ScatterController,
  LineController,
  Tooltip,
  Legend,
);

/** Halflight palette (tailwind.config.ts): glow for counts, ink for the fit, a quiet violet for the response. */
export const decayColours = {
  counts: 'rgba(240, 154, 39, 0.55)',
  fit: '#1c1938',
  response: '#625ba3',
  residual: '#b23a2e',
  zero: '#8f8aa6',
};

/** Paper-white under the plot, so a saved PNG reads as on screen (paper-50 in tailwind.config.ts). */
export const paperUnderPlot: Plugin<'scatter'> = {
  id: 'halflightDecayPaper',
  beforeDraw(chart) {
    const { ctx, width, height } = chart;
    ctx.save();
    ctx.globalCompositeOperation = 'destination-over';
    ctx.fillStyle = '#fcfbf8';
    ctx.fillRect(0, 0, width, height);
    ctx.restore();
  },
};

const fileStem = (name: string) => name.replace(/[^\p{L}\p{N}]+/gu, '-').replace(/^-|-$/g, '');

function saveAs(href: string, fileName: string) {
  const link = document.createElement('a');
  link.href = href;
  link.download = fileName;
  link.click();
}

/** Saves a chart's canvas as PNG under a file name made from its parts. */
export function saveChartPng(chart: Chart | null, name: string) {
  if (chart) saveAs(chart.toBase64Image('image/png', 1), `${fileStem(name)}.png`);
}

/** Saves the same figure as SVG (vectors; the marks carry their plotted values). */
export function saveChartSvg(chart: Chart | null, name: string) {
  if (!chart) return;
  const url = URL.createObjectURL(new Blob([chartAsSvg(chart, name)], { type: 'image/svg+xml' }));
  saveAs(url, `${fileStem(name)}.svg`);
  window.setTimeout(() => URL.revokeObjectURL(url), 10_000);
}
