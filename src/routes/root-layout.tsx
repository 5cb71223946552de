import { NavLink, Outlet, useNavigate } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { Button } from '@/components/button';
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

/** The frame of every signed-in screen: the rail with the mark, the lab, navigation, and the work area. */
export function RootLayout() {
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
    <div className="flex min-h-screen">
      <aside className="flex w-60 shrink-0 flex-col bg-ink-950 px-4 py-6 text-ink-100 print:hidden">
        <NavLink
          to={paths.overview()}
          className="mb-6 flex items-center gap-2.5 text-glow-400"
          aria-label="Halflight home"
        >
          <HalflightMark />
          <span className="text-title font-black tracking-tight text-paper-50">Halflight</span>
        </NavLink>
        <LabSwitcher labs={session.user.labs} current={lab} />
        <nav aria-label="Main" className="mt-6 flex flex-col gap-1">
          {navigation.map((item) => (
            <NavLink key={item.to} to={item.to} end={item.end} className={linkClasses}>
              {item.label}
            </NavLink>
          ))}
        </nav>
        <div className="mt-auto space-y-2 border-t border-ink-800 pt-4">
          <p className="truncate text-caption text-ink-300" title={session.user.email}>
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
      </aside>
      <main className="flex-1 px-10 py-8">
        <Outlet />
      </main>
    </div>
  );
}
