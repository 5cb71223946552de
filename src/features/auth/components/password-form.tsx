import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { changePasswordSchema } from '@shared/schemas/auth';
import { FormShell } from '@/components/form-shell';
import { TextField } from '@/components/text-field';
import { NewPasswordFields } from './new-password-fields';
import { sameTwice } from './same-twice';
import { ApiError } from '@/lib/api-client';
import { useChangePassword } from '../api/change-password';
import { fieldsOf } from '@/lib/form-field';
import { formSubmission } from '@/lib/form-submission';

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

  const fields = ['currentPassword', 'newPassword'] as const;
  const submit = formSubmission(form, fields, change.isPending, ({ currentPassword, newPassword }, onError) =>
    change.mutate(
      { currentPassword, newPassword },
      {
        onSuccess: () => form.reset(emptyForm),
        onError: (error) =>
          error instanceof ApiError && error.code === 'wrong_password'
            ? form.setError('currentPassword', { type: 'server', message: error.message })
            : onError(error),
      },
    ),
  );

  return (
    <FormShell
      {...submit}
      done={change.isSuccess && 'Password changed. Use the new one next time you sign in.'}
      submitLabel="Change password"
      pendingLabel="Changing…"
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
