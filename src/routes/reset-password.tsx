import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useNavigate, useSearchParams } from 'react-router-dom';
import { z } from 'zod';
import { passwordSchema } from '@shared/schemas/auth';
import { FormShell } from '@/components/form-shell';
import { TextLink } from '@/components/text-link';
import { useCompletePasswordReset } from '@/features/auth/api/complete-password-reset';
import { ApiError } from '@/lib/api-client';
import { showServerErrors } from '@/lib/form-errors';
import { NewPasswordFields } from '@/features/auth/components/new-password-fields';
import { sameTwice } from '@/features/auth/components/same-twice';
import { paths } from '@/lib/paths';
import { PublicScreen } from './public-screen';

const newPasswordSchema = z
  .object({ password: passwordSchema, confirm: z.string() })
  .refine(...sameTwice<{ password: string; confirm: string }>('password'));

/** Set a new password from the link in the reset e-mail, then sign in with it. */
export function ResetPasswordRoute() {
  const [params] = useSearchParams();
  const token = params.get('token');
  const navigate = useNavigate();
  const completeReset = useCompletePasswordReset();
  const form = useForm({ resolver: zodResolver(newPasswordSchema), defaultValues: { password: '', confirm: '' } });
  const { errors } = form.formState;

  if (!token) {
    return (
      <PublicScreen
        title="This link is incomplete"
        lead={
          <>
            Open the link from the e-mail exactly as it arrived, or{' '}
            <TextLink to={paths.forgotPassword()}>ask for a new one</TextLink>.
          </>
        }
      />
    );
  }

  const onSubmit = form.handleSubmit(({ password }) =>
    completeReset.mutate(
      { token, password },
      {
        onSuccess: () =>
          navigate(paths.signIn(), { replace: true, state: { notice: 'Your new password is set. Sign in with it.' } }),
        onError: (error) => showServerErrors(error, form.setError, ['password']),
      },
    ),
  );
  const linkSpent = completeReset.error instanceof ApiError && completeReset.error.code === 'token_invalid';

  return (
    <PublicScreen
      title="Set a new password"
      lead="At least 12 characters. A few unrelated words make a strong one; common passwords are refused."
    >
      <FormShell
        onSubmit={onSubmit}
        problem={
          errors.root?.server && (
            <>
              {errors.root.server.message}
              {linkSpent && (
                <>
                  {' '}
                  <TextLink to={paths.forgotPassword()}>Ask for a new link</TextLink>.
                </>
              )}
            </>
          )
        }
        submitLabel="Save the new password"
        pendingLabel="Saving…"
        pending={completeReset.isPending}
        wide
      >
        <NewPasswordFields
          password={form.register('password')}
          confirm={form.register('confirm')}
          errors={{ password: errors.password?.message, confirm: errors.confirm?.message }}
        />
      </FormShell>
    </PublicScreen>
  );
}
