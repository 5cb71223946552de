import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { updateProfileSchema } from '@shared/schemas/auth';
import { FormShell } from '@/components/form-shell';
import { TextField } from '@/components/text-field';
import { useUpdateAccount } from '../api/update-account';
import { fieldsOf } from '@/lib/form-field';
import { formSubmission } from '@/lib/form-submission';

/** The name lab mates see beside one's studies and reviews. */
export function ProfileForm({ name, email }: { name: string; email: string }) {
  const update = useUpdateAccount();
  const form = useForm({ resolver: zodResolver(updateProfileSchema), defaultValues: { name } });
  const { isDirty } = form.formState;
  const field = fieldsOf(form);
  const submit = formSubmission(form, ['name'], update.isPending, (values, onError) =>
    update.mutate(values, { onSuccess: (user) => form.reset({ name: user.name }), onError }),
  );

  return (
    <FormShell
      {...submit}
      done={update.isSuccess && !isDirty && 'Name saved.'}
      submitLabel="Save name"
      pendingLabel="Saving…"
      disabled={!isDirty}
    >
      <p className="text-body text-ink-700">
        You sign in as <strong>{email}</strong>.
      </p>
      <TextField label="Name" autoComplete="name" {...field('name')} />
    </FormShell>
  );
}
