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
import { chartColours } from '@/components/chart-theme';

// Only what the study plots use, registered once (tree-shaken chart.js).
Chart.register(LinearScale, PointElement, LineElement, ScatterController, LineController, Tooltip, Legend, Filler);

/** Halflight palette for plots (tailwind.config.ts ink/glow/brick), shared with every chart. */
export const plotColours = chartColours;

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
    ctx.fillStyle = chartColours.surface;
    ctx.fillRect(0, 0, width, height);
    ctx.restore();
  },
};
