import { useState } from 'react';
import type { Member } from '@shared/schemas/members';
import type { Role } from '@shared/schemas/roles';
import { Button } from '@/components/button';
import { SelectField } from '@/components/select-field';
import { Tag } from '@/components/tag';
import { formatDate } from '@shared/format';
import { roleLabels, roleOptions } from '@/lib/role-labels';

interface MemberRowProps {
  member: Member;
  isSelf: boolean;
  canManage: boolean;
  busy: boolean;
  onRoleChange: (role: Role) => void;
  onRemove: () => void;
}

/** One member; admins can change the role or, after confirming, remove them from the lab. */
export function MemberRow({ member, isSelf, canManage, busy, onRoleChange, onRemove }: MemberRowProps) {
  const [confirming, setConfirming] = useState(false);
  const cell = 'px-3 py-2.5 align-middle';
  return (
    <tr className="border-t border-paper-200">
      <td className={`${cell} whitespace-nowrap font-bold text-ink-900`}>
        {member.name}
        {isSelf && <span className="ml-2 text-caption font-normal text-ink-500">(you)</span>}
      </td>
      <td className={`${cell} break-all text-ink-700`}>{member.email}</td>
      <td className={cell}>
        {canManage ? (
          <SelectField
            label={`Role of ${member.name}`}
            hideLabel
            options={roleOptions}
            value={member.role}
            disabled={busy}
            onChange={(event) => onRoleChange(event.target.value as Role)}
          />
        ) : (
          <Tag>{roleLabels[member.role]}</Tag>
        )}
      </td>
      <td className={`${cell} whitespace-nowrap text-ink-700`}>{formatDate(member.joinedAt)}</td>
      {canManage && (
        <td className={`${cell} whitespace-nowrap text-right`}>
          {confirming ? (
            <span className="inline-flex items-center gap-2">
              <span className="text-caption text-ink-700">{isSelf ? 'Leave this lab?' : `Remove ${member.name}?`}</span>
              <Button variant="danger" pending={busy} pendingLabel="Removing…" onClick={onRemove}>
                Yes, remove
              </Button>
              <Button variant="quiet" onClick={() => setConfirming(false)} disabled={busy}>
                Keep
              </Button>
            </span>
          ) : (
            <Button
              variant="quiet"
              aria-label={`Remove ${member.name}`}
              onClick={() => setConfirming(true)}
              disabled={busy}
            >
              Remove
            </Button>
          )}
        </td>
      )}
    </tr>
  );
}
