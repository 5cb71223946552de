import { useState } from 'react';
import type { DecayModel, DecaySet, DecaySetRefit } from '@shared/schemas/decays';
import { Button } from '@/components/button';
import { FormAlert } from '@/components/form-alert';
import { describeError } from '@/lib/form-errors';
import { useRefitDecaySet, type DecaySetOwner } from '../api/refit-decay-set';
import { DecayModelPicker } from './decay-model-picker';

const studies = (count: number) => `${count} ${count === 1 ? 'study uses' : 'studies use'}`;

/** What a refit changed, in words: nothing that took numbers from the set changes unsaid. */
function refitSummary(answer: DecaySetRefit): string {
  const { study, lifetime } = answer;
  const parts: string[] = [];
  if (answer.set.studyId) {
    if (study) {
      const lifetimes = `${study.points} lifetime${study.points === 1 ? '' : 's'}`;
      parts.push(
        `${study.tau0 ? `${lifetimes} and τ0` : lifetimes} of the study now come from the new fit, and the study was fitted again (see its history)`,
      );
    } else parts.push('The study does not use this set, so it is unchanged');
  }
  if (lifetime) {
    const record = answer.set.studyId ? 'its library lifetime record' : 'The lifetime record';
    const older = lifetime.outdatedStudies === 1 ? 'holds' : 'hold';
    parts.push(
      `${record} took the new value${
        lifetime.outdatedStudies > 0
          ? `; ${studies(lifetime.outdatedStudies)} that record and still ${older} the older τ0 until refitted from "Studies using it"`
          : ''
      }`,
    );
  } else if (!answer.set.studyId)
    parts.push('No lifetime record comes from this decay any more, so only the fit changed');
  return `Refitted. ${parts.join('; ')}.`;
}

/**
 * Fit a kept set again with another model. Says before the click what will follow (the study's
 * lifetimes and tau0 from this set, or the library lifetime record it gives) and after it what did.
 */
export function RefitDecaySet({
  labId,
  owner,
  set,
  inUse,
  onRefitted,
}: {
  labId: string;
  owner: DecaySetOwner;
  set: DecaySet;
  /** a study's set: whether the study uses it; a library set: whether its lifetime record is still there */
  inUse: boolean;
  onRefitted: (answer: DecaySetRefit) => void;
}) {
  const [model, setModel] = useState<DecayModel>(set.model);
  const [done, setDone] = useState<string | null>(null);
  const refit = useRefitDecaySet(labId, owner, set.id, onRefitted);
  const follows =
    'studyId' in owner
      ? inUse
        ? 'The lifetimes and τ0 this set gave the study take the new values and the study is fitted again; a lifetime you typed over stays as you typed it. The history records the refit.'
        : 'The study does not use this set yet, so only the set changes.'
      : inUse
        ? 'The lifetime record it gave takes the new value, and the change is recorded with your name. Studies that took their τ0 from the record keep it until their owners refit them from "Studies using it".'
        : 'Its lifetime record was removed, so only the fit changes.';
  const noun = 'studyId' in owner ? 'set' : 'decay';
  return (
    <details className="rounded-md border border-paper-200 p-3">
      <summary className="cursor-pointer text-body font-bold">Fit this {noun} again with another model</summary>
      <div className="mt-3 space-y-3">
        <p className="text-caption text-ink-700">
          The kept files are fitted again with the choices below. {follows} If a decay cannot be fitted, nothing
          changes.
        </p>
        <DecayModelPicker
          model={model}
          onChange={(next) => {
            setModel(next);
            setDone(null);
          }}
        />
        <Button
          variant="quiet"
          pending={refit.isPending}
          pendingLabel="Refitting…"
          onClick={() =>
            refit.mutate({ model, version: set.version }, { onSuccess: (answer) => setDone(refitSummary(answer)) })
          }
        >
          Refit this {noun}
        </Button>
        {done && (
          <p role="status" className="text-body text-moss-700">
            {done}
          </p>
        )}
        {refit.isError && <FormAlert>{describeError(refit.error)}</FormAlert>}
      </div>
    </details>
  );
}
