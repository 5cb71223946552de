import { titled, UNITS } from '@shared/format';
import type { TemperatureSeriesAnalysis } from '@shared/schemas/temperature-series';
import { chartColours } from '@/components/chart-theme';
import { linearAxis as axis, lineSeries, pointSeries } from '@/components/scatter-chart';
import { PlotFigure } from './plot-figure';

// Measured values in glow, the diffusion reference in ink, the Arrhenius line in moss (tailwind.config.ts).
const seriesColours = { measured: chartColours.points, reference: chartColours.line, second: chartColours.series[2] };

/**
 * K_SV(T) beside T/η(T) scaled to meet K_SV at the lowest temperature (dynamic quenching
 * follows that curve), and the Arrhenius plot ln kq against 1000/T with its fitted line.
 */
export function SeriesPlots({ analysis }: { analysis: TemperatureSeriesAnalysis }) {
  const first = analysis.points[0]!;
  const scale = first.kSv.value / first.temperatureOverViscosity;
  const arrhenius = analysis.arrhenius;
  const withKq = analysis.points.filter((p) => p.kq !== null);
  const inverse = withKq.map((p) => 1000 / p.temperature);
  const line =
    arrhenius && inverse.length > 1
      ? [Math.min(...inverse), Math.max(...inverse)].map((x) => ({
          x,
          // ln kq = ln A − Ea/(R T), with 1/T = x/1000
          y: arrhenius.lnPreExponentialFactor.value - (arrhenius.activationEnergy.value * x) / (1000 * 8.314462618),
        }))
      : [];
  return (
    <div className="grid gap-4 md:grid-cols-2">
      <PlotFigure
        name="K_SV against temperature"
        description="Plot of K_SV against temperature beside T/η scaled to meet it at the lowest temperature; the values are in the table below"
        size="h-64"
        datasets={[
          pointSeries(
            'K_SV',
            analysis.points.map((p) => ({ x: p.temperature, y: p.kSv.value })),
            seriesColours.measured,
          ),
          {
            label: 'T/η, scaled (diffusion)',
            data: analysis.points.map((p) => ({ x: p.temperature, y: p.temperatureOverViscosity * scale })),
            borderColor: seriesColours.reference,
            backgroundColor: seriesColours.reference,
            showLine: true,
            pointRadius: 2,
          },
        ]}
        scales={{ x: axis(titled('T', UNITS.kelvin)), y: axis(titled('K_SV', UNITS.perMolar)) }}
      />
      <PlotFigure
        name="Arrhenius plot"
        description="Arrhenius plot of ln kq against 1000 K / T with the fitted line; the values are in the table below"
        size="h-64"
        missing={withKq.length === 0 ? 'No kq: give τ0 at each temperature for the Arrhenius plot.' : undefined}
        datasets={[
          pointSeries(
            'ln kq',
            withKq.map((p) => ({ x: 1000 / p.temperature, y: Math.log(p.kq!.value) })),
            seriesColours.measured,
          ),
          lineSeries('Arrhenius fit', line, seriesColours.second),
        ]}
        scales={{ x: axis('1000 K / T'), y: axis(`ln(kq / ${UNITS.perMolarPerSecond})`) }}
      />
    </div>
  );
}
