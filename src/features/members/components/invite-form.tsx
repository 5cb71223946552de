import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { inviteMemberSchema } from '@shared/schemas/members';
import { roleDescriptions } from '@shared/schemas/roles';
import { FormShell } from '@/components/form-shell';
import { TextField } from '@/components/text-field';
import { ApiError } from '@/lib/api-client';
import { roleOptions } from '@/lib/role-labels';
import { useInviteMember } from '../api/invite-member';
import { describeMemberProblem } from './member-problem';
import { fieldsOf } from '@/lib/form-field';
import { formSubmission } from '@/lib/form-submission';

/** Send someone an e-mail link that brings them into this lab with the chosen role. */
export function InviteForm({ labId }: { labId: string }) {
  const invite = useInviteMember(labId);
  const form = useForm({
    resolver: zodResolver(inviteMemberSchema),
    defaultValues: { email: '', role: 'researcher' as const },
  });
  const { errors } = form.formState;
  const field = fieldsOf(form);

  const submit = formSubmission(form, ['email', 'role'], invite.isPending, (values, onError) =>
    invite.mutate(values, {
      onSuccess: (invitation) => form.reset({ email: '', role: invitation.role }),
      onError: (error) =>
        error instanceof ApiError && error.status === 400
          ? onError(error)
          : form.setError('root.server', { type: 'server', message: describeMemberProblem(error) }),
    }),
  );

  return (
    <FormShell
      {...submit}
      done={
        invite.isSuccess &&
        !errors.root &&
        `Invitation sent to ${invite.data.email}. It appears below until it is answered.`
      }
      submitLabel="Send invitation"
      pendingLabel="Sending…"
    >
      <TextField label="E-mail of the person to invite" type="email" autoComplete="off" {...field('email')} />
      <fieldset className="space-y-2">
        <legend className="text-body font-bold text-ink-900">Role in this lab</legend>
        <div className="grid gap-2 sm:grid-cols-2">
          {roleOptions.map((option) => (
            <label
              key={option.value}
              className="flex cursor-pointer gap-2.5 rounded-md border border-paper-300 bg-white p-3 has-[:checked]:border-glow-400 has-[:checked]:bg-glow-50"
            >
              <input type="radio" value={option.value} className="mt-1 accent-glow-500" {...form.register('role')} />
              <span>
                <span className="block text-body font-bold text-ink-900">{option.label}</span>
                <span className="block text-caption text-ink-600">{roleDescriptions[option.value]}</span>
              </span>
            </label>
          ))}
        </div>
        {errors.role?.message && <p className="text-caption font-bold text-brick-700">{errors.role.message}</p>}
      </fieldset>
    </FormShell>
  );
}
