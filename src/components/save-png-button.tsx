import { useState, type RefObject } from 'react';
import type { Chart } from 'chart.js';
import { Button } from '@/components/button';
import { chartAsSvg } from '@/components/chart-svg';
import { chartAsPrintPng, figureWidthsCm, type FigureWidthCm } from '@/components/print-figure';

/** "…-stern-volmer.png" at 8.5 cm -> "…-stern-volmer-85mm.png". */
const sizedName = (fileName: string, widthCm: number) =>
  fileName.replace(/\.png$/, '') + `-${Math.round(widthCm * 10)}mm.png`;

function download(blob: Blob, name: string) {
  const url = URL.createObjectURL(blob);
  const link = document.createElement('a');
  link.href = url;
  link.download = name;
  link.click();
  window.setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

/**
 * Saves what a chart shows for a paper: as PNG one column (8.5 cm) or two (17 cm) wide at 300 dpi,
 * named after the study and the width, or as SVG (vectors, the same figure).
 */
export function SavePngButton({
  chart,
  fileName,
  what,
  disabled = false,
}: {
  chart: RefObject<Chart<'scatter'> | null>;
  fileName: string;
  what: string;
  /** while the chart is not drawn yet */
  disabled?: boolean;
}) {
  const [busy, setBusy] = useState<FigureWidthCm | null>(null);
  async function save(widthCm: FigureWidthCm) {
    const current = chart.current;
    if (!current) return;
    setBusy(widthCm);
    try {
      download(await chartAsPrintPng(current as unknown as Chart, widthCm), sizedName(fileName, widthCm));
    } finally {
      setBusy(null);
    }
  }
  function saveSvg() {
    const current = chart.current;
    if (!current) return;
    const svg = chartAsSvg(current as unknown as Chart, `${what[0]!.toUpperCase()}${what.slice(1)}`);
    download(new Blob([svg], { type: 'image/svg+xml' }), fileName.replace(/\.png$/, '.svg'));
  }
  return (
    <div role="group" aria-label={`Save the ${what} as PNG at 300 dpi or as SVG`} className="flex flex-wrap gap-2">
      {figureWidthsCm.map((widthCm) => (
        <Button
          key={widthCm}
          variant="quiet"
          pending={busy === widthCm}
          pendingLabel="Drawing…"
          disabled={disabled}
          aria-label={`PNG ${widthCm} cm wide: the ${what}`}
          onClick={() => void save(widthCm)}
        >
          PNG {widthCm} cm
        </Button>
      ))}
      <Button variant="quiet" aria-label={`SVG: the ${what}`} disabled={disabled} onClick={saveSvg}>
        SVG
      </Button>
    </div>
  );
}
