import { Link } from 'react-router-dom';
import type { LabMembership } from '@shared/schemas/auth';
import { EmptyState } from '@/components/empty-state';
import { Panel } from '@/components/panel';
import { Tag } from '@/components/tag';
import { roleLabels } from '@/lib/role-labels';
import { rememberLab } from '../current-lab';
import { paths } from '@/lib/paths';

/** Every lab the person belongs to, with their role in each. */
export function YourLabsPanel({ labs }: { labs: LabMembership[] }) {
  return (
    <Panel title="Your labs">
      {labs.length === 0 ? (
        <EmptyState title="You are not in any lab yet.">
          A lab admin can invite you; the link in their e-mail brings you in.
        </EmptyState>
      ) : (
        <ul className="divide-y divide-paper-200">
          {labs.map((lab) => (
            <li key={lab.labId} className="flex items-center justify-between gap-4 py-2.5">
              <span className="flex items-center gap-2">
                <span className="text-body font-bold text-ink-900">{lab.labName}</span>
                {lab.isDemo && <Tag tone="demo">Demo</Tag>}
              </span>
              <span className="flex items-center gap-4">
                <Tag>{roleLabels[lab.role]}</Tag>
                <Link
                  to={paths.members(lab.labId)}
                  onClick={() => rememberLab(lab.labId)}
                  className="text-body font-bold text-ink-600 underline decoration-glow-400 underline-offset-4 hover:text-ink-900"
                  aria-label={`Members of ${lab.labName}`}
                >
                  Members
                </Link>
              </span>
            </li>
          ))}
        </ul>
      )}
    </Panel>
  );
}
