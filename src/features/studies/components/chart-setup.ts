import {
  Chart,
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

// Only what the study plots use, registered once (tree-shaken chart.js).
Chart.register(LinearScale, PointElement, LineElement, ScatterController, LineController, Tooltip, Legend, Filler);

/** Halflight palette for plots (tailwind.config.ts ink/glow/brick). */
export const plotColours = {
  points: '#f09a27',
  excluded: '#b23a2e',
  line: '#1c1938',
  band: 'rgba(98, 91, 163, 0.18)',
  grid: '#e7e2d6',
};

/**
 * Paints the canvas paper-white under the plot (chart.js leaves it transparent), so a figure
 * saved as PNG reads the same in a report as on screen. Passed to each study chart's `plugins`.
 */
export const paperBackground: Plugin<'scatter'> = {
  id: 'halflightPaperBackground',
  beforeDraw(chart) {
    const { ctx, width, height } = chart;
    ctx.save();
    ctx.globalCompositeOperation = 'destination-over';
    ctx.fillStyle = '#fcfbf8'; // paper-50 in tailwind.config.ts
    ctx.fillRect(0, 0, width, height);
    ctx.restore();
  },
};
