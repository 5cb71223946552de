import { Scatter } from 'react-chartjs-2';
import { formatNumber, titled, UNITS } from '@shared/format';
import { toMillimolar } from '@shared/units/units';
import type { AbsorptionAnalysisAnswer, AbsorptionPlot } from '@shared/schemas/absorption-titrations';
import { chartColours } from '@/components/chart-theme';
import { linearAxis as axis } from '@/components/scatter-chart';

/** From glow (no quencher) to ink (the most): hex #rrggbb mixed channel by channel. */
function colourAt(share: number): string {
  const channel = (hex: string, k: number) => parseInt(hex.slice(1 + 2 * k, 3 + 2 * k), 16);
  const [from, to] = [chartColours.points, chartColours.line];
  const mixed = [0, 1, 2].map((k) => Math.round(channel(from, k) + (channel(to, k) - channel(from, k)) * share));
  return `rgb(${mixed.join(', ')})`;
}

const chartOptions = (x: object, yTitle: string) => ({
  maintainAspectRatio: false,
  animation: false as const,
  scales: { x, y: axis(yTitle) },
});

/**
 * The absorption spectra at each [Q], the difference spectra (quencher's own absorbance taken
 * out) on the same wavelength axis, and the Benesi–Hildebrand plot of the band of largest change.
 */
export function AbsorptionPlots({ plot, analysis }: { plot: AbsorptionPlot; analysis: AbsorptionAnalysisAnswer }) {
  const range = { min: plot.wavelengths[0], max: plot.wavelengths.at(-1) };
  const wavelengthAxis = { ...axis(titled('λ', UNITS.nanometre)), ...range };
  const highest = Math.max(...plot.spectra.map((spectrum) => spectrum.concentration)) || 1;
  const lines = (key: 'values' | 'differences') =>
    plot.spectra.map((spectrum) => ({
      label: `${formatNumber(toMillimolar(spectrum.concentration), 3)} ${UNITS.millimolar}`,
      data: plot.wavelengths.map((x, k) => ({ x, y: spectrum[key][k]! })),
      borderColor: colourAt(spectrum.concentration / highest),
      backgroundColor: colourAt(spectrum.concentration / highest),
      showLine: true,
      pointRadius: 0,
      borderWidth: 1.5,
    }));
  const bh = analysis.binding?.benesiHildebrand.fit ?? null;
  const xs = bh ? bh.points.map((point) => point.x) : [];
  return (
    <div className="grid gap-3 lg:grid-cols-2">
      <figure aria-label="Absorption spectra at each quencher concentration" className="relative h-60">
        <Scatter
          aria-label="Absorbance against wavelength, one line per [Q]"
          data={{ datasets: lines('values') }}
          options={chartOptions(wavelengthAxis, 'Absorbance')}
        />
      </figure>
      <figure aria-label="Difference spectra" className="relative h-60">
        <Scatter
          aria-label="Change in absorbance against wavelength after taking out the quencher's own absorbance"
          data={{ datasets: lines('differences') }}
          options={chartOptions(wavelengthAxis, 'ΔA')}
        />
      </figure>
      {bh && (
        <figure aria-label="Benesi–Hildebrand plot" className="relative h-60 lg:col-span-2">
          <Scatter
            aria-label="1/ΔA against 1/[Q] at the band of largest change, with the fitted line"
            data={{
              datasets: [
                {
                  label: '1/ΔA',
                  data: bh.points,
                  backgroundColor: chartColours.points,
                  pointRadius: 4,
                },
                {
                  label: 'Line',
                  data: [0, Math.max(...xs)].map((x) => ({ x, y: bh.intercept.value + bh.slope.value * x })),
                  borderColor: chartColours.line,
                  showLine: true,
                  pointRadius: 0,
                  borderWidth: 1.5,
                },
              ],
            }}
            options={chartOptions({ ...axis(titled('1/[Q]', UNITS.perMolar)), min: 0 }, '1/ΔA')}
          />
        </figure>
      )}
    </div>
  );
}
