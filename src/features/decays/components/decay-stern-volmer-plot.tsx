import { useRef } from 'react';
import type { Chart } from 'chart.js';
import { Scatter } from 'react-chartjs-2';
import type { DecaySternVolmer } from '@shared/schemas/decays';
import { formatNumber } from '@shared/format';
import { toMillimolar, toNanoseconds } from '@shared/units/units';
import { decayColours, paperUnderPlot } from './decay-chart-setup';
import { figureFileName } from '@/components/figure-file-name';
import { SavePngButton } from '@/components/save-png-button';
import { lineSeries, pointSeries } from '@/components/scatter-chart';

/** tau0/tau against [Q] from the fitted lifetimes, with tau0 and the lifetime K_SV. */
export function DecaySternVolmerPlot({ sternVolmer, title }: { sternVolmer: DecaySternVolmer; title: string }) {
  const chart = useRef<Chart<'scatter'>>(null);
  const maxQ = Math.max(...sternVolmer.points.map((point) => point.concentration));
  return (
    <figure aria-label="Lifetime Stern–Volmer plot" className="space-y-2">
      <dl className="flex flex-wrap gap-6 text-body">
        <div>
          <dt className="text-caption text-ink-500">τ0 from the blank decay</dt>
          <dd aria-label="Decay τ0" className="font-bold tabular-nums">
            {formatNumber(toNanoseconds(sternVolmer.tau0.value), 4)} ±{' '}
            {formatNumber(toNanoseconds(sternVolmer.tau0.standardError), 2)} ns
          </dd>
        </div>
        <div>
          <dt className="text-caption text-ink-500">Lifetime K_SV</dt>
          <dd aria-label="Lifetime K_SV" className="font-bold tabular-nums">
            {formatNumber(sternVolmer.kSv.value, 4)} ± {formatNumber(sternVolmer.kSv.standardError, 2)} M⁻¹
          </dd>
        </div>
      </dl>
      <div className="flex justify-end">
        <SavePngButton
          chart={chart}
          fileName={figureFileName(title, 'lifetime-stern-volmer')}
          what="lifetime Stern–Volmer plot"
        />
      </div>
      <div className="relative h-56">
        <Scatter
          ref={chart}
          plugins={[paperUnderPlot]}
          data={{
            datasets: [
              pointSeries(
                'τ0/τ',
                sternVolmer.points.map((point) => ({ x: toMillimolar(point.concentration), y: point.ratio })),
                decayColours.counts.replace('0.55', '1'),
              ),
              lineSeries(
                '1 + K_SV[Q]',
                [0, maxQ].map((q) => ({ x: toMillimolar(q), y: 1 + sternVolmer.kSv.value * q })),
                decayColours.fit,
              ),
            ],
          }}
          options={{
            maintainAspectRatio: false,
            animation: false,
            scales: {
              x: { type: 'linear', title: { display: true, text: '[Q] (mM)' } },
              y: { title: { display: true, text: 'τ0/τ' } },
            },
          }}
        />
      </div>
    </figure>
  );
}
