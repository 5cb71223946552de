import { useId } from 'react';
import { FormAlert } from '@/components/form-alert';
import { useUpdateSignInRules } from '../api/update-sign-in-rules';

interface SignInRulesFormProps {
  labId: string;
  requireTwoFactor: boolean;
  /** Whether the admin looking at this has two-step sign-in on (needed before requiring it). */
  ownTwoFactor: boolean;
}

/** One switch: the lab's admins and reviewers must sign in with a second step. */
export function SignInRulesForm({ labId, requireTwoFactor, ownTwoFactor }: SignInRulesFormProps) {
  const id = useId();
  const update = useUpdateSignInRules();
  return (
    <div className="space-y-3">
      <label htmlFor={id} className="flex items-start gap-3 text-body text-ink-900">
        <input
          id={id}
          type="checkbox"
          className="mt-1 h-4 w-4 accent-glow-500"
          checked={requireTwoFactor}
          disabled={update.isPending || (!requireTwoFactor && !ownTwoFactor)}
          onChange={(event) => update.mutate({ labId, requireTwoFactor: event.target.checked })}
        />
        <span>
          <strong>Admins and reviewers must use two-step sign-in.</strong> Those who approve results and manage members
          then sign in with a code from their phone as well as their password; until they turn it on, this lab stays
          closed to them. Researchers and viewers are not affected.
        </span>
      </label>
      {!requireTwoFactor && !ownTwoFactor && (
        <FormAlert tone="note">
          Turn on two-step sign-in for yourself first (Account), so the rule cannot lock you out.
        </FormAlert>
      )}
      {update.isError && <FormAlert>{update.error.message}</FormAlert>}
    </div>
  );
}
