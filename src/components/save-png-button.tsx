import { useId, useState, type RefObject } from 'react';
import type { Chart, ChartType } from 'chart.js';
import { Button } from '@/components/button';
import {
  chartAsPrintPng,
  chartAsPrintSvg,
  figureDpis,
  figureWidthsCm,
  type FigureDpi,
  type FigureWidthCm,
} from '@/components/print-figure';

/** "…-stern-volmer.png" at 8.5 cm and 600 dpi -> "…-stern-volmer-85mm-600dpi.png"; SVG "…-85mm.svg". */
const sizedName = (fileName: string, widthCm: number, ending: string) =>
  fileName.replace(/\.png$/, '') + `-${Math.round(widthCm * 10)}mm${ending}`;

function download(blob: Blob, name: string) {
  const url = URL.createObjectURL(blob);
  const link = document.createElement('a');
  link.href = url;
  link.download = name;
  link.click();
  window.setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

const widthWords: Record<FigureWidthCm, string> = { 8.5: '8.5 cm, one column', 17: '17 cm, two columns' };
const dpiWords: Record<FigureDpi, string> = { 300: '300 dpi', 600: '600 dpi, for line art' };

function Choice<T extends number>({
  legend,
  name,
  values,
  words,
  value,
  onChange,
}: {
  legend: string;
  name: string;
  values: readonly T[];
  words: Record<T, string>;
  value: T;
  onChange: (value: T) => void;
}) {
  return (
    <fieldset>
      <legend className="text-caption font-bold tracking-wide text-ink-700">{legend}</legend>
      <div className="mt-1 flex flex-wrap gap-x-4 gap-y-1">
        {values.map((option) => (
          <label key={option} className="flex items-center gap-2 text-body text-ink-900">
            <input
              type="radio"
              name={name}
              checked={value === option}
              onChange={() => onChange(option)}
              className="accent-ink-700"
            />
            {words[option]}
          </label>
        ))}
      </div>
    </fieldset>
  );
}

/**
 * Saves what a chart shows for a paper, behind one "Save figure" disclosure: one column (8.5 cm)
 * or two (17 cm) wide, as PNG at 300 or 600 dpi or as SVG sized in centimetres (vectors, the same
 * figure), named after the record, the figure and the size.
 */
export function SavePngButton<T extends ChartType>({
  chart,
  fileName,
  what,
  disabled = false,
}: {
  chart: RefObject<Chart<T> | null>;
  fileName: string;
  what: string;
  /** while the chart is not drawn yet */
  disabled?: boolean;
}) {
  const name = useId();
  const [widthCm, setWidthCm] = useState<FigureWidthCm>(figureWidthsCm[0]);
  const [dpi, setDpi] = useState<FigureDpi>(figureDpis[0]);
  const [busy, setBusy] = useState<'png' | 'svg' | null>(null);
  async function save(kind: 'png' | 'svg') {
    const current = chart.current as unknown as Chart | null;
    if (!current) return;
    setBusy(kind);
    try {
      if (kind === 'png')
        download(await chartAsPrintPng(current, widthCm, dpi), sizedName(fileName, widthCm, `-${dpi}dpi.png`));
      else {
        const svg = await chartAsPrintSvg(current, widthCm, `${what[0]!.toUpperCase()}${what.slice(1)}`);
        download(new Blob([svg], { type: 'image/svg+xml' }), sizedName(fileName, widthCm, '.svg'));
      }
    } finally {
      setBusy(null);
    }
  }
  return (
    <details className="group max-w-full">
      <summary className="ml-auto w-fit cursor-pointer list-none rounded-md border border-paper-300 bg-paper-50 px-3 py-1 text-body font-bold text-ink-800 hover:border-ink-300 [&::-webkit-details-marker]:hidden">
        Save figure<span className="sr-only">: the {what}</span>
        <span aria-hidden="true" className="ml-2 inline-block group-open:rotate-180">
          ▾
        </span>
      </summary>
      <div
        role="group"
        aria-label={`Save the ${what}`}
        className="mt-2 space-y-3 rounded-md border border-paper-300 bg-paper-50 p-3"
      >
        <Choice
          legend="Width"
          name={`${name}-width`}
          values={figureWidthsCm}
          words={widthWords}
          value={widthCm}
          onChange={setWidthCm}
        />
        <Choice
          legend="PNG resolution"
          name={`${name}-dpi`}
          values={figureDpis}
          words={dpiWords}
          value={dpi}
          onChange={setDpi}
        />
        <div className="flex flex-wrap gap-2">
          <Button
            variant="quiet"
            pending={busy === 'png'}
            pendingLabel="Drawing…"
            disabled={disabled || busy !== null}
            onClick={() => void save('png')}
          >
            Save PNG<span className="sr-only"> of the {what}</span>
          </Button>
          <Button
            variant="quiet"
            pending={busy === 'svg'}
            pendingLabel="Drawing…"
            disabled={disabled || busy !== null}
            onClick={() => void save('svg')}
          >
            Save SVG<span className="sr-only"> of the {what}</span>
          </Button>
        </div>
      </div>
    </details>
  );
}
