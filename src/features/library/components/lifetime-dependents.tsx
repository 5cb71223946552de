import type { LifetimeDependent, LifetimeDependents as Dependents } from '@shared/schemas/library-views';
import { Button } from '@/components/button';
import { ErrorNotice } from '@/components/error-notice';
import { Signal } from '@/components/signal';
import { TextLink } from '@/components/text-link';
import { describeError } from '@/lib/form-errors';
import { useLifetimeDependents } from '../api/get-lifetime-dependents';
import { useRefitStudy } from '../api/refit-study';
import { formatLifetime } from './library-format';
import { paths } from '@/lib/paths';

interface LifetimeDependentsProps {
  labId: string;
  compoundId: string;
  lifetimeId: string;
  userId: string;
  onStudyRefitted?: () => void;
}

/** Studies whose tau0 comes from this record; each is refitted only when a person chooses to, one by one. */
export function LifetimeDependents({
  labId,
  compoundId,
  lifetimeId,
  userId,
  onStudyRefitted,
}: LifetimeDependentsProps) {
  const dependents = useLifetimeDependents(labId, compoundId, lifetimeId);
  if (dependents.isPending) return <Signal tone="waiting">Looking for studies</Signal>;
  if (dependents.isError) return <ErrorNotice error={dependents.error} what="the studies using this lifetime" />;
  const { studies, value, uncertainty } = dependents.data;
  if (studies.length === 0) return <p className="text-caption text-ink-600">No study takes its τ0 from this record.</p>;
  const outdated = studies.filter((study) => !study.matchesRecord).length;
  const recordText = `${formatLifetime(value)}${uncertainty === null ? '' : ` ± ${formatLifetime(uncertainty, value)}`}`;
  return (
    <div className="space-y-2 text-body" role="region" aria-label="Studies using this lifetime">
      <p className="text-caption text-ink-700">
        {studies.length} {studies.length === 1 ? 'study takes' : 'studies take'} τ0 from this record ({recordText})
        {outdated > 0
          ? `; ${outdated} still ${outdated === 1 ? 'holds' : 'hold'} an older value. Choose which to refit: nothing is refitted automatically.`
          : '.'}
      </p>
      <ul className="divide-y divide-paper-200">
        {studies.map((study) => (
          <DependentStudy
            key={study.studyId}
            labId={labId}
            record={dependents.data}
            study={study}
            userId={userId}
            onRefitted={onStudyRefitted}
          />
        ))}
      </ul>
    </div>
  );
}

interface DependentStudyProps {
  labId: string;
  record: Dependents;
  study: LifetimeDependent;
  userId: string;
  onRefitted?: () => void;
}

function DependentStudy({ labId, record, study, userId, onRefitted }: DependentStudyProps) {
  const refit = useRefitStudy(labId, record, onRefitted);
  const tau0 = study.tau0 === null ? 'none' : formatLifetime(study.tau0);
  return (
    <li className="flex flex-wrap items-center gap-x-3 gap-y-1 py-2" aria-label={study.title}>
      <TextLink to={paths.study(labId, study.studyId)}>{study.title}</TextLink>
      <span className="text-caption text-ink-600">
        {study.status}, τ0 {tau0}
        {study.ownerName ? `, owner ${study.ownerName}` : ''}
      </span>
      {refit.isSuccess ? (
        <Signal tone="good">Refitted with the new τ0</Signal>
      ) : (
        <RefitChoice study={study} userId={userId} refit={refit} />
      )}
      {refit.isError && (
        <p role="alert" className="w-full text-caption font-bold text-brick-700">
          {describeError(refit.error)}
        </p>
      )}
    </li>
  );
}

function RefitChoice({
  study,
  userId,
  refit,
}: {
  study: LifetimeDependent;
  userId: string;
  refit: ReturnType<typeof useRefitStudy>;
}) {
  if (study.matchesRecord) return <Signal tone="good">Uses this value</Signal>;
  // The studies API refuses changes to approved and submitted studies and to other people's (requireEditable, requireOwner).
  if (study.status === 'approved') {
    return (
      <span className="text-caption text-brick-700">
        Approved and locked: start a new revision of the study to use the new value.
      </span>
    );
  }
  if (study.status === 'submitted') {
    return (
      <span className="text-caption text-brick-700">
        Waiting for review: it can be refitted once a reviewer returns it.
      </span>
    );
  }
  if (study.ownerId !== userId) {
    return (
      <span className="text-caption text-ink-600">
        Holds the older value; only its owner{study.ownerName ? `, ${study.ownerName},` : ''} can refit it.
      </span>
    );
  }
  return (
    <Button
      variant="quiet"
      pending={refit.isPending}
      pendingLabel="Refitting…"
      onClick={() => refit.mutate(study)}
      aria-label={`Refit ${study.title}`}
    >
      Refit with the new τ0
    </Button>
  );
}
