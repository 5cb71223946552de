type Tone = 'good' | 'bad' | 'waiting';

const toneClasses: Record<Tone, string> = {
  good: 'bg-moss-100 text-moss-700',
  bad: 'bg-brick-100 text-brick-700',
  waiting: 'bg-paper-200 text-ink-700',
};

const dotClasses: Record<Tone, string> = {
  good: 'bg-moss-500',
  bad: 'bg-brick-500',
  waiting: 'bg-ink-400 motion-safe:animate-pulse',
};

/** A small coloured label with a dot; the text always carries the meaning, not the colour alone. */
export function Signal({ tone, children }: { tone: Tone; children: string }) {
  return (
    <span
      className={`inline-flex items-center gap-1.5 rounded-full px-2.5 py-0.5 text-caption font-bold ${toneClasses[tone]}`}
    >
      <span className={`h-2 w-2 rounded-full ${dotClasses[tone]}`} aria-hidden="true" />
      {children}
    </span>
  );
}
