import { useQueryClient } from '@tanstack/react-query';
import { useNavigate } from 'react-router-dom';
import { ErrorNotice } from '@/components/error-notice';
import { Panel } from '@/components/panel';
import { Signal } from '@/components/signal';
import { authKeys } from '@/features/auth/api/auth-keys';
import { useSession } from '@/features/auth/api/get-session';
import { useMembers } from '@/features/members/api/get-members';
import { InviteForm } from '@/features/members/components/invite-form';
import { MembersTable } from '@/features/members/components/members-table';
import { PendingInvitations } from '@/features/members/components/pending-invitations';
import { paths } from '@/lib/paths';
import { can } from '@/lib/policy';
import { useLab } from '@/routes/lab-context';
import { ScreenHeader } from '@/components/screen-header';
import { Tag } from '@/components/tag';

/** Who works in the lab and with which role; admins invite, re-role and remove people here. */
export function MembersRoute() {
  const lab = useLab();
  const { user } = useSession();
  return (
    <MembersScreen
      labId={lab.labId}
      labName={lab.labName}
      canManage={can(lab.role, 'members:manage')}
      isDemo={lab.isDemo}
      selfUserId={user.id}
    />
  );
}

interface MembersScreenProps {
  labId: string;
  labName: string;
  isDemo: boolean;
  canManage: boolean;
  selfUserId: string;
}

function MembersScreen({ labId, labName, isDemo, canManage, selfUserId }: MembersScreenProps) {
  const members = useMembers(labId);
  const queryClient = useQueryClient();
  const navigate = useNavigate();

  async function onSelfChanged(change: 'role' | 'removed') {
    await queryClient.invalidateQueries({ queryKey: authKeys.session() });
    if (change === 'removed') await navigate(paths.overview(), { replace: true });
  }

  return (
    <div className="max-w-5xl space-y-6">
      <ScreenHeader lab={{ labName, isDemo }} title="Members">
        <p className="mt-1 text-lead text-ink-700">
          {canManage
            ? 'Everyone who works in this lab. As an admin you decide who joins and what each person may do.'
            : 'Everyone who works in this lab. Only the lab’s admins can change who is here.'}
        </p>
      </ScreenHeader>
      <Panel
        title="People"
        aside={members.data && <Tag tone="neutral">{`${members.data.members.length} in the lab`}</Tag>}
      >
        {members.isPending && <Signal tone="waiting">Loading members</Signal>}
        {members.isError && <ErrorNotice error={members.error} what="the members" />}
        {members.data && (
          <MembersTable
            labId={labId}
            members={members.data.members}
            canManage={canManage}
            selfUserId={selfUserId}
            onSelfChanged={(change) => void onSelfChanged(change)}
          />
        )}
      </Panel>
      {canManage && (
        <>
          <Panel title="Invite someone">
            <InviteForm labId={labId} />
          </Panel>
          <Panel title="Invitations waiting for an answer">
            {members.data && <PendingInvitations labId={labId} invitations={members.data.invitations} />}
          </Panel>
        </>
      )}
    </div>
  );
}
