import type { RefObject } from 'react';
import type { Chart } from 'chart.js';
import { Button } from '@/components/button';

/** Saves what a chart shows as a PNG (chart.js toBase64Image), named after the study. */
export function SavePngButton({
  chart,
  fileName,
  what,
}: {
  chart: RefObject<Chart<'scatter'> | null>;
  fileName: string;
  what: string;
}) {
  function save() {
    const current = chart.current;
    if (!current) return;
    const link = document.createElement('a');
    link.href = current.toBase64Image('image/png', 1);
    link.download = fileName;
    link.click();
  }
  return (
    <Button variant="quiet" aria-label={`Save as PNG: the ${what}`} onClick={save}>
      Save as PNG
    </Button>
  );
}
