import { useState } from 'react';
import type { Member } from '@shared/schemas/members';
import type { Role } from '@shared/schemas/roles';
import { EmptyState } from '@/components/empty-state';
import { FormAlert } from '@/components/form-alert';
import { useChangeMemberRole } from '../api/change-member-role';
import { useRemoveMember } from '../api/remove-member';
import { describeMemberProblem } from './member-problem';
import { MemberRow } from './member-row';
import { TableHead } from '@/components/table-head';
import { TableScroll } from '@/components/table-scroll';

interface MembersTableProps {
  labId: string;
  members: Member[];
  canManage: boolean;
  selfUserId: string;
  /** The person changed their own membership, so their session's labs and roles are out of date. */
  onSelfChanged: (change: 'role' | 'removed') => void;
}

/** Everyone in the lab; admins manage roles and membership in place. */
export function MembersTable({ labId, members, canManage, selfUserId, onSelfChanged }: MembersTableProps) {
  const changeRole = useChangeMemberRole(labId);
  const remove = useRemoveMember(labId);
  const [problem, setProblem] = useState<string | null>(null);
  const busyId = changeRole.isPending ? changeRole.variables?.memberId : remove.isPending ? remove.variables : null;

  function setRole(member: Member, role: Role) {
    setProblem(null);
    changeRole.mutate(
      { memberId: member.id, role },
      {
        onSuccess: () => member.userId === selfUserId && onSelfChanged('role'),
        onError: (error) => setProblem(describeMemberProblem(error)),
      },
    );
  }

  function removeMember(member: Member) {
    setProblem(null);
    remove.mutate(member.id, {
      onSuccess: () => member.userId === selfUserId && onSelfChanged('removed'),
      onError: (error) => setProblem(describeMemberProblem(error)),
    });
  }

  if (members.length === 0) return <EmptyState title="Nobody is in this lab yet." />;
  return (
    <div className="space-y-3">
      {problem && <FormAlert>{problem}</FormAlert>}
      <TableScroll label="Members, scroll sideways">
        <table className="w-full text-body">
          <TableHead
            look="spaced"
            columns={[
              'Name',
              'E-mail',
              'Role',
              { label: 'Member since', className: 'whitespace-nowrap' },
              canManage && <span className="sr-only">Actions</span>,
            ]}
          />
          <tbody>
            {members.map((member) => (
              <MemberRow
                key={member.id}
                member={member}
                isSelf={member.userId === selfUserId}
                canManage={canManage}
                busy={busyId === member.id}
                onRoleChange={(role) => setRole(member, role)}
                onRemove={() => removeMember(member)}
              />
            ))}
          </tbody>
        </table>
      </TableScroll>
    </div>
  );
}
