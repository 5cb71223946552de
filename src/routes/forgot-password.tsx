import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { requestPasswordResetSchema } from '@shared/schemas/auth';
import { Button } from '@/components/button';
import { FormAlert } from '@/components/form-alert';
import { TextField } from '@/components/text-field';
import { TextLink } from '@/components/text-link';
import { useRequestPasswordReset } from '@/features/auth/api/request-password-reset';
import { showServerErrors } from '@/lib/form-errors';
import { paths } from '@/lib/paths';

/** Ask for a link to choose a new password. The answer never says whether the address has an account. */
export function ForgotPasswordRoute() {
  const requestReset = useRequestPasswordReset();
  const form = useForm({ resolver: zodResolver(requestPasswordResetSchema), defaultValues: { email: '' } });
  const { errors } = form.formState;

  const onSubmit = form.handleSubmit((values) =>
    requestReset.mutate(values, { onError: (error) => showServerErrors(error, form.setError, ['email']) }),
  );

  return (
    <div className="space-y-5">
      <header>
        <h1 className="text-title font-black text-ink-950">Choose a new password</h1>
        <p className="text-body text-ink-700">
          Tell us the address you sign in with and we will e-mail you a link to set a new password.
        </p>
      </header>
      {requestReset.isSuccess ? (
        <FormAlert tone="good">
          If that address belongs to a Halflight account, a link is on its way. It works once, for a limited time; check
          the spam folder if nothing arrives within a few minutes.
        </FormAlert>
      ) : (
        <form onSubmit={onSubmit} noValidate className="space-y-4">
          <TextField
            label="E-mail"
            type="email"
            autoComplete="email"
            error={errors.email?.message}
            {...form.register('email')}
          />
          {errors.root?.server && <FormAlert>{errors.root.server.message}</FormAlert>}
          <Button type="submit" className="w-full" pending={requestReset.isPending} pendingLabel="Sending…">
            Send me a link
          </Button>
        </form>
      )}
      <p className="text-body text-ink-700">
        Remembered it? <TextLink to={paths.signIn()}>Back to sign in</TextLink>
      </p>
    </div>
  );
}
