import { titled, UNITS } from '@shared/format';
import type { SpectrumMatrix } from '@shared/schemas/spectrum-matrices';
import { chartColours } from '@/components/chart-theme';
import { linearAxis as axis, lineSeries, pointSeries } from '@/components/scatter-chart';
import { linesByConcentration } from './concentration-lines';
import { PlotFigure } from './plot-figure';

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
  return (
    <div className="space-y-2">
      <PlotFigure
        name="Emission spectra at each quencher concentration"
        description="Spectra: intensity against wavelength, one line per [Q]"
        size="h-64"
        datasets={linesByConcentration(plot.wavelengths, plot.spectra, (spectrum) => spectrum.values)}
        scales={{ x: wavelengthAxis, y: axis('Intensity') }}
      />
      <PlotFigure
        name="K_SV against wavelength"
        description="K_SV of each band against its wavelength, with the weighted mean"
        size="h-56"
        datasets={[
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
        ]}
        scales={{ x: wavelengthAxis, y: axis(titled('K_SV', UNITS.perMolar)) }}
      />
    </div>
  );
}
