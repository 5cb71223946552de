import { Scatter } from 'react-chartjs-2';
import type { FitResult } from '@shared/schemas/study-fits';
import { plotColours } from './chart-setup';

interface Props {
  plot: FitResult['plot'];
  excluded: Array<{ x: number; y: number }>;
  xLabel: string;
  /** concentration axis scale for display, e.g. 1e3 for mM */
  xScale: number;
}

const axis = (title: string) => ({ type: 'linear' as const, title: { display: true, text: title }, grid: { color: plotColours.grid } });

/** Stern–Volmer plot with the fit line and its 95 % band, and the residuals beneath. */
export function SternVolmerPlot({ plot, excluded, xLabel, xScale }: Props) {
  const scaled = (points: Array<{ x: number; y: number }>) => points.map((point) => ({ x: point.x * xScale, y: point.y }));
  const data = {
    datasets: [
      { showLine: true, label: '95 % band', data: scaled(plot.line.map((p) => ({ x: p.x, y: p.upper }))), borderWidth: 0, pointRadius: 0, backgroundColor: plotColours.band, fill: '+1' },
      { showLine: true, label: 'band lower', data: scaled(plot.line.map((p) => ({ x: p.x, y: p.lower }))), borderWidth: 0, pointRadius: 0 },
      { showLine: true, label: 'Fit', data: scaled(plot.line), borderColor: plotColours.line, borderWidth: 2, pointRadius: 0 },
      { label: 'Points used', data: scaled(plot.points), backgroundColor: plotColours.points, pointRadius: 5 },
      { label: 'Left out', data: scaled(excluded), backgroundColor: 'transparent', borderColor: plotColours.excluded, pointStyle: 'crossRot' as const, pointRadius: 7, borderWidth: 2 },
    ],
  };
  const legend = { labels: { filter: (item: { text: string }) => item.text !== 'band lower' } };
  return (
    <figure aria-label="Stern–Volmer plot" className="space-y-2">
      <div className="h-72">
        <Scatter data={data} options={{ maintainAspectRatio: false, animation: false, plugins: { legend }, scales: { x: axis(xLabel), y: axis(plot.yLabel) } }} />
      </div>
      <div className="h-32">
        <Scatter
          aria-label="Residuals"
          data={{ datasets: [{ label: 'Residual', data: scaled(plot.points.map((p) => ({ x: p.x, y: p.residual }))), backgroundColor: plotColours.line, pointRadius: 4 }] }}
          options={{ maintainAspectRatio: false, animation: false, plugins: { legend: { display: false } }, scales: { x: axis(xLabel), y: axis('residual') } }}
        />
      </div>
    </figure>
  );
}
