import { MECHANISM_VERDICT_WORDS, type MechanismVerdictChange } from '@shared/schemas/mechanism-evidence';
import { FormAlert } from '@/components/form-alert';

/** What a change to the spectra did to the study's mechanism verdict: said every time, moved or not. */
export function VerdictChangeNotice({ what, change }: { what: string; change: MechanismVerdictChange }) {
  const before = MECHANISM_VERDICT_WORDS[change.before];
  const after = MECHANISM_VERDICT_WORDS[change.after];
  return (
    <FormAlert tone={change.before === change.after ? 'good' : 'note'}>
      {change.before === change.after
        ? `${what}. The mechanism verdict stays: ${after}.`
        : `${what}. The mechanism verdict moved from ${before} to ${after}.`}{' '}
      The history keeps both.
    </FormAlert>
  );
}
