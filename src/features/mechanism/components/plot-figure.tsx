import type { ChartData, ChartOptions } from 'chart.js';
import { Scatter } from 'react-chartjs-2';

interface PlotFigureProps {
  /** the figure's name (what tests and screen readers find it by) */
  name: string;
  /** what a screen reader says of the plot itself */
  description: string;
  /** Tailwind classes sizing the figure, e.g. 'h-64' or 'h-60 lg:col-span-2' */
  size: string;
  datasets: ChartData<'scatter'>['datasets'];
  scales: NonNullable<ChartOptions<'scatter'>['scales']>;
  /** said in place of the plot when there is nothing to draw */
  missing?: string;
}

/** One mechanism plot in its figure: a scatter chart filling the height it is given, drawn without animation. */
export function PlotFigure({ name, description, size, datasets, scales, missing }: PlotFigureProps) {
  return (
    <figure aria-label={name} className={`relative ${size}`}>
      {missing === undefined ? (
        <Scatter
          aria-label={description}
          data={{ datasets }}
          options={{ maintainAspectRatio: false, animation: false, scales }}
        />
      ) : (
        <p className="text-body text-ink-600">{missing}</p>
      )}
    </figure>
  );
}
