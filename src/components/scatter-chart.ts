import {
  Chart,
  LinearScale,
  LineController,
  LineElement,
  PointElement,
  ScatterController,
  type Plugin,
} from 'chart.js';
import { formatNumber } from '@shared/format';
import { chartColours } from './chart-theme';

// What every scatter plot draws: points, lines through them, linear axes (chart-theme.ts registers the
// legend and tooltip). Each plot module imports this file, since screens load on their own; chart.js
// keeps one registry, so registering again is harmless. A plot that needs more (Filler, a log axis) adds it.
Chart.register(LinearScale, PointElement, LineElement, ScatterController, LineController);

/**
 * Paints the canvas paper-white under the plot (chart.js leaves it transparent), so a figure saved as
 * PNG reads the same in a report as on screen. Passed to a chart's `plugins` (scatter or bar).
 */
export const paperBackground = {
  id: 'halflightPaperBackground',
  beforeDraw(chart: Chart) {
    const { ctx, width, height } = chart;
    ctx.save();
    ctx.globalCompositeOperation = 'destination-over';
    ctx.fillStyle = chartColours.surface;
    ctx.fillRect(0, 0, width, height);
    ctx.restore();
  },
} satisfies Plugin;

// Tick labels with at most 3 significant figures, so tiny residuals read 2 × 10⁻⁸, not 2.00000000E-8.
const tick = (value: number | string) => (typeof value === 'number' ? formatNumber(value) : value);

/** A linear axis with its title, grid lines in paper and ticks written by `formatNumber`. */
export const linearAxis = (title: string) => ({
  type: 'linear' as const,
  title: { display: true, text: title },
  grid: { color: chartColours.grid },
  ticks: { callback: tick },
});

type Point = { x: number; y: number };

/** Measured points: filled marks of one colour, no line. */
export const pointSeries = (label: string, data: Point[], colour: string, pointRadius = 5) => ({
  label,
  data,
  backgroundColor: colour,
  pointRadius,
});

/** A curve (a fit, a spectrum, a response): a line through the data without marks; chart.js's width unless given. */
export const lineSeries = (label: string, data: Point[], colour: string, borderWidth?: number) => ({
  label,
  data,
  borderColor: colour,
  showLine: true,
  pointRadius: 0,
  ...(borderWidth === undefined ? {} : { borderWidth }),
});

/** Points the chemist left out of the fit: unfilled crosses in brick at the place they would have had. */
export const leftOutSeries = (data: Point[]) => ({
  label: 'Left out',
  data,
  backgroundColor: 'transparent',
  borderColor: chartColours.excluded,
  pointStyle: 'crossRot' as const,
  pointRadius: 7,
  borderWidth: 2,
});
