import { Chart, Legend, Tooltip } from 'chart.js';

/**
 * Halflight's plot look, the same on every chart: Lato (shipped by @fontsource/lato, loaded in
 * main.tsx), text in ink, grid lines in paper, room at the edges so a point on the last tick is
 * drawn whole. Each chart module imports this file once, before drawing: screens load on their
 * own, so no one chart may rely on another's set-up. Colours from tailwind.config.ts.
 */
export const chartColours = {
  /** glow-400: the measured points, as everywhere that marks data */
  points: '#f09a27',
  /** ink-900: fitted lines and curves */
  line: '#1c1938',
  /** ink-500 at 18 %: the 95 % band */
  band: 'rgba(98, 91, 163, 0.18)',
  /** brick-500: left-out points */
  excluded: '#b4432f',
  /** paper-200: grid lines */
  grid: '#ece7db',
  /** ink-700: tick labels and axis titles */
  text: '#3c376c',
  /** paper-50: the surface behind a saved figure */
  surface: '#fcfbf8',
  /** one hue per series where several are compared (glow-500, ink-600, moss-500, brick-500) */
  series: ['#d97d10', '#4d4788', '#3f8a58', '#b4432f'],
};

export const chartFont = "Lato, 'Helvetica Neue', Arial, sans-serif";

// The legend's and tooltip's defaults exist once they are registered; charts that hide the legend say so.
Chart.register(Legend, Tooltip);
Chart.defaults.font.family = chartFont;
Chart.defaults.font.size = 12;
Chart.defaults.color = chartColours.text;
Chart.defaults.borderColor = chartColours.grid;
// A point sitting on the first or last tick overflows the plot area by its radius: leave it room.
Chart.defaults.layout.padding = { top: 10, right: 14, bottom: 2, left: 2 };
Chart.defaults.plugins.legend.labels.usePointStyle = true;
Chart.defaults.plugins.legend.labels.boxHeight = 8;
Chart.defaults.plugins.tooltip.backgroundColor = chartColours.line;
Chart.defaults.plugins.tooltip.titleFont = { family: chartFont, weight: 'bold' };
Chart.defaults.plugins.tooltip.bodyFont = { family: chartFont };
Chart.defaults.set('scale.title', { font: { family: chartFont, size: 12, weight: 'bold' } });
