import { titled, UNITS } from '@shared/format';
import type { AbsorptionAnalysisAnswer, AbsorptionPlot } from '@shared/schemas/absorption-titrations';
import { chartColours } from '@/components/chart-theme';
import { linearAxis as axis, lineSeries, pointSeries } from '@/components/scatter-chart';
import { linesByConcentration } from './concentration-lines';
import { PlotFigure } from './plot-figure';

// The spectra as measured and as differences (the quencher's own absorbance taken out), side by side.
const SPECTRA_VIEWS = [
  {
    key: 'values',
    name: 'Absorption spectra at each quencher concentration',
    description: 'Absorbance against wavelength, one line per [Q]',
    yTitle: 'Absorbance',
  },
  {
    key: 'differences',
    name: 'Difference spectra',
    description: "Change in absorbance against wavelength after taking out the quencher's own absorbance",
    yTitle: 'ΔA',
  },
] as const;

/**
 * The absorption spectra at each [Q], the difference spectra (quencher's own absorbance taken
 * out) on the same wavelength axis, and the Benesi–Hildebrand plot of the band of largest change.
 */
export function AbsorptionPlots({ plot, analysis }: { plot: AbsorptionPlot; analysis: AbsorptionAnalysisAnswer }) {
  const range = { min: plot.wavelengths[0], max: plot.wavelengths.at(-1) };
  const wavelengthAxis = { ...axis(titled('λ', UNITS.nanometre)), ...range };
  const bh = analysis.binding?.benesiHildebrand.fit ?? null;
  const xs = bh ? bh.points.map((point) => point.x) : [];
  return (
    <div className="grid gap-3 lg:grid-cols-2">
      {SPECTRA_VIEWS.map(({ key, name, description, yTitle }) => (
        <PlotFigure
          key={key}
          name={name}
          description={description}
          size="h-60"
          datasets={linesByConcentration(plot.wavelengths, plot.spectra, (spectrum) => spectrum[key])}
          scales={{ x: wavelengthAxis, y: axis(yTitle) }}
        />
      ))}
      {bh && (
        <PlotFigure
          name="Benesi–Hildebrand plot"
          description="1/ΔA against 1/[Q] at the band of largest change, with the fitted line"
          size="h-60 lg:col-span-2"
          datasets={[
            pointSeries('1/ΔA', bh.points, chartColours.points, 4),
            lineSeries(
              'Line',
              [0, Math.max(...xs)].map((x) => ({ x, y: bh.intercept.value + bh.slope.value * x })),
              chartColours.line,
              1.5,
            ),
          ]}
          scales={{ x: { ...axis(titled('1/[Q]', UNITS.perMolar)), min: 0 }, y: axis('1/ΔA') }}
        />
      )}
    </div>
  );
}
