import { Link } from 'react-router-dom';
import type { DashboardStudy } from '@shared/schemas/dashboard';
import { EmptyState } from '@/components/empty-state';
import { ErrorNotice } from '@/components/error-notice';
import { Panel } from '@/components/panel';
import { formatDateTime, formatQuantity, UNITS } from '@shared/format';
import { useDashboard } from '../api/get-dashboard';
import { paths } from '@/lib/paths';

function StudyList({ labId, studies, empty }: { labId: string; studies: DashboardStudy[]; empty: string }) {
  if (studies.length === 0) return <EmptyState title={empty} />;
  return (
    <ul className="divide-y divide-paper-200">
      {studies.map((study) => (
        <li key={study.id} className="py-1.5">
          <Link to={paths.study(labId, study.id)} className="font-bold text-ink-900 underline decoration-glow-400">
            {study.title}
          </Link>
          <p className="text-caption text-ink-500">
            {study.emitter} + {study.quencher}
            {study.owner ? ` · ${study.owner}` : ''}
            {study.kq !== null ? ` · kq ${formatQuantity(study.kq, UNITS.perMolarPerSecond)}` : ''}
          </p>
        </li>
      ))}
    </ul>
  );
}

/** The lab at a glance: what waits for the person, what came back to them, what looks wrong, what happened. */
export function LabDashboard({
  labId,
  labName,
  canReview,
  canWrite,
}: {
  labId: string;
  labName: string;
  canReview: boolean;
  canWrite: boolean;
}) {
  const dashboard = useDashboard(labId);
  if (dashboard.isError) return <ErrorNotice error={dashboard.error} what={`what is new in ${labName}`} />;
  if (!dashboard.data) return <p className="text-body text-ink-500">Loading {labName}…</p>;
  const data = dashboard.data;
  return (
    <div className="grid gap-6 lg:grid-cols-2">
      {canWrite && (
        <Panel title="Your drafts">
          <StudyList labId={labId} studies={data.myDrafts} empty="No drafts: start one with New study." />
        </Panel>
      )}
      {canReview && (
        <Panel title="Waiting for your review">
          <StudyList labId={labId} studies={data.waitingForMyReview} empty="Nothing waits for your review." />
        </Panel>
      )}
      {canWrite && (
        <Panel title="Returned to you">
          <StudyList labId={labId} studies={data.myReturned} empty="None of your studies came back." />
        </Panel>
      )}
      <Panel title="Recently flagged">
        <StudyList labId={labId} studies={data.recentlyFlagged} empty="No recent result carries a warning." />
      </Panel>
      <Panel title="Recent activity">
        {data.recentActivity.length === 0 ? (
          <EmptyState title="Nothing has happened in this lab yet." />
        ) : (
          <ul className="space-y-1 text-body">
            {data.recentActivity.map((event) => (
              <li key={event.id}>
                <strong className="text-ink-900">{event.actor ?? 'Halflight'}</strong> {event.description}
                {event.targetType === 'study' && event.targetId && (
                  <>
                    {' '}
                    ·{' '}
                    <Link className="underline" to={paths.study(labId, event.targetId)}>
                      open
                    </Link>
                  </>
                )}
                <span className="ml-1 text-caption text-ink-500">{formatDateTime(event.at)}</span>
              </li>
            ))}
          </ul>
        )}
      </Panel>
    </div>
  );
}
