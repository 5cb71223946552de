import { useState } from 'react';
import { Link } from 'react-router-dom';
import { EmptyState } from '@/components/empty-state';
import { LinkButton } from '@/components/link-button';
import { PageNav } from '@/components/page-nav';
import { ScreenHeader } from '@/components/screen-header';
import { ErrorNotice } from '@/components/error-notice';
import { Panel } from '@/components/panel';
import { useScenarios } from '@/features/scenarios/api/get-scenarios';
import { formatDate } from '@shared/format';
import { paths } from '@/lib/paths';
import { useLab } from '@/routes/lab-context';

/** The lab's reaction scenarios: real reactions whose components compete for the excited catalyst. */
export function ScenariosRoute() {
  const { labId } = useLab();
  const [page, setPage] = useState(1);
  const scenarios = useScenarios(labId, page);
  const pages = Math.max(1, Math.ceil((scenarios.data?.total ?? 0) / 25));
  return (
    <div className="max-w-5xl space-y-6">
      <ScreenHeader title="Who quenches?" action={<LinkButton to={paths.newScenario(labId)}>New scenario</LinkButton>}>
        <p className="mt-1 max-w-3xl text-lead text-ink-700">
          Put in a reaction as you run it, and see which share of the excited catalyst each component takes, using the
          rate constants your lab has measured.
        </p>
      </ScreenHeader>
      <Panel title="Scenarios">
        {scenarios.isError && <ErrorNotice error={scenarios.error} what="the scenarios" />}
        {scenarios.data?.items.length === 0 && (
          <EmptyState title="No scenarios yet">Start one with the components of a reaction you run.</EmptyState>
        )}
        {scenarios.data && scenarios.data.items.length > 0 && (
          <ul className="divide-y divide-paper-200">
            {scenarios.data.items.map((item) => (
              <li key={item.id} className="flex items-baseline justify-between gap-4 py-2">
                <Link
                  to={paths.scenario(labId, item.id)}
                  className="font-bold text-ink-900 underline decoration-glow-400"
                >
                  {item.name}
                </Link>
                <span className="text-caption text-ink-500">
                  {item.emitterName} · {item.solvent} · {item.componentCount} components · {formatDate(item.updatedAt)}
                </span>
              </li>
            ))}
          </ul>
        )}
        <PageNav page={page} pages={pages} onPage={setPage} />
      </Panel>
    </div>
  );
}
