import { useRef } from 'react';
import type { Chart } from 'chart.js';
import { Scatter } from 'react-chartjs-2';
import type { DecayCurves } from '@shared/schemas/decays';
import { toNanoseconds } from '@shared/units/units';
import { decayColours, paperUnderPlot } from './decay-chart-setup';
import { figureFileName } from '@/components/figure-file-name';
import { SavePngButton } from '@/components/save-png-button';
import { lineSeries, pointSeries } from '@/components/scatter-chart';

/**
 * One decay: counts on a log axis with the measured response and the fitted curve; below,
 * the weighted residuals (c - m)/sqrt(m) and their autocorrelation, which should scatter
 * around zero without pattern when the model holds.
 */
export function DecayPlot({ curves, title }: { curves: DecayCurves; title: string }) {
  const main = useRef<Chart<'scatter'>>(null);
  const residualChart = useRef<Chart<'scatter'>>(null);
  const timeNs = curves.time.map(toNanoseconds);
  const positive = (values: ReadonlyArray<number | null>) =>
    values.flatMap((value, i) => (value !== null && value > 0 ? [{ x: timeNs[i]!, y: value }] : []));
  const start = curves.startChannel ?? 0;
  const residuals = (curves.weightedResiduals ?? []).map((value, i) => ({ x: timeNs[start + i]!, y: value }));
  const autocorrelation = (curves.autocorrelation ?? []).map((value, lag) => ({ x: lag, y: value }));
  // The decay and its residual strip share one time axis, the file's first to last channel. Left to
  // itself Chart.js rounds each axis out to its own tick step, and the narrower strip (or a saved
  // figure) took a coarser step: data ending at 10,230 ns got an axis to 12,000 or 15,000 ns.
  const timeAxis = {
    type: 'linear' as const,
    min: timeNs[0],
    max: timeNs[timeNs.length - 1],
    ticks: { includeBounds: false },
    title: { display: true, text: 'time (ns)' },
  };
  return (
    <figure aria-label={`Decay plot of ${curves.label}`} className="space-y-2">
      <div className="flex justify-end">
        <SavePngButton
          chart={main}
          fileName={figureFileName(`${title} ${curves.label}`, 'decay')}
          what={`decay of ${curves.label}`}
        />
      </div>
      <div className="relative h-64">
        <Scatter
          ref={main}
          plugins={[paperUnderPlot]}
          data={{
            datasets: [
              pointSeries('Counts', positive(curves.counts), decayColours.counts, 1.2),
              ...(curves.response
                ? [lineSeries('Response (IRF)', positive(curves.response), decayColours.response, 1)]
                : []),
              ...(curves.model ? [lineSeries('Fit', positive(curves.model), decayColours.fit, 1.5)] : []),
            ],
          }}
          options={{
            maintainAspectRatio: false,
            animation: false,
            scales: {
              x: timeAxis,
              y: { type: 'logarithmic', min: 1, title: { display: true, text: 'counts per channel' } },
            },
          }}
        />
      </div>
      {residuals.length > 0 && (
        <div className="grid gap-2 md:grid-cols-2 md:items-end">
          <div className="min-w-0 space-y-2">
            <div className="flex justify-end">
              <SavePngButton
                chart={residualChart}
                fileName={figureFileName(`${title} ${curves.label}`, 'decay-residuals')}
                what={`weighted residuals of ${curves.label}`}
              />
            </div>
            <div className="relative h-36">
              <Scatter
                ref={residualChart}
                plugins={[paperUnderPlot]}
                data={{
                  datasets: [
                    {
                      label: 'Weighted residuals',
                      data: residuals,
                      backgroundColor: decayColours.residual,
                      pointRadius: 1,
                    },
                  ],
                }}
                options={{
                  maintainAspectRatio: false,
                  animation: false,
                  plugins: { legend: { display: false } },
                  scales: {
                    x: timeAxis,
                    y: { title: { display: true, text: '(c − m)/√m' } },
                  },
                }}
              />
            </div>
          </div>
          <div className="relative h-36">
            <Scatter
              plugins={[paperUnderPlot]}
              data={{
                datasets: [lineSeries('Autocorrelation', autocorrelation, decayColours.fit, 1)],
              }}
              options={{
                maintainAspectRatio: false,
                animation: false,
                plugins: { legend: { display: false } },
                scales: {
                  // likewise from the first lag to the last, not out to the next round number
                  x: {
                    type: 'linear',
                    min: 0,
                    max: Math.max(1, autocorrelation.length - 1),
                    ticks: { includeBounds: false },
                    title: { display: true, text: 'lag (channels)' },
                  },
                  y: { min: -1, max: 1, title: { display: true, text: 'autocorrelation' } },
                },
              }}
            />
          </div>
        </div>
      )}
    </figure>
  );
}
