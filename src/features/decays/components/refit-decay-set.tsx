import { useState } from 'react';
import type { DecayModel, DecaySet, DecaySetRefit } from '@shared/schemas/decays';
import { Button } from '@/components/button';
import { FormAlert } from '@/components/form-alert';
import { describeError } from '@/lib/form-errors';
import { useRefitDecaySet } from '../api/refit-decay-set';
import { DecayModelPicker } from './decay-model-picker';

/** What a refit changed, in words: nothing that took numbers from the set changes unsaid. */
function refitSummary(answer: DecaySetRefit): string {
  const { study, lifetime } = answer;
  const parts: string[] = [];
  if (study) {
    const lifetimes = `${study.points} lifetime${study.points === 1 ? '' : 's'}`;
    parts.push(
      `${study.tau0 ? `${lifetimes} and τ0` : lifetimes} of the study now come from the new fit, and the study was fitted again (see its history)`,
    );
  } else parts.push('The study does not use this set, so it is unchanged');
  if (lifetime)
    parts.push(
      `its library lifetime record took the new value${
        lifetime.outdatedStudies > 0
          ? `; ${lifetime.outdatedStudies} ${lifetime.outdatedStudies === 1 ? 'study uses' : 'studies use'} that record and still ${lifetime.outdatedStudies === 1 ? 'holds' : 'hold'} the older value until refitted from the library`
          : ''
      }`,
    );
  return `Refitted. ${parts.join('; ')}.`;
}

/**
 * Fit a kept set again with another model. Says before the click what will follow (the study's
 * lifetimes and tau0 from this set) and after it what did.
 */
export function RefitDecaySet({
  labId,
  studyId,
  set,
  inUse,
  onRefitted,
}: {
  labId: string;
  studyId: string;
  set: DecaySet;
  inUse: boolean;
  onRefitted: () => void;
}) {
  const [model, setModel] = useState<DecayModel>(set.model);
  const [done, setDone] = useState<string | null>(null);
  const refit = useRefitDecaySet(labId, studyId, set.id, onRefitted);
  return (
    <details className="rounded-md border border-paper-200 p-3">
      <summary className="cursor-pointer text-body font-bold">Fit this set again with another model</summary>
      <div className="mt-3 space-y-3">
        <p className="text-caption text-ink-700">
          The kept files are fitted again with the choices below.{' '}
          {inUse
            ? 'The lifetimes and τ0 this set gave the study take the new values and the study is fitted again; a lifetime you typed over stays as you typed it. The history records the refit.'
            : 'The study does not use this set yet, so only the set changes.'}{' '}
          If a decay cannot be fitted, nothing changes.
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
          Refit this set
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
