import type { ReactNode } from 'react';

/** What a list says when it has nothing in it yet, and what would fill it. */
export function EmptyState({ title, children }: { title: string; children?: ReactNode }) {
  return (
    <div className="rounded-md border border-dashed border-paper-300 px-4 py-6 text-center">
      <p className="text-body font-bold text-ink-800">{title}</p>
      {children && <p className="mt-1 text-body text-ink-500">{children}</p>}
    </div>
  );
}
