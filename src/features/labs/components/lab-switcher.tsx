import { useId } from 'react';
import { useLocation, useNavigate } from 'react-router-dom';
import type { LabMembership } from '@shared/schemas/auth';
import { can } from '@/lib/policy';
import { roleLabels } from '@/lib/role-labels';
import { rememberLab } from '../current-lab';
import { labScreenOf, paths, routePatterns } from '@/lib/paths';

interface LabSwitcherProps {
  labs: LabMembership[];
  current: LabMembership | null;
}

/** Where a lab-scoped address should go when the lab changes: the same screen, if the role allows it. */
function addressInLab(pathname: string, lab: LabMembership): string | null {
  const screen = labScreenOf(pathname);
  if (!screen) return null;
  return screen === routePatterns.labSettings && !can(lab.role, 'settings:manage')
    ? paths.members(lab.labId)
    : paths.labScreen(lab.labId, screen);
}

/** The rail's lab chooser: which lab the screens show, and the person's role in it. */
export function LabSwitcher({ labs, current }: LabSwitcherProps) {
  const id = useId();
  const navigate = useNavigate();
  const { pathname } = useLocation();

  if (!current) {
    return <p className="rounded-md bg-ink-900 px-3 py-2 text-caption text-ink-300">You are not in any lab yet.</p>;
  }

  function choose(labId: string) {
    const lab = labs.find((candidate) => candidate.labId === labId);
    if (!lab) return;
    rememberLab(lab.labId);
    const address = addressInLab(pathname, lab);
    // Screens outside a lab (overview, account) read the remembered lab, so a re-render is enough.
    void navigate(address ?? pathname, { replace: address === null });
  }

  return (
    <div className="rounded-md bg-ink-900 p-3">
      <p className="text-caption uppercase text-ink-400">Lab</p>
      <p className="mt-0.5 text-body font-bold leading-snug text-paper-50">{current.labName}</p>
      <p className="mt-1.5 flex flex-wrap items-center gap-1.5 text-caption text-ink-300">
        <span>
          Your role: <strong className="text-glow-300">{roleLabels[current.role]}</strong>
        </span>
        {current.isDemo && <span className="rounded bg-glow-400 px-1.5 py-px font-bold text-ink-950">Demo</span>}
      </p>
      {labs.length > 1 && (
        <div className="mt-3 border-t border-ink-800 pt-2">
          <label htmlFor={id} className="text-caption text-ink-400">
            Switch lab
          </label>
          <select
            id={id}
            value={current.labId}
            onChange={(event) => choose(event.target.value)}
            className="mt-1 w-full rounded-md border border-ink-700 bg-ink-950 px-2 py-1 text-caption text-paper-50"
          >
            {labs.map((lab) => (
              <option key={lab.labId} value={lab.labId}>
                {lab.labName} ({roleLabels[lab.role].toLowerCase()}
                {lab.isDemo ? ', demo' : ''})
              </option>
            ))}
          </select>
        </div>
      )}
    </div>
  );
}
