import { Link } from 'react-router-dom';
import { Panel } from '@/components/panel';
import { Signal } from '@/components/signal';
import { ErrorNotice } from '@/components/error-notice';
import { useSession } from '@/features/auth/api/get-session';
import { LabDashboard } from '@/features/dashboard/components/lab-dashboard';
import { useCurrentLab } from '@/features/labs/current-lab';
import { YourLabsPanel } from '@/features/labs/components/your-labs-panel';
import { paths } from '@/lib/paths';
import { can } from '@/lib/policy';
import { useHealth } from '@/features/system/api/get-health';

function Fact({ label, value }: { label: string; value: string }) {
  return (
    <div>
      <dt className="text-caption tracking-wide text-ink-500">{label}</dt>
      <dd className="text-body font-bold text-ink-900">{value}</dd>
    </div>
  );
}

function formatUptime(seconds: number): string {
  if (seconds < 60) return `${seconds} s`;
  if (seconds < 3600) return `${Math.floor(seconds / 60)} min`;
  return `${Math.floor(seconds / 3600)} h ${Math.floor((seconds % 3600) / 60)} min`;
}

/** The landing screen: start a study, the person's drafts and what waits for them, their labs; server facts for admins. */
export function OverviewRoute() {
  const { user } = useSession();
  const lab = useCurrentLab(user.labs);
  const canStart = lab !== null && can(lab.role, 'studies:write');
  return (
    <div className="max-w-5xl space-y-6">
      <header className="flex flex-wrap items-end justify-between gap-4">
        <div>
          <h1 className="text-display font-black text-ink-950">Overview</h1>
          <p className="mt-1 max-w-2xl text-lead text-ink-700">
            {lab ? `${lab.labName}: ` : ''}your drafts, what waits for you and what happened lately.
          </p>
        </div>
        {canStart && (
          <Link
            to={paths.newStudy(lab.labId)}
            className="inline-flex items-center gap-2 rounded-md bg-glow-400 px-5 py-2.5 text-lead font-black text-ink-950 hover:bg-glow-300"
          >
            New study
          </Link>
        )}
      </header>
      {lab && (
        <LabDashboard
          labId={lab.labId}
          labName={lab.labName}
          canReview={can(lab.role, 'studies:review')}
          canWrite={canStart}
        />
      )}
      <YourLabsPanel labs={user.labs} />
      {lab && can(lab.role, 'settings:manage') && <WorkspaceStatus />}
    </div>
  );
}

/** Server and database facts: for the lab's admins, folded away under "About this workspace". */
function WorkspaceStatus() {
  const health = useHealth();
  return (
    <details className="rounded-card border border-paper-300 bg-paper-50 p-4">
      <summary className="cursor-pointer text-body font-bold text-ink-800">About this workspace (admins)</summary>
      <div className="mt-3">
        <Panel
          title="Workspace status"
          aside={
            health.isPending ? (
              <Signal tone="waiting">Checking</Signal>
            ) : health.data?.database.status === 'up' ? (
              <Signal tone="good">Database answering</Signal>
            ) : (
              <Signal tone="bad">Database not answering</Signal>
            )
          }
        >
          {health.isError && <ErrorNotice error={health.error} what="the workspace status" />}
          {health.data && (
            <dl className="grid grid-cols-2 gap-4 sm:grid-cols-3">
              <Fact label="Halflight version" value={health.data.version} />
              <Fact label="Server running for" value={formatUptime(health.data.uptimeSeconds)} />
              <Fact
                label="Database round trip"
                value={health.data.database.latencyMs === null ? '—' : `${health.data.database.latencyMs} ms`}
              />
              <Fact label="PostgreSQL" value={health.data.database.serverVersion ?? '—'} />
              <Fact
                label="Database kind"
                value={health.data.database.embedded ? 'Built-in (this machine)' : 'External'}
              />
              <Fact label="Schema changes applied" value={String(health.data.database.migrationsApplied ?? '—')} />
            </dl>
          )}
          {health.data?.database.message && (
            <p className="mt-3 text-body text-brick-700">{health.data.database.message}</p>
          )}
        </Panel>
      </div>
    </details>
  );
}
