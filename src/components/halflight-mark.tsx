/** The Halflight mark: a ring, half lit. */
export function HalflightMark({ className = 'h-7 w-7' }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden="true">
      <circle cx="16" cy="16" r="13" fill="none" stroke="currentColor" strokeWidth="3" />
      <path d="M16 3a13 13 0 0 0 0 26z" fill="currentColor" />
    </svg>
  );
}
