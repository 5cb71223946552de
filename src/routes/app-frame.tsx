import { Outlet } from 'react-router-dom';
import { useScreenHeading } from '@/lib/screen-heading';

/** Jumps past the navigation to the screen's content (the first stop of the Tab key). */
function SkipLink() {
  return (
    <a
      href="#main"
      onClick={(event) => {
        event.preventDefault();
        document.getElementById('main')?.focus();
      }}
      className="sr-only z-50 rounded-md bg-glow-300 px-4 py-2 font-bold text-ink-950 focus:not-sr-only focus:fixed focus:left-3 focus:top-3"
    >
      Skip to the content
    </a>
  );
}

/**
 * Around every screen, signed in or not: the skip link, and the tab title and focus that follow
 * the screen's heading (src/lib/screen-heading.ts). Each layout below gives its content `id="main"`.
 */
export function AppFrame() {
  useScreenHeading();
  return (
    <>
      <SkipLink />
      <Outlet />
    </>
  );
}
