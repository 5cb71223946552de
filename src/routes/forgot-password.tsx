import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { requestPasswordResetSchema } from '@shared/schemas/auth';
import { FormAlert } from '@/components/form-alert';
import { FormShell } from '@/components/form-shell';
import { TextField } from '@/components/text-field';
import { TextLink } from '@/components/text-link';
import { useRequestPasswordReset } from '@/features/auth/api/request-password-reset';
import { paths } from '@/lib/paths';
import { PublicScreen } from './public-screen';
import { fieldsOf } from '@/lib/form-field';
import { formSubmission } from '@/lib/form-submission';

/** Ask for a link to choose a new password. The answer never says whether the address has an account. */
export function ForgotPasswordRoute() {
  const requestReset = useRequestPasswordReset();
  const form = useForm({ resolver: zodResolver(requestPasswordResetSchema), defaultValues: { email: '' } });
  const field = fieldsOf(form);
  const submit = formSubmission(form, ['email'], requestReset.isPending, (values, onError) =>
    requestReset.mutate(values, { onError }),
  );

  return (
    <PublicScreen
      title="Choose a new password"
      lead="Tell us the address you sign in with and we will e-mail you a link to set a new password."
      footer={
        <>
          Remembered it? <TextLink to={paths.signIn()}>Back to sign in</TextLink>
        </>
      }
    >
      {requestReset.isSuccess ? (
        <FormAlert tone="good">
          If that address belongs to a Halflight account, a link is on its way. It works once, for a limited time; check
          the spam folder if nothing arrives within a few minutes.
        </FormAlert>
      ) : (
        <FormShell {...submit} submitLabel="Send me a link" pendingLabel="Sending…" wide>
          <TextField label="E-mail" type="email" autoComplete="email" {...field('email')} />
        </FormShell>
      )}
    </PublicScreen>
  );
}
