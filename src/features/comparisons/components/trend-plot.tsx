import { formatEstimate, SYMBOLS, symbolText, UNITS } from '@shared/format';
import { useNavigate } from 'react-router-dom';
import type { Comparison } from '@shared/schemas/comparisons';
import { chartColours } from '@/components/chart-theme';
import { figureFileName } from '@/components/figure-file-name';
import { SavableScatter } from '@/components/savable-scatter';
import { linearAxis } from '@/components/scatter-chart';
import { paths } from '@/lib/paths';
import { trendLegend } from './trend-legend';

// Halflight palette, one hue per solvent (tailwind.config.ts: glow, ink, moss, brick).
const hues = chartColours.series;

/**
 * log10 kq against dG_ET, one colour per solvent and temperature, with the fitted
 * Rehm–Weller/Marcus curve and the diffusion limit at that temperature; a click on a point opens
 * its study.
 */
export function TrendPlot({ comparison, labId }: { comparison: Comparison; labId: string }) {
  const navigate = useNavigate();
  // Trends of one solvent at several temperatures: the legend names the solvent once, each entry its temperature.
  const [first, ...rest] = comparison.trends;
  const solvent =
    first && rest.length > 0 && rest.every((trend) => trend.solvent === first.solvent) ? first.solvent : null;
  const datasets = comparison.trends.flatMap((trend, index) => {
    const hue = hues[index % hues.length]!;
    const sets: object[] = [
      {
        type: 'scatter',
        trend: index,
        part: 'measured',
        label: `${trend.label}: measured`,
        data: trend.points.map((point) => ({ x: point.drivingForce, y: point.log10Kq, studyId: point.studyId })),
        backgroundColor: trend.points.map((point) => (point.approved ? hue : '#ffffff')),
        borderColor: hue,
        pointRadius: 5,
      },
    ];
    if (trend.fit) {
      sets.push({
        type: 'line',
        trend: index,
        part: 'fit',
        label: `${trend.label}: fit, λ = ${formatEstimate(trend.fit.reorganisationEnergy, trend.fit.reorganisationEnergyStandardError, UNITS.electronvolt)}`,
        data: trend.fit.curve.map((point) => ({ x: point.drivingForce, y: point.log10Kq })),
        borderColor: hue,
        pointRadius: 0,
        pointStyle: 'line',
        borderWidth: 2,
        showLine: true,
      });
    }
    if (trend.diffusionLimit && trend.points.length > 0) {
      const xs = trend.points.map((point) => point.drivingForce);
      sets.push({
        type: 'line',
        trend: index,
        part: 'limit',
        label: `${trend.label}: diffusion limit`,
        data: [
          { x: Math.min(...xs) - 0.3, y: Math.log10(trend.diffusionLimit) },
          { x: Math.max(...xs) + 0.3, y: Math.log10(trend.diffusionLimit) },
        ],
        borderColor: hue,
        borderDash: [6, 4],
        pointRadius: 0,
        pointStyle: 'line',
        borderWidth: 1,
        showLine: true,
      });
    }
    return sets;
  });
  return (
    <SavableScatter
      fileName={figureFileName(`${comparison.compound.name} comparison`, 'kq-driving-force')}
      what="plot of log kq against driving force"
      height="h-80"
      label="Plot of log kq against the driving force, one series per solvent; the values are in the table"
      data={{ datasets: datasets as never }}
      options={{
        plugins: {
          legend: trendLegend(
            comparison.trends.map((trend, index) => ({
              label: solvent ? trend.label.replace(`${solvent} at `, '') : trend.label,
              colour: hues[index % hues.length]!,
            })),
            solvent ?? undefined,
          ),
        },
        scales: {
          x: linearAxis(`${symbolText(SYMBOLS.drivingForce)} (${UNITS.electronvolt})`),
          y: linearAxis(`log₁₀ kq (${UNITS.perMolarPerSecond})`),
        },
        onClick: (_event, elements, chart) => {
          const element = elements[0];
          const point =
            element && (chart.data.datasets[element.datasetIndex]?.data[element.index] as { studyId?: string });
          if (point?.studyId) void navigate(paths.study(labId, point.studyId));
        },
      }}
    />
  );
}
