import { NavLink, Outlet } from 'react-router-dom';
import { HalflightMark } from '@/components/halflight-mark';

const navigation = [{ to: '/', label: 'Overview', end: true }];

/** The frame of every screen: the rail with the mark and navigation, and the work area. */
export function RootLayout() {
  return (
    <div className="flex min-h-screen">
      <aside className="flex w-56 shrink-0 flex-col bg-ink-950 px-4 py-6 text-ink-100">
        <NavLink to="/" className="mb-8 flex items-center gap-2.5 text-glow-400" aria-label="Halflight home">
          <HalflightMark />
          <span className="text-title font-black tracking-tight text-paper-50">Halflight</span>
        </NavLink>
        <nav aria-label="Main" className="flex flex-col gap-1">
          {navigation.map((item) => (
            <NavLink
              key={item.to}
              to={item.to}
              end={item.end}
              className={({ isActive }) =>
                `rounded-md px-3 py-2 text-body transition-colors ${
                  isActive ? 'bg-ink-800 font-bold text-glow-300' : 'text-ink-200 hover:bg-ink-900 hover:text-paper-50'
                }`
              }
            >
              {item.label}
            </NavLink>
          ))}
        </nav>
        <p className="mt-auto text-caption text-ink-400">Quenching studies, shared by the lab.</p>
      </aside>
      <main className="flex-1 px-10 py-8">
        <Outlet />
      </main>
    </div>
  );
}
