import { memo } from 'react';
import type { FitResult } from '@shared/schemas/study-fits';
import { chartColours as plotColours } from '@/components/chart-theme';
import { figureFileName } from '@/components/figure-file-name';
import { SavableScatter } from '@/components/savable-scatter';
import { leftOutSeries, lineSeries, pointSeries } from '@/components/scatter-chart';

/** tau0/tau against [Q] with the line 1 + K_SV[Q] from the lifetime fit, on the stored series' axis (memoised like SternVolmerPlot). */
export const LifetimePlot = memo(function LifetimePlot({
  lifetime,
  studyTitle,
}: {
  lifetime: NonNullable<FitResult['lifetime']>;
  studyTitle: string;
}) {
  const { label: xLabel, scale: xScale } = lifetime.xAxis;
  const excluded = lifetime.excluded ?? [];
  const maxX = Math.max(...lifetime.points.map((p) => p.x), ...excluded.map((p) => p.x));
  const line = [0, maxX].map((x) => ({ x: x * xScale, y: 1 + lifetime.kSv.value * x }));
  return (
    <figure aria-label="Lifetime plot" className="space-y-2">
      <SavableScatter
        fileName={figureFileName(studyTitle, 'lifetimes')}
        what="lifetime plot"
        height="h-56"
        label={`Lifetime plot: τ0/τ against ${xLabel} with the fitted line; the lifetimes are in the points table`}
        data={{
          datasets: [
            pointSeries(
              'τ0/τ',
              lifetime.points.map((p) => ({ x: p.x * xScale, y: p.y })),
              plotColours.points,
            ),
            lineSeries('Fit', line, plotColours.line),
            // left out by the chemist: unfilled crosses at their plotted place, as on the Stern–Volmer plot
            ...(excluded.length ? [leftOutSeries(excluded.map((p) => ({ x: p.x * xScale, y: p.y })))] : []),
          ],
        }}
        options={{
          scales: {
            x: { type: 'linear', title: { display: true, text: xLabel } },
            y: { title: { display: true, text: 'τ0/τ' } },
          },
        }}
      />
    </figure>
  );
});
