import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { joinWithAccountSchema, joinWithNewAccountSchema } from '@shared/schemas/auth';
import type { InvitationPreview, Session } from '@shared/schemas/auth';
import type { SecondStepNeeded } from '@shared/schemas/two-factor';
import { Button } from '@/components/button';
import { FormAlert } from '@/components/form-alert';
import { TextField } from '@/components/text-field';
import { NewPasswordFields } from './new-password-fields';
import { sameTwice } from './same-twice';
import { showServerErrors } from '@/lib/form-errors';
import { useAcceptInvitation } from '../api/accept-invitation';

// A new account chooses a password under the same rules as a reset; the two entries must agree.
const newAccountSchema = joinWithNewAccountSchema
  .extend({ confirm: z.string() })
  .refine(...sameTwice<{ password: string; confirm: string }>('password'));

interface AcceptInvitationFormProps {
  token: string;
  invitation: InvitationPreview;
  onJoined: (answer: Session | SecondStepNeeded) => void;
}

/** Joining with an existing account needs only its password; a newcomer picks a name and a password. */
export function AcceptInvitationForm({ token, invitation, onJoined }: AcceptInvitationFormProps) {
  return invitation.accountExists ? (
    <ExistingAccountForm token={token} onJoined={onJoined} />
  ) : (
    <NewAccountForm token={token} onJoined={onJoined} />
  );
}

type FormProps = Omit<AcceptInvitationFormProps, 'invitation'>;

function ExistingAccountForm({ token, onJoined }: FormProps) {
  const accept = useAcceptInvitation();
  const form = useForm({
    resolver: zodResolver(joinWithAccountSchema),
    defaultValues: { password: '' },
  });
  const { errors } = form.formState;
  const onSubmit = form.handleSubmit(({ password }) =>
    accept.mutate(
      { token, password },
      { onSuccess: onJoined, onError: (error) => showServerErrors(error, form.setError, ['password']) },
    ),
  );
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      <p className="text-body text-ink-700">This address already has a Halflight account. Join with its password.</p>
      <TextField
        label="Password"
        type="password"
        autoComplete="current-password"
        error={errors.password?.message}
        {...form.register('password')}
      />
      {errors.root?.server && <FormAlert>{errors.root.server.message}</FormAlert>}
      <Button type="submit" className="w-full" pending={accept.isPending} pendingLabel="Joining…">
        Join with my account
      </Button>
    </form>
  );
}

function NewAccountForm({ token, onJoined }: FormProps) {
  const accept = useAcceptInvitation();
  const form = useForm({
    resolver: zodResolver(newAccountSchema),
    defaultValues: { name: '', password: '', confirm: '' },
  });
  const { errors } = form.formState;
  const onSubmit = form.handleSubmit(({ name, password }) =>
    accept.mutate(
      { token, name, password },
      { onSuccess: onJoined, onError: (error) => showServerErrors(error, form.setError, ['name', 'password']) },
    ),
  );
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      <TextField
        label="Your name"
        autoComplete="name"
        hint="As your lab mates will see it."
        error={errors.name?.message}
        {...form.register('name')}
      />
      <NewPasswordFields
        label="Password"
        hint="At least 12 characters; a few unrelated words make a strong one."
        password={form.register('password')}
        confirm={form.register('confirm')}
        errors={{ password: errors.password?.message, confirm: errors.confirm?.message }}
      />
      {errors.root?.server && <FormAlert>{errors.root.server.message}</FormAlert>}
      <Button type="submit" className="w-full" pending={accept.isPending} pendingLabel="Joining…">
        Create my account and join
      </Button>
    </form>
  );
}
