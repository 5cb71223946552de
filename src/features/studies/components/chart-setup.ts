import { Chart, Filler, Legend, LinearScale, LineController, LineElement, PointElement, ScatterController, Tooltip } from 'chart.js';

// Only what the study plots use, registered once (tree-shaken chart.js).
Chart.register(LinearScale, PointElement, LineElement, ScatterController, LineController, Tooltip, Legend, Filler);

/** Halflight palette for plots (tailwind.config.ts ink/glow/brick). */
export const plotColours = { points: '#f09a27', excluded: '#b23a2e', line: '#1c1938', band: 'rgba(98, 91, 163, 0.18)', grid: '#e7e2d6' };
