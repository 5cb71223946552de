import { useId, useState } from 'react';
import { NavLink, Outlet, useNavigate } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { Button } from '@/components/button';
import { Drawer } from '@/components/drawer';
import { HalflightMark } from '@/components/halflight-mark';
import { useSession } from '@/features/auth/api/get-session';
import { useSignOut } from '@/features/auth/api/sign-out';
import { LabSwitcher } from '@/features/labs/components/lab-switcher';
import { useCurrentLab } from '@/features/labs/current-lab';
import { can } from '@/lib/policy';
import { paths } from '@/lib/paths';

const linkClasses = ({ isActive }: { isActive: boolean }) =>
  `rounded-md px-3 py-2 text-body transition-colors ${
    isActive ? 'bg-ink-800 font-bold text-glow-300' : 'text-ink-200 hover:bg-ink-900 hover:text-paper-50'
  }`;

function HomeLink({ onNavigate }: { onNavigate?: () => void }) {
  return (
    <NavLink
      to={paths.overview()}
      onClick={onNavigate}
      className="flex items-center gap-2.5 text-glow-400"
      aria-label="Halflight home"
    >
      <HalflightMark />
      <span className="text-title font-black tracking-tight text-paper-50">Halflight</span>
    </NavLink>
  );
}

/** The rail's content: the lab, the navigation and signing out. `onNavigate` closes the phone drawer. */
function Rail({ onNavigate }: { onNavigate?: () => void }) {
  const session = useSession();
  const lab = useCurrentLab(session.user.labs);
  const signOut = useSignOut();
  const navigate = useNavigate();
  const queryClient = useQueryClient();

  const navigation = [
    { to: paths.overview(), label: 'Overview', end: true },
    ...(lab && can(lab.role, 'studies:view') ? [{ to: paths.studies(lab.labId), label: 'Studies' }] : []),
    ...(lab && can(lab.role, 'library:view') ? [{ to: paths.library(lab.labId), label: 'Library' }] : []),
    ...(lab && can(lab.role, 'members:view') ? [{ to: paths.members(lab.labId), label: 'Members' }] : []),
    ...(lab ? [{ to: paths.compare(lab.labId), label: 'Compare' }] : []),
    ...(lab ? [{ to: paths.scenarios(lab.labId), label: 'Who quenches?' }] : []),
    ...(lab ? [{ to: paths.temperatureSeries(lab.labId), label: 'Temperature' }] : []),
    ...(lab ? [{ to: paths.planner(lab.labId), label: 'Planner' }] : []),
    ...(lab && can(lab.role, 'settings:manage') ? [{ to: paths.labSettings(lab.labId), label: 'Lab settings' }] : []),
    { to: paths.account(), label: 'Account' },
    ...(session.mailCatcher ? [{ to: paths.caughtMail(), label: 'Caught mail' }] : []),
  ];

  function leave() {
    signOut.mutate(undefined, {
      // Leave the signed-in screens before forgetting the person, so none renders without them.
      onSuccess: async () => {
        await navigate(paths.signIn(), { replace: true });
        queryClient.clear();
      },
    });
  }

  return (
    <>
      <LabSwitcher labs={session.user.labs} current={lab} onSwitched={onNavigate} />
      <nav aria-label="Main" className="mt-6 flex flex-col gap-1">
        {navigation.map((item) => (
          <NavLink key={item.to} to={item.to} end={item.end} className={linkClasses} onClick={onNavigate}>
            {item.label}
          </NavLink>
        ))}
      </nav>
      <div className="mt-auto space-y-2 border-t border-ink-800 pt-4">
        <p className="text-caption break-words text-ink-300">
          Signed in as <strong className="text-paper-50">{session.user.name}</strong>
        </p>
        <Button
          variant="quiet"
          className="w-full"
          onClick={leave}
          pending={signOut.isPending}
          pendingLabel="Signing out…"
        >
          Sign out
        </Button>
        {signOut.isError && (
          <p role="alert" className="text-caption text-brick-100">
            Could not sign out; try again.
          </p>
        )}
      </div>
    </>
  );
}

/** Three bars: the menu button's picture. */
function MenuIcon() {
  return (
    <svg viewBox="0 0 20 20" className="h-5 w-5" aria-hidden="true">
      <path d="M3 5h14M3 10h14M3 15h14" stroke="currentColor" strokeWidth="2" strokeLinecap="round" />
    </svg>
  );
}

/**
 * The frame of every signed-in screen. From the `lg` breakpoint up, a rail with the mark, the lab,
 * the navigation and signing out sits beside the work area; below it, a bar with the mark and a
 * Menu button that opens the same rail as a drawer, so the work area gets the whole width.
 */
export function RootLayout() {
  const [menuOpen, setMenuOpen] = useState(false);
  const drawerId = useId();
  const close = () => setMenuOpen(false);

  return (
    <div className="min-h-screen lg:flex">
      <header className="surface-dark sticky top-0 z-30 flex items-center justify-between gap-3 bg-ink-950 px-4 py-2.5 lg:hidden print:hidden">
        <HomeLink />
        <button
          type="button"
          aria-haspopup="dialog"
          aria-expanded={menuOpen}
          aria-controls={drawerId}
          onClick={() => setMenuOpen(true)}
          className="inline-flex items-center gap-2 rounded-md border border-ink-700 px-3 py-1.5 text-body font-bold text-paper-50 hover:bg-ink-900"
        >
          <MenuIcon />
          Menu
        </button>
      </header>
      <Drawer id={drawerId} open={menuOpen} onClose={close} label="Menu">
        <div className="surface-dark flex min-h-full flex-col px-4 py-5">
          <div className="mb-6 flex items-center justify-between gap-2">
            <HomeLink onNavigate={close} />
            <button
              type="button"
              onClick={close}
              className="rounded-md border border-ink-700 px-3 py-1.5 text-body font-bold text-paper-50 hover:bg-ink-900"
            >
              Close
            </button>
          </div>
          <Rail onNavigate={close} />
        </div>
      </Drawer>
      <aside className="surface-dark sticky top-0 hidden h-screen w-64 shrink-0 flex-col overflow-y-auto bg-ink-950 px-4 py-6 text-ink-100 lg:flex print:hidden">
        <div className="mb-6">
          <HomeLink />
        </div>
        <Rail />
      </aside>
      <main id="main" tabIndex={-1} className="min-w-0 flex-1 px-4 py-6 outline-none sm:px-6 lg:px-10 lg:py-8">
        <Outlet />
      </main>
    </div>
  );
}
