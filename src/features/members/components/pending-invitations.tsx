import type { PendingInvitation } from '@shared/schemas/members';
import { Button } from '@/components/button';
import { EmptyState } from '@/components/empty-state';
import { FormAlert } from '@/components/form-alert';
import { Tag } from '@/components/tag';
import { formatDate } from '@shared/format';
import { roleLabels } from '@/lib/role-labels';
import { useRevokeInvitation } from '../api/revoke-invitation';
import { describeMemberProblem } from './member-problem';

/** Invitations sent but not yet answered; withdrawing one makes its link stop working. */
export function PendingInvitations({ labId, invitations }: { labId: string; invitations: PendingInvitation[] }) {
  const revoke = useRevokeInvitation(labId);
  if (invitations.length === 0) {
    return (
      <EmptyState title="No invitations waiting.">Invitations you send appear here until they are answered.</EmptyState>
    );
  }
  return (
    <div className="space-y-3">
      {revoke.isError && <FormAlert>{describeMemberProblem(revoke.error)}</FormAlert>}
      <ul className="divide-y divide-paper-200">
        {invitations.map((invitation) => (
          <li key={invitation.id} className="flex flex-wrap items-center justify-between gap-3 py-2.5">
            <div>
              <p className="flex items-center gap-2 text-body font-bold text-ink-900">
                {invitation.email} <Tag>{roleLabels[invitation.role]}</Tag>
              </p>
              <p className="text-caption text-ink-500">
                Sent by {invitation.invitedBy} on {formatDate(invitation.createdAt)}; the link works until{' '}
                {formatDate(invitation.expiresAt)}.
              </p>
            </div>
            <Button
              variant="quiet"
              aria-label={`Withdraw the invitation for ${invitation.email}`}
              pending={revoke.isPending && revoke.variables === invitation.id}
              pendingLabel="Withdrawing…"
              onClick={() => revoke.mutate(invitation.id)}
            >
              Withdraw
            </Button>
          </li>
        ))}
      </ul>
    </div>
  );
}
