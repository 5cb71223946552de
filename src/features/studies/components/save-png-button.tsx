import { useState, type RefObject } from 'react';
import type { Chart } from 'chart.js';
import { Button } from '@/components/button';
import { chartAsPrintPng, figureWidthsCm, type FigureWidthCm } from '@/components/print-figure';

/** "…-stern-volmer.png" at 8.5 cm -> "…-stern-volmer-85mm.png". */
const sizedName = (fileName: string, widthCm: number) =>
  fileName.replace(/\.png$/, '') + `-${Math.round(widthCm * 10)}mm.png`;

/**
 * Saves what a chart shows as a PNG for a paper: one column (8.5 cm) or two (17 cm) wide at
 * 300 dpi, named after the study and the width.
 */
export function SavePngButton({
  chart,
  fileName,
  what,
}: {
  chart: RefObject<Chart<'scatter'> | null>;
  fileName: string;
  what: string;
}) {
  const [busy, setBusy] = useState<FigureWidthCm | null>(null);
  async function save(widthCm: FigureWidthCm) {
    const current = chart.current;
    if (!current) return;
    setBusy(widthCm);
    try {
      const url = URL.createObjectURL(await chartAsPrintPng(current as unknown as Chart, widthCm));
      const link = document.createElement('a');
      link.href = url;
      link.download = sizedName(fileName, widthCm);
      link.click();
      window.setTimeout(() => URL.revokeObjectURL(url), 10_000);
    } finally {
      setBusy(null);
    }
  }
  return (
    <div role="group" aria-label={`Save the ${what} as PNG at 300 dpi`} className="flex flex-wrap gap-2">
      {figureWidthsCm.map((widthCm) => (
        <Button
          key={widthCm}
          variant="quiet"
          pending={busy === widthCm}
          pendingLabel="Drawing…"
          aria-label={`PNG ${widthCm} cm wide: the ${what}`}
          onClick={() => void save(widthCm)}
        >
          PNG {widthCm} cm
        </Button>
      ))}
    </div>
  );
}
