import { useRef } from 'react';
import type { Chart, ChartData, ChartOptions } from 'chart.js';
import { Scatter } from 'react-chartjs-2';
import { paperBackground } from '@/components/scatter-chart';
import { useAfterPaint } from '@/lib/after-paint';
import { SavePngButton } from './save-png-button';

interface SavableScatterProps {
  /** the saved file's name (see figureFileName) and what the plot is, for the buttons' labels */
  fileName: string;
  what: string;
  /** the Tailwind height of the plot area, e.g. 'h-72' */
  height: string;
  /** what a screen reader says of the plot */
  label: string;
  data: ChartData<'scatter'>;
  options: ChartOptions<'scatter'>;
}

/**
 * A study plot with its save buttons above it: drawn on paper (so a saved PNG reads as on screen),
 * without animation, filling the height it is given, once the screen has painted (the space is
 * kept meanwhile and the buttons wait for the chart).
 */
export function SavableScatter({ fileName, what, height, label, data, options }: SavableScatterProps) {
  const chart = useRef<Chart<'scatter'>>(null);
  const drawn = useAfterPaint();
  return (
    <>
      <div className="flex justify-end">
        <SavePngButton chart={chart} fileName={fileName} what={what} disabled={!drawn} />
      </div>
      <div className={`relative ${height}`}>
        {drawn && (
          <Scatter
            ref={chart}
            plugins={[paperBackground]}
            aria-label={label}
            data={data}
            options={{ maintainAspectRatio: false, animation: false, ...options }}
          />
        )}
      </div>
    </>
  );
}
