import { formatEstimate, UNITS } from '@shared/format';
import { useSearchParams } from 'react-router-dom';
import type { Trend } from '@shared/schemas/comparisons';
import { Button } from '@/components/button';
import { EmptyState } from '@/components/empty-state';
import { ErrorNotice } from '@/components/error-notice';
import { Panel } from '@/components/panel';
import { SelectField } from '@/components/select-field';
import { useDownloadComparison } from '@/features/comparisons/api/download-comparison';
import { useDownloadComparisonReport } from '@/features/comparisons/api/download-comparison-report';
import { useComparison } from '@/features/comparisons/api/get-comparison';
import type { ComparisonQuery } from '@/features/comparisons/api/get-comparison';
import { ComparisonTable } from '@/features/comparisons/components/comparison-table';
import { TrendPlot } from '@/features/comparisons/components/trend-plot';
import { useCompounds } from '@/features/library/api/get-compounds';
import { useLab } from '@/routes/lab-context';
import { ScreenHeader } from '@/components/screen-header';

const sorts = [
  { value: 'kq', label: 'kq, fastest first' },
  { value: 'kSv', label: 'K_SV, largest first' },
  { value: 'drivingForce', label: 'driving force, most downhill first' },
  { value: 'partner', label: 'name' },
];

/** The Rehm–Weller/Marcus fit of one solvent in words: λ with its standard error, and how well it fits. */
function describeTrendFit(fit: NonNullable<Trend['fit']>): string {
  const lambda = formatEstimate(fit.reorganisationEnergy, fit.reorganisationEnergyStandardError, UNITS.electronvolt);
  const quality = `k_d/KZ ${fit.kdOverKZ}, residual SD ${fit.residualStandardDeviation.toFixed(2)} in log kq`;
  return `reorganisation energy λ = ${lambda} from ${fit.n} studies (${quality})`;
}

/** Compare quenchers for one emitter (or emitters for one quencher), in a table and against driving force. */
export function CompareRoute() {
  const { labId } = useLab();
  const [params, setParams] = useSearchParams();
  const query: ComparisonQuery = {
    side: params.get('side') === 'quencher' ? 'quencher' : 'emitter',
    compoundId: params.get('compoundId') ?? '',
    approvedOnly: params.get('approvedOnly') === 'true',
    sort: (sorts.find((sort) => sort.value === params.get('sort'))?.value ?? 'kq') as ComparisonQuery['sort'],
  };
  const set = (changes: Record<string, string>) =>
    setParams({ ...Object.fromEntries(params), ...changes }, { replace: true });
  const compounds = useCompounds(labId, {
    roleHint: query.side === 'emitter' ? 'photocatalyst' : 'quencher',
    pageSize: 100,
  });
  const comparison = useComparison(labId, query);
  const download = useDownloadComparison(labId);
  const report = useDownloadComparisonReport(labId);
  const options = [
    { value: '', label: 'Choose…' },
    ...(compounds.data?.items ?? []).map((item) => ({ value: item.id, label: item.name })),
  ];

  return (
    <div className="max-w-6xl space-y-6">
      <ScreenHeader title="Compare">
        <p className="mt-1 max-w-3xl text-lead text-ink-700">
          Line up every quencher studied against one emitter, or every emitter against one quencher, and see how the
          rate constants follow the driving force.
        </p>
      </ScreenHeader>
      <Panel title="What to compare">
        <div className="grid grid-cols-1 gap-3 sm:grid-cols-2 lg:grid-cols-4">
          <SelectField
            label="Look at one"
            value={query.side}
            onChange={(event) => set({ side: event.target.value, compoundId: '' })}
            options={[
              { value: 'emitter', label: 'emitter, all its quenchers' },
              { value: 'quencher', label: 'quencher, all its emitters' },
            ]}
          />
          <SelectField
            label={query.side === 'emitter' ? 'Emitter' : 'Quencher'}
            value={query.compoundId}
            onChange={(event) => set({ compoundId: event.target.value })}
            options={options}
          />
          <SelectField
            label="Order by"
            value={query.sort}
            onChange={(event) => set({ sort: event.target.value })}
            options={sorts}
          />
          <label className="flex items-center gap-2 text-body sm:mt-7">
            <input
              type="checkbox"
              checked={query.approvedOnly}
              onChange={(event) => set({ approvedOnly: String(event.target.checked) })}
            />
            Fit approved results only
          </label>
        </div>
      </Panel>
      {!query.compoundId && (
        <EmptyState title="Choose a compound">Its studies appear here with their rate constants.</EmptyState>
      )}
      {comparison.isError && <ErrorNotice error={comparison.error} what="the comparison" />}
      {comparison.data && (
        <>
          <Panel
            title={`Studies of ${comparison.data.compound.name}`}
            aside={
              <div className="flex gap-2">
                <Button variant="quiet" pending={download.isPending} onClick={() => download.mutate(query)}>
                  Download CSV
                </Button>
                <Button
                  variant="quiet"
                  pending={report.isPending}
                  pendingLabel="Writing…"
                  onClick={() => report.mutate(query)}
                >
                  PDF summary
                </Button>
              </div>
            }
          >
            {comparison.data.rows.length === 0 ? (
              <EmptyState title="No studies yet">Studies with this compound will be listed here.</EmptyState>
            ) : (
              <ComparisonTable comparison={comparison.data} labId={labId} />
            )}
          </Panel>
          <Panel title="kq against driving force">
            <TrendPlot comparison={comparison.data} labId={labId} />
            <ul className="mt-3 space-y-1 text-body text-ink-700">
              {comparison.data.trends.map((trend, index) => (
                <li key={index}>
                  <strong>{trend.label}:</strong> {trend.fit ? describeTrendFit(trend.fit) : `no fit: ${trend.note}`}
                </li>
              ))}
            </ul>
            <p className="mt-2 text-caption text-ink-500">
              Filled points are approved results, open points drafts. Each solvent and temperature is fitted on its own,
              with the diffusion limit at that temperature. Engine {comparison.data.engineVersion}.
            </p>
          </Panel>
        </>
      )}
    </div>
  );
}
