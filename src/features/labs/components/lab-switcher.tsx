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
  /** Called after another lab was chosen (the phone drawer closes). */
  onSwitched?: () => void;
}

/** Where a lab-scoped address should go when the lab changes: the same screen, if the role allows it. */
function addressInLab(pathname: string, lab: LabMembership): string | null {
  const screen = labScreenOf(pathname);
  if (!screen) return null;
  return screen === routePatterns.labSettings && !can(lab.role, 'settings:manage')
    ? paths.members(lab.labId)
    : paths.labScreen(lab.labId, screen);
}

/**
 * The rail's lab chooser: which lab the screens show, and the person's role in it. Every lab's
 * whole name is shown, wrapped over lines when long; the other labs are buttons.
 */
export function LabSwitcher({ labs, current, onSwitched }: LabSwitcherProps) {
  const id = useId();
  const navigate = useNavigate();
  const { pathname } = useLocation();

  if (!current) {
    return <p className="rounded-md bg-ink-900 px-3 py-2 text-caption text-ink-200">You are not in any lab yet.</p>;
  }

  function choose(lab: LabMembership) {
    rememberLab(lab.labId);
    const address = addressInLab(pathname, lab);
    // Screens outside a lab (overview, account) read the remembered lab, so a re-render is enough.
    void navigate(address ?? pathname, { replace: address === null });
    onSwitched?.();
  }

  const others = labs.filter((lab) => lab.labId !== current.labId);
  return (
    <div className="rounded-md bg-ink-900 p-3">
      <p className="text-caption font-bold tracking-wide text-ink-200">Lab</p>
      <p className="mt-0.5 text-body font-bold leading-snug break-words text-paper-50">{current.labName}</p>
      <p className="mt-1.5 flex flex-wrap items-center gap-1.5 text-caption text-ink-200">
        <span>
          Your role: <strong className="text-glow-300">{roleLabels[current.role]}</strong>
        </span>
        {current.isDemo && <span className="rounded bg-glow-300 px-1.5 py-px font-bold text-ink-950">Demo</span>}
      </p>
      {others.length > 0 && (
        <div className="mt-3 border-t border-ink-700 pt-2">
          <p id={id} className="text-caption font-bold text-ink-200">
            Switch lab
          </p>
          <ul aria-labelledby={id} className="mt-1 space-y-1">
            {others.map((lab) => (
              <li key={lab.labId}>
                <button
                  type="button"
                  onClick={() => choose(lab)}
                  className="w-full rounded-md border border-ink-700 px-2.5 py-1.5 text-left text-caption text-paper-50 hover:border-ink-400 hover:bg-ink-800"
                >
                  <span className="block font-bold leading-snug break-words">{lab.labName}</span>
                  <span className="text-ink-200">
                    {roleLabels[lab.role]}
                    {lab.isDemo ? ' · demo' : ''}
                  </span>
                </button>
              </li>
            ))}
          </ul>
        </div>
      )}
    </div>
  );
}
