import type { ReactNode } from 'react';

type Tone = 'bad' | 'good' | 'note';

const toneClasses: Record<Tone, string> = {
  bad: 'border-brick-500/40 bg-brick-100 text-brick-700',
  good: 'border-moss-500/40 bg-moss-100 text-moss-700',
  note: 'border-glow-300 bg-glow-50 text-ink-800',
};

/** A message about a whole form or action: why it failed, or that it worked. */
export function FormAlert({ tone = 'bad', children }: { tone?: Tone; children: ReactNode }) {
  return (
    <div
      role={tone === 'bad' ? 'alert' : 'status'}
      className={`rounded-md border px-3 py-2 text-body ${toneClasses[tone]}`}
    >
      {children}
    </div>
  );
}
