import type { RefObject } from 'react';
import type { Chart } from 'chart.js';
import { saveChartPng, saveChartSvg } from './decay-chart-setup';

/** "<what> as PNG" and "<what> as SVG" for one chart of the decay panel, saved as `name`. */
export function SaveChartButtons({
  chart,
  name,
  what,
}: {
  chart: RefObject<Chart<'scatter'> | null>;
  name: string;
  what: string;
}) {
  return (
    <>
      <button type="button" className="text-caption underline" onClick={() => saveChartPng(chart.current, name)}>
        {what} as PNG
      </button>
      <button type="button" className="text-caption underline" onClick={() => saveChartSvg(chart.current, name)}>
        {what} as SVG
      </button>
    </>
  );
}
