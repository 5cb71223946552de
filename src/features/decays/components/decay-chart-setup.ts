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
