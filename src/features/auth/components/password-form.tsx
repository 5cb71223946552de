import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { changePasswordSchema } from '@shared/schemas/auth';
import { FormShell } from '@/components/form-shell';
import { TextField } from '@/components/text-field';
import { NewPasswordFields } from './new-password-fields';
import { sameTwice } from './same-twice';
import { ApiError } from '@/lib/api-client';
import { showServerErrors } from '@/lib/form-errors';
import { useChangePassword } from '../api/change-password';
import { fieldsOf } from '@/lib/form-field';

const passwordChangeFormSchema = changePasswordSchema
  .extend({ confirm: z.string() })
  .refine(...sameTwice<{ newPassword: string; confirm: string }>('newPassword'));

const emptyForm = { currentPassword: '', newPassword: '', confirm: '' };

/** Change the password while signed in; the current one proves it is really the owner. */
export function PasswordForm() {
  const change = useChangePassword();
  const form = useForm({ resolver: zodResolver(passwordChangeFormSchema), defaultValues: emptyForm });
  const { errors } = form.formState;
  const field = fieldsOf(form);

  const onSubmit = form.handleSubmit(({ currentPassword, newPassword }) =>
    change.mutate(
      { currentPassword, newPassword },
      {
        onSuccess: () => form.reset(emptyForm),
        onError: (error) =>
          error instanceof ApiError && error.code === 'wrong_password'
            ? form.setError('currentPassword', { type: 'server', message: error.message })
            : showServerErrors(error, form.setError, ['currentPassword', 'newPassword']),
      },
    ),
  );

  return (
    <FormShell
      onSubmit={onSubmit}
      problem={errors.root?.server?.message}
      done={change.isSuccess && 'Password changed. Use the new one next time you sign in.'}
      submitLabel="Change password"
      pendingLabel="Changing…"
      pending={change.isPending}
    >
      <TextField
        label="Current password"
        type="password"
        autoComplete="current-password"
        {...field('currentPassword')}
      />
      <NewPasswordFields
        hint="At least 12 characters; a few unrelated words make a strong one."
        password={form.register('newPassword')}
        confirm={form.register('confirm')}
        errors={{ password: errors.newPassword?.message, confirm: errors.confirm?.message }}
      />
    </FormShell>
  );
}
