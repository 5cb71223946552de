import { Scatter } from 'react-chartjs-2';
import type { FitResult } from '@shared/schemas/study-fits';
import { plotColours } from './chart-setup';

/** tau0/tau against [Q] with the line 1 + K_SV[Q] from the lifetime fit. */
export function LifetimePlot({ lifetime, xLabel, xScale }: { lifetime: NonNullable<FitResult['lifetime']>; xLabel: string; xScale: number }) {
  const maxX = Math.max(...lifetime.points.map((p) => p.x));
  const line = [0, maxX].map((x) => ({ x: x * xScale, y: 1 + lifetime.kSv.value * x }));
  return (
    <figure aria-label="Lifetime plot" className="h-56">
      <Scatter
        data={{ datasets: [
          { label: 'τ0/τ', data: lifetime.points.map((p) => ({ x: p.x * xScale, y: p.y })), backgroundColor: plotColours.points, pointRadius: 5 },
          { showLine: true, label: 'Fit', data: line, borderColor: plotColours.line, pointRadius: 0 },
        ] }}
        options={{ maintainAspectRatio: false, animation: false, scales: { x: { type: 'linear', title: { display: true, text: xLabel } }, y: { title: { display: true, text: 'τ0/τ' } } } }}
      />
    </figure>
  );
}
