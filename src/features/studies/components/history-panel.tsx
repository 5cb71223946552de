import { formatDateTime, formatQuantity, UNITS } from '@shared/format';
import { ErrorNotice } from '@/components/error-notice';
import { useStudyHistory } from '../api/get-study-history';

const words: Record<string, string> = {
  study_created: 'created the study',
  study_updated: 'changed the settings',
  study_points_replaced: 'saved points',
  study_points_from_upload: 'took points from a file',
  study_file_uploaded: 'uploaded a file',
  study_fitted: 'fitted',
  study_submitted: 'submitted',
  study_approved: 'approved',
  study_returned: 'returned',
  study_commented: 'commented',
  study_revision_started: 'started this revision',
  decay_set_kept: 'kept a decay set',
  study_lifetimes_from_decays: 'took lifetimes from decays',
  decay_set_refitted: 'refitted a decay set',
  study_lifetimes_refitted: 'took lifetimes from a refitted decay set',
};

/** Every change to the study with who and when; before/after values open on demand. */
export function HistoryPanel({ labId, studyId }: { labId: string; studyId: string }) {
  const history = useStudyHistory(labId, studyId);
  if (history.isError) return <ErrorNotice error={history.error} what="the history" />;
  if (!history.data) return <p className="text-body text-ink-500">Loading history…</p>;
  return (
    <ol className="max-h-80 space-y-1 overflow-auto text-body">
      {history.data.events.map((event) => (
        <li key={event.id}>
          <details>
            <summary>
              <strong>{event.actor ?? 'system'}</strong> {words[event.action] ?? event.action} ·{' '}
              {formatDateTime(event.createdAt)}
              {event.action === 'study_fitted' && typeof event.details.kSv === 'number' && (
                <>
                  {' '}
                  (K_SV {formatQuantity(Number(event.details.kSv), UNITS.perMolar)}, {String(event.details.model)})
                </>
              )}
              {event.action === 'study_points_from_upload' && typeof event.details.reading === 'string' && (
                <> ({event.details.reading})</>
              )}
            </summary>
            <pre className="overflow-auto whitespace-pre-wrap text-caption text-ink-700">
              {JSON.stringify(event.details, null, 1)}
            </pre>
          </details>
        </li>
      ))}
    </ol>
  );
}
