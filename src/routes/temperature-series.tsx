import { useEffect, useRef } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { EmptyState } from '@/components/empty-state';
import { ErrorNotice } from '@/components/error-notice';
import { Panel } from '@/components/panel';
import { useSeriesAnalysis } from '@/features/mechanism/api/get-series-analysis';
import { useTemperatureSeries } from '@/features/mechanism/api/get-temperature-series';
import { SeriesPlots } from '@/features/mechanism/components/series-plots';
import { SeriesTable } from '@/features/mechanism/components/series-table';
import { SeriesVerdict } from '@/features/mechanism/components/series-verdict';
import { formatNumber } from '@shared/format';
import { paths } from '@/lib/paths';
import { focusHeading } from '@/lib/screen-heading';
import { useLab } from '@/routes/lab-context';

/**
 * Temperature series: one pair in one solvent at several temperatures, read as static or
 * dynamic quenching. The chosen studies travel in the address (?studies=a,b,c).
 */
export function TemperatureSeriesRoute() {
  const { labId } = useLab();
  const [params] = useSearchParams();
  const chosen = (params.get('studies') ?? '').split(',').filter(Boolean);
  const groups = useTemperatureSeries(labId);
  const analysis = useSeriesAnalysis(labId, chosen);
  // Picking a series changes only the address's query, so the screen's heading keeps focus where
  // it was (on the link, further down): once the reading is in, focus moves to it, or to the
  // message saying why there is none. Not on arrival: a screen opened at a series starts at its h1.
  const reading = useRef<HTMLDivElement>(null);
  const shownKey = useRef(chosen.join(','));
  const focusWhenRead = useRef(false);
  const key = chosen.join(',');
  useEffect(() => {
    if (key === shownKey.current) return;
    shownKey.current = key;
    focusWhenRead.current = key !== '';
  }, [key]);
  useEffect(() => {
    if (!focusWhenRead.current || analysis.isPending || !reading.current) return;
    focusWhenRead.current = false;
    focusHeading(reading.current);
  }, [key, analysis.isPending]);
  return (
    <div className="max-w-6xl space-y-6">
      <header>
        <h1 className="text-display font-black text-ink-950">Temperature series</h1>
        <p className="mt-1 max-w-3xl text-lead text-ink-700">
          Collisional quenching speeds up on warming as the solvent thins; a complex formed before excitation falls
          apart. Measure one pair in one solvent at three or more temperatures and read which it is.
        </p>
      </header>
      {chosen.length > 0 && (
        <Panel title="Reading of the series">
          {analysis.isPending && <p className="text-body text-ink-600">Reading the series…</p>}
          {analysis.isError && (
            <div ref={reading} tabIndex={-1}>
              <ErrorNotice error={analysis.error} what="this series" />
            </div>
          )}
          {analysis.data && (
            <div
              ref={reading}
              tabIndex={-1}
              role="group"
              aria-label={`Reading of ${analysis.data.emitter.name} with ${analysis.data.quencher.name}`}
              className="space-y-5"
            >
              <p className="text-body text-ink-700">
                {analysis.data.emitter.name} with {analysis.data.quencher.name} in {analysis.data.solventName}
              </p>
              <SeriesVerdict analysis={analysis.data} />
              <SeriesPlots analysis={analysis.data} />
              <SeriesTable analysis={analysis.data} studyPath={(studyId) => paths.study(labId, studyId)} />
            </div>
          )}
        </Panel>
      )}
      <Panel title="Pairs measured at several temperatures">
        {groups.isError && <ErrorNotice error={groups.error} what="the temperature series" />}
        {groups.data?.items.length === 0 && (
          <EmptyState title="No pair measured at two temperatures yet">
            Make a study of the same emitter and quencher in the same solvent at another temperature.
          </EmptyState>
        )}
        {groups.data && groups.data.items.length > 0 && (
          <ul className="divide-y divide-paper-200">
            {groups.data.items.map((group) => (
              <li
                key={`${group.emitter.id}-${group.quencher.id}-${group.solvent}`}
                className="flex items-baseline justify-between gap-4 py-2"
              >
                {group.ready ? (
                  <Link
                    to={paths.temperatureSeries(labId, group.studyIds)}
                    className="font-bold text-ink-900 underline decoration-glow-400"
                  >
                    {group.emitter.name} with {group.quencher.name}
                  </Link>
                ) : (
                  <span className="font-bold text-ink-900">
                    {group.emitter.name} with {group.quencher.name}
                  </span>
                )}
                <span className="text-caption text-ink-500">
                  {group.solventName} · {group.temperatures.map((t) => formatNumber(t, 5)).join(', ')} K
                  {group.ready ? '' : ' · needs fitted studies at 3 temperatures'}
                </span>
              </li>
            ))}
          </ul>
        )}
      </Panel>
    </div>
  );
}
