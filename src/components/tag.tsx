type Tone = 'role' | 'demo';

const toneClasses: Record<Tone, string> = {
  role: 'bg-ink-100 text-ink-700',
  demo: 'bg-glow-100 text-glow-700',
};

/** A short word beside a name: a role, or the mark of invented demo data. */
export function Tag({ tone = 'role', children }: { tone?: Tone; children: string }) {
  return (
    <span className={`inline-block rounded px-1.5 py-px text-caption font-bold ${toneClasses[tone]}`}>{children}</span>
  );
}
