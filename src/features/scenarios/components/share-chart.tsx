import { useRef } from 'react';
import { BarElement, CategoryScale, Chart as ChartJS, LinearScale, Tooltip } from 'chart.js';
import { Bar } from 'react-chartjs-2';
import type { Scenario } from '@shared/schemas/scenarios';
import { chartColours } from '@/components/chart-theme';
import { figureFileName } from '@/components/figure-file-name';
import { SavePngButton } from '@/components/save-png-button';
import { paperBackground } from '@/components/scatter-chart';

ChartJS.register(BarElement, CategoryScale, LinearScale, Tooltip);

// Halflight palette (tailwind.config.ts): glow for quenchers, ink for oxygen, paper for unquenched decay.
const colours = { compound: chartColours.points, oxygen: '#625ba3', unquenched: '#dcd4c3' };

/** Horizontal bars: the percentage of excited emitter each component takes, and what decays unquenched. */
export function ShareChart({ scenario }: { scenario: Scenario }) {
  const known = scenario.shares.filter((share) => share.fraction !== null);
  const labels = [...known.map((share) => share.label), 'decays unquenched'];
  const values = [...known.map((share) => share.fraction! * 100), scenario.unquenched * 100];
  const chart = useRef<ChartJS<'bar'>>(null);
  return (
    <div className="space-y-2">
      <div className="flex justify-end">
        <SavePngButton chart={chart} fileName={figureFileName(scenario.name, 'shares')} what="chart of shares" />
      </div>
      <div className="relative h-64">
        <Bar
          ref={chart}
          plugins={[paperBackground]}
          aria-label={`Bar chart: ${labels.map((label, i) => `${label} ${values[i]!.toFixed(1)} %`).join(', ')}`}
          data={{
            labels,
            datasets: [
              {
                label: 'share of excited emitter (%)',
                data: values,
                backgroundColor: [...known.map((share) => colours[share.kind]), colours.unquenched],
                borderRadius: 4,
              },
            ],
          }}
          options={{
            indexAxis: 'y',
            maintainAspectRatio: false,
            animation: false,
            scales: { x: { min: 0, max: 100, title: { display: true, text: '% of excited emitter' } } },
            plugins: {
              legend: { display: false },
              tooltip: { callbacks: { label: (item) => `${Number(item.raw).toFixed(2)} %` } },
            },
          }}
        />
      </div>
    </div>
  );
}
