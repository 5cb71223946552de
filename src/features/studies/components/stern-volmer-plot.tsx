import { memo } from 'react';
import { Chart, Filler } from 'chart.js';
import type { FitResult } from '@shared/schemas/study-fits';
import { chartColours as plotColours } from '@/components/chart-theme';
import { leftOutSeries, linearAxis as axis } from '@/components/scatter-chart';
import { figureFileName } from '@/components/figure-file-name';
import { SavableScatter } from '@/components/savable-scatter';

interface Props {
  /** the stored plot series: points, line, left-out points and the axes with their units */
  plot: FitResult['plot'];
  /** the study title, for the PNG file names */
  studyTitle: string;
}

// The 95 % band is the area between its upper and lower lines.
Chart.register(Filler);

/**
 * Stern–Volmer plot with the fit line and its 95 % band, and the residuals beneath, drawn from the
 * stored series exactly as the PDF draws them: x × plot.xAxis.scale on an axis titled plot.xAxis.label.
 * Memoised: the screen re-renders as its other parts load, and each new data object made Chart.js
 * lay out and draw every point again.
 */
export const SternVolmerPlot = memo(function SternVolmerPlot({ plot, studyTitle }: Props) {
  const xLabel = plot.xAxis.label;
  const xScale = plot.xAxis.scale;
  const scaled = (points: Array<{ x: number; y: number }>) =>
    points.map((point) => ({ x: point.x * xScale, y: point.y }));
  const data = {
    datasets: [
      {
        showLine: true,
        label: '95 % band',
        data: scaled(plot.line.map((p) => ({ x: p.x, y: p.upper }))),
        borderWidth: 0,
        pointRadius: 0,
        backgroundColor: plotColours.band,
        fill: '+1',
      },
      {
        showLine: true,
        label: 'band lower',
        data: scaled(plot.line.map((p) => ({ x: p.x, y: p.lower }))),
        borderWidth: 0,
        pointRadius: 0,
      },
      {
        showLine: true,
        label: 'Fit',
        data: scaled(plot.line),
        borderColor: plotColours.line,
        borderWidth: 2,
        pointRadius: 0,
      },
      { label: 'Points used', data: scaled(plot.points), backgroundColor: plotColours.points, pointRadius: 5 },
      leftOutSeries(scaled(plot.excluded)),
    ],
  };
  const legend = { labels: { filter: (item: { text: string }) => item.text !== 'band lower' } };
  return (
    <figure aria-label="Stern–Volmer plot" className="space-y-2">
      <SavableScatter
        fileName={figureFileName(studyTitle, 'stern-volmer')}
        what="Stern–Volmer plot"
        height="h-72"
        label={`Stern–Volmer plot: ${plot.yLabel} against ${xLabel}, the points used, the fitted line and its 95 % band; the values are in the points table`}
        data={data}
        options={{ plugins: { legend }, scales: { x: axis(xLabel), y: axis(plot.yLabel) } }}
      />
      <SavableScatter
        fileName={figureFileName(studyTitle, 'residuals')}
        what="residual plot"
        height="h-32"
        label={`Residuals of the fit against ${xLabel}`}
        data={{
          datasets: [
            {
              label: 'Residual',
              data: scaled(plot.points.map((p) => ({ x: p.x, y: p.residual }))),
              backgroundColor: plotColours.line,
              pointRadius: 4,
            },
          ],
        }}
        options={{ plugins: { legend: { display: false } }, scales: { x: axis(xLabel), y: axis('residual') } }}
      />
    </figure>
  );
});
