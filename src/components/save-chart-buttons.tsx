import type { RefObject } from 'react';
import type { Chart } from 'chart.js';
import { chartAsSvg } from './chart-svg';

const fileStem = (name: string) => name.replace(/[^\p{L}\p{N}]+/gu, '-').replace(/^-|-$/g, '');

function saveAs(href: string, fileName: string) {
  const link = document.createElement('a');
  link.href = href;
  link.download = fileName;
  link.click();
}

/** Saves a chart's canvas as PNG under a file name made from its parts. */
function saveChartPng(chart: Chart | null, name: string) {
  if (chart) saveAs(chart.toBase64Image('image/png', 1), `${fileStem(name)}.png`);
}

/** Saves the same figure as SVG (vectors; the marks carry their plotted values). */
function saveChartSvg(chart: Chart | null, name: string) {
  if (!chart) return;
  const url = URL.createObjectURL(new Blob([chartAsSvg(chart, name)], { type: 'image/svg+xml' }));
  saveAs(url, `${fileStem(name)}.svg`);
  window.setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

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
