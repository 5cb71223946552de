import type { ReactNode } from 'react';
import { Link, type To } from 'react-router-dom';

/** A link that leads to the next step and looks like the primary button (glow), e.g. "New study". */
export function LinkButton({ to, children }: { to: To; children: ReactNode }) {
  return (
    <Link
      to={to}
      className="inline-block shrink-0 rounded-md bg-glow-400 px-4 py-2 font-bold text-ink-950 hover:bg-glow-300"
    >
      {children}
    </Link>
  );
}
