import type { ReactNode } from 'react';

interface PanelProps {
  title: string;
  children: ReactNode;
  aside?: ReactNode;
  /** an anchor other parts of the screen link to */
  id?: string;
}

/** A titled surface; the basic block of every screen. */
export function Panel({ title, children, aside, id }: PanelProps) {
  return (
    <section id={id} aria-label={title} className="rounded-card border border-paper-200 bg-paper-50 p-5 shadow-card">
      <header className="mb-3 flex flex-wrap items-baseline justify-between gap-x-4 gap-y-2">
        <h2 className="text-lead font-bold text-ink-900">{title}</h2>
        {aside}
      </header>
      {children}
    </section>
  );
}
