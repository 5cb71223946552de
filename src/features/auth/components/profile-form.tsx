import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { updateProfileSchema } from '@shared/schemas/auth';
import { FormShell } from '@/components/form-shell';
import { TextField } from '@/components/text-field';
import { showServerErrors } from '@/lib/form-errors';
import { useUpdateAccount } from '../api/update-account';
import { fieldsOf } from '@/lib/form-field';

/** The name lab mates see beside one's studies and reviews. */
export function ProfileForm({ name, email }: { name: string; email: string }) {
  const update = useUpdateAccount();
  const form = useForm({ resolver: zodResolver(updateProfileSchema), defaultValues: { name } });
  const { errors, isDirty } = form.formState;
  const field = fieldsOf(form);

  const onSubmit = form.handleSubmit((values) =>
    update.mutate(values, {
      onSuccess: (user) => form.reset({ name: user.name }),
      onError: (error) => showServerErrors(error, form.setError, ['name']),
    }),
  );

  return (
    <FormShell
      onSubmit={onSubmit}
      problem={errors.root?.server?.message}
      done={update.isSuccess && !isDirty && 'Name saved.'}
      submitLabel="Save name"
      pendingLabel="Saving…"
      pending={update.isPending}
      disabled={!isDirty}
    >
      <p className="text-body text-ink-700">
        You sign in as <strong>{email}</strong>.
      </p>
      <TextField label="Name" autoComplete="name" {...field('name')} />
    </FormShell>
  );
}
