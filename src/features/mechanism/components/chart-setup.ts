import {
  Chart,
  Legend,
  LinearScale,
  LineController,
  LineElement,
  PointElement,
  ScatterController,
  Tooltip,
} from 'chart.js';

// What the mechanism plots use (registration is idempotent; the studies feature registers its own).
Chart.register(LinearScale, PointElement, LineElement, ScatterController, LineController, Tooltip, Legend);

/** Halflight palette (tailwind.config.ts ink/glow/moss). */
export const seriesColours = { measured: '#f09a27', reference: '#1c1938', second: '#4f7a52', grid: '#e7e2d6' };
