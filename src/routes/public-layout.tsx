import { Link, Outlet } from 'react-router-dom';
import { HalflightMark } from '@/components/halflight-mark';
import { paths } from '@/lib/paths';

/** The frame of the screens used before signing in: the mark and one card. */
export function PublicLayout() {
  return (
    <div className="flex min-h-screen flex-col items-center bg-paper-100 px-4 py-8 sm:py-12">
      <header className="mb-8">
        <Link to={paths.overview()} className="flex items-center gap-2.5 text-glow-600" aria-label="Halflight home">
          <HalflightMark className="h-9 w-9" />
          <span className="text-display font-black tracking-tight text-ink-950">Halflight</span>
        </Link>
      </header>
      <main
        id="main"
        tabIndex={-1}
        className="w-full max-w-md rounded-card border border-paper-200 bg-paper-50 p-5 shadow-card outline-none sm:p-7"
      >
        <Outlet />
      </main>
      <footer className="mt-6 text-caption text-ink-600">Quenching studies, shared by the lab.</footer>
    </div>
  );
}
