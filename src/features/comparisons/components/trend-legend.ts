import type { Chart, ChartOptions, LegendItem } from 'chart.js';
import { chartColours } from '@/components/chart-theme';

/** What a dataset of the trend plot draws, and for which trend (its index in comparison.trends). */
export type TrendPart = 'measured' | 'fit' | 'limit';
export interface TrendDataset {
  trend: number;
  part: TrendPart;
}

const partKeys: Record<TrendPart, Pick<LegendItem, 'text' | 'pointStyle' | 'lineWidth' | 'lineDash'>> = {
  measured: { text: 'measured', pointStyle: 'circle', lineWidth: 1 },
  fit: { text: 'fit', pointStyle: 'line', lineWidth: 2 },
  limit: { text: 'diffusion limit', pointStyle: 'line', lineWidth: 1, lineDash: [6, 4] },
};

const partsOf = (chart: Chart) => chart.data.datasets as unknown as TrendDataset[];

/**
 * A legend that stays short however many trends there are: one entry per trend in its colour,
 * then one per kind of mark in ink (measured points, fit, diffusion limit), instead of one entry
 * per trend and kind (twelve long ones for four trends, which took a phone's whole plot). A click
 * on a trend hides or shows all its marks; a click on a kind, that kind in every trend.
 */
export function trendLegend(
  trends: ReadonlyArray<{ label: string; colour: string }>,
  /** said once above the entries, e.g. the one solvent of every trend */
  title?: string,
): NonNullable<ChartOptions<'scatter'>['plugins']>['legend'] {
  return {
    title: title
      ? { display: true, text: title, padding: { top: 0, bottom: 2 }, font: { weight: 'bold' } }
      : { display: false },
    labels: {
      generateLabels: (chart) => {
        const parts = partsOf(chart);
        const hidden = (match: (part: TrendDataset) => boolean) =>
          parts.every((part, index) => !match(part) || !chart.isDatasetVisible(index));
        const byTrend: LegendItem[] = trends.map((trend, index) => ({
          text: trend.label,
          fillStyle: trend.colour,
          strokeStyle: trend.colour,
          fontColor: chartColours.text,
          pointStyle: 'circle',
          lineWidth: 1,
          hidden: hidden((part) => part.trend === index),
        }));
        const kinds = (Object.keys(partKeys) as TrendPart[]).filter((kind) => parts.some((part) => part.part === kind));
        const byKind: LegendItem[] = kinds.map((kind) => ({
          ...partKeys[kind],
          fillStyle: kind === 'measured' ? '#ffffff' : chartColours.line,
          strokeStyle: chartColours.line,
          fontColor: chartColours.text,
          hidden: hidden((part) => part.part === kind),
        }));
        return [...byTrend, ...byKind];
      },
    },
    onClick: (_event, item, legend) => {
      const chart = legend.chart;
      const trend = trends.findIndex((entry) => entry.label === item.text);
      const kind = (Object.keys(partKeys) as TrendPart[]).find((key) => partKeys[key].text === item.text);
      const match = (part: TrendDataset) => (trend >= 0 ? part.trend === trend : part.part === kind);
      partsOf(chart).forEach((part, index) => {
        if (match(part)) chart.setDatasetVisibility(index, Boolean(item.hidden));
      });
      chart.update();
    },
  };
}
