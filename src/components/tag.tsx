type Tone = 'role' | 'demo' | 'neutral';

const toneClasses: Record<Tone, string> = {
  role: 'bg-ink-100 text-ink-700',
  demo: 'bg-glow-100 text-glow-700',
  neutral: 'bg-paper-200 text-ink-800',
};

/** A short word beside a name: a role, the mark of invented demo data, or a neutral count or note. */
export function Tag({ tone = 'role', children }: { tone?: Tone; children: string }) {
  return (
    <span className={`inline-block rounded px-1.5 py-px text-caption font-bold ${toneClasses[tone]}`}>{children}</span>
  );
}
