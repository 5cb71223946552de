import { ErrorNotice } from '@/components/error-notice';
import { Signal } from '@/components/signal';
import { TextLink } from '@/components/text-link';
import { useLifetimeDependents } from '../api/get-lifetime-dependents';
import { formatLifetime } from './library-format';

/** Studies whose tau0 comes from this record; each is refitted only when someone opens it and chooses to. */
export function LifetimeDependents({ labId, compoundId, lifetimeId }: { labId: string; compoundId: string; lifetimeId: string }) {
  const dependents = useLifetimeDependents(labId, compoundId, lifetimeId);
  if (dependents.isPending) return <Signal tone="waiting">Looking for studies</Signal>;
  if (dependents.isError) return <ErrorNotice error={dependents.error} what="the studies using this lifetime" />;
  const { studies, value } = dependents.data;
  if (studies.length === 0) return <p className="text-caption text-ink-600">No study takes its tau0 from this record.</p>;
  const outdated = studies.filter((study) => !study.matchesRecord).length;
  return (
    <div className="space-y-1 text-body" role="region" aria-label="Studies using this lifetime">
      <p className="text-caption text-ink-700">
        {studies.length} {studies.length === 1 ? 'study takes' : 'studies take'} tau0 from this record
        {outdated > 0 ? `; ${outdated} still hold an older value than ${formatLifetime(value)}. Open each and choose whether to refit it — nothing is refitted automatically.` : '.'}
      </p>
      <ul className="space-y-1">
        {studies.map((study) => (
          <li key={study.studyId} className="flex flex-wrap items-center gap-2">
            <TextLink to={`/labs/${labId}/studies/${study.studyId}`}>{study.title}</TextLink>
            <span className="text-caption text-ink-500">{study.status}, tau0 {study.tau0 === null ? '—' : formatLifetime(study.tau0)}</span>
            {!study.matchesRecord && <Signal tone="bad">Refit to use the new value</Signal>}
          </li>
        ))}
      </ul>
    </div>
  );
}
