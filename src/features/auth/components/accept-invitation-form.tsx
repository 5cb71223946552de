import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { joinWithAccountSchema, joinWithNewAccountSchema } from '@shared/schemas/auth';
import type { InvitationPreview, Session } from '@shared/schemas/auth';
import type { SecondStepNeeded } from '@shared/schemas/two-factor';
import { FormShell } from '@/components/form-shell';
import { TextField } from '@/components/text-field';
import { NewPasswordFields } from './new-password-fields';
import { sameTwice } from './same-twice';
import { useAcceptInvitation } from '../api/accept-invitation';
import { fieldsOf } from '@/lib/form-field';
import { formSubmission } from '@/lib/form-submission';

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
  const field = fieldsOf(form);
  const submit = formSubmission(form, ['password'], accept.isPending, ({ password }, onError) =>
    accept.mutate({ token, password }, { onSuccess: onJoined, onError }),
  );
  return (
    <FormShell {...submit} submitLabel="Join with my account" pendingLabel="Joining…" wide>
      <p className="text-body text-ink-700">This address already has a Halflight account. Join with its password.</p>
      <TextField label="Password" type="password" autoComplete="current-password" {...field('password')} />
    </FormShell>
  );
}

function NewAccountForm({ token, onJoined }: FormProps) {
  const accept = useAcceptInvitation();
  const form = useForm({
    resolver: zodResolver(newAccountSchema),
    defaultValues: { name: '', password: '', confirm: '' },
  });
  const { errors } = form.formState;
  const field = fieldsOf(form);
  const submit = formSubmission(form, ['name', 'password'], accept.isPending, ({ name, password }, onError) =>
    accept.mutate({ token, name, password }, { onSuccess: onJoined, onError }),
  );
  return (
    <FormShell {...submit} submitLabel="Create my account and join" pendingLabel="Joining…" wide>
      <TextField label="Your name" autoComplete="name" hint="As your lab mates will see it." {...field('name')} />
      <NewPasswordFields
        label="Password"
        hint="At least 12 characters; a few unrelated words make a strong one."
        password={form.register('password')}
        confirm={form.register('confirm')}
        errors={{ password: errors.password?.message, confirm: errors.confirm?.message }}
      />
    </FormShell>
  );
}
