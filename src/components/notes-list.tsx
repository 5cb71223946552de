type Size = 'body' | 'caption';

const sizeClasses: Record<Size, string> = {
  body: 'text-body text-ink-800',
  caption: 'text-caption text-ink-700',
};

/**
 * Short sentences about a result (an analysis's notes, a verdict's reasons, a conversion's
 * warnings) as a bulleted list; nothing at all when there are none.
 */
export function NotesList({
  items,
  size = 'caption',
  label,
  className = '',
}: {
  items: readonly string[];
  /** body beside a verdict, caption (the default) under a result */
  size?: Size;
  /** an accessible name, for a list a test or a person looks up by name */
  label?: string;
  /** spacing from what comes before, e.g. mt-2 */
  className?: string;
}) {
  if (items.length === 0) return null;
  return (
    <ul aria-label={label} className={`list-disc space-y-1 pl-5 ${sizeClasses[size]} ${className}`.trim()}>
      {items.map((item, i) => (
        // the same sentence may come twice; its place keeps the keys apart
        <li key={`${i}:${item}`}>{item}</li>
      ))}
    </ul>
  );
}
