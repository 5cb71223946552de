import { Scatter } from 'react-chartjs-2';
import { formatNumber, titled, UNITS } from '@shared/format';
import { toMillimolar } from '@shared/units/units';
import type { SpectrumMatrix } from '@shared/schemas/spectrum-matrices';
import { chartColours } from '@/components/chart-theme';
import { linearAxis as axis, lineSeries, pointSeries } from '@/components/scatter-chart';

/** From glow (no quencher) to ink (the most), so the eye reads [Q] from the colour: hex #rrggbb mixed channel by channel. */
function colourAt(share: number): string {
  const from = chartColours.points;
  const to = chartColours.line;
  const channel = (hex: string, k: number) => parseInt(hex.slice(1 + 2 * k, 3 + 2 * k), 16);
  const mixed = [0, 1, 2].map((k) => Math.round(channel(from, k) + (channel(to, k) - channel(from, k)) * share));
  return `rgb(${mixed.join(', ')})`;
}

/**
 * The spectra at each [Q] and, beneath them on the same wavelength axis, K_SV of each band with
 * its ±SE and the weighted mean across the bands (a flat row of points: one emitter).
 */
export function SpectrumMatrixPlots({ matrix }: { matrix: SpectrumMatrix }) {
  const { plot, analysis, reading } = matrix;
  const range = { min: reading.firstWavelength, max: reading.lastWavelength };
  const wavelengthAxis = { ...axis(titled('λ', UNITS.nanometre)), ...range };
  const bands = analysis.bands.filter((band) => band.kSv !== null);
  const errorBar = (sign: 1 | -1) =>
    bands.map((band) => ({ x: band.centre, y: band.kSv!.value + sign * band.kSv!.standardError }));
  const mean = analysis.homogeneity?.weightedMean;
  const highest = Math.max(...plot.spectra.map((spectrum) => spectrum.concentration)) || 1;
  return (
    <div className="space-y-2">
      <figure aria-label="Emission spectra at each quencher concentration" className="relative h-64">
        <Scatter
          aria-label="Spectra: intensity against wavelength, one line per [Q]"
          data={{
            datasets: plot.spectra.map((spectrum) => ({
              ...lineSeries(
                `${formatNumber(toMillimolar(spectrum.concentration), 3)} ${UNITS.millimolar}`,
                plot.wavelengths.map((x, k) => ({ x, y: spectrum.values[k]! })),
                colourAt(spectrum.concentration / highest),
                1.5,
              ),
              backgroundColor: colourAt(spectrum.concentration / highest),
            })),
          }}
          options={{
            maintainAspectRatio: false,
            animation: false,
            scales: { x: wavelengthAxis, y: axis('Intensity') },
          }}
        />
      </figure>
      <figure aria-label="K_SV against wavelength" className="relative h-56">
        <Scatter
          aria-label="K_SV of each band against its wavelength, with the weighted mean"
          data={{
            datasets: [
              pointSeries(
                'K_SV of the band',
                bands.map((band) => ({ x: band.centre, y: band.kSv!.value })),
                chartColours.points,
                4,
              ),
              {
                label: '± SE',
                data: [...errorBar(1), ...errorBar(-1)],
                borderColor: chartColours.line,
                backgroundColor: chartColours.line,
                pointStyle: 'line',
                pointRadius: 5,
              },
              ...(mean === undefined
                ? []
                : [
                    {
                      ...lineSeries(
                        'Weighted mean',
                        [
                          { x: range.min, y: mean },
                          { x: range.max, y: mean },
                        ],
                        chartColours.line,
                        1,
                      ),
                      borderDash: [4, 4],
                    },
                  ]),
            ],
          }}
          options={{
            maintainAspectRatio: false,
            animation: false,
            scales: { x: wavelengthAxis, y: axis(titled('K_SV', UNITS.perMolar)) },
          }}
        />
      </figure>
    </div>
  );
}
