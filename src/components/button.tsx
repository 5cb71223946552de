import type { ComponentPropsWithRef } from 'react';

type Variant = 'primary' | 'quiet' | 'danger';

const baseClasses =
  'inline-flex items-center justify-center gap-2 rounded-md px-4 py-2 text-body font-bold transition-colors ' +
  'disabled:cursor-not-allowed disabled:opacity-60';
const variantClasses: Record<Variant, string> = {
  primary: 'bg-glow-400 text-ink-950 hover:bg-glow-300',
  quiet: 'border border-paper-300 bg-paper-50 text-ink-800 hover:border-ink-300',
  danger: 'bg-brick-500 text-paper-50 hover:bg-brick-700',
};

interface ButtonProps extends ComponentPropsWithRef<'button'> {
  variant?: Variant;
  /** While true the button is disabled and says what it is doing instead. */
  pending?: boolean;
  pendingLabel?: string;
}

/** Halflight's button; a pending one cannot be pressed twice. */
export function Button({
  variant = 'primary',
  pending = false,
  pendingLabel = 'Working…',
  disabled,
  className = '',
  children,
  type = 'button',
  ...button
}: ButtonProps) {
  return (
    <button
      type={type}
      disabled={disabled || pending}
      aria-busy={pending || undefined}
      className={`${baseClasses} ${variantClasses[variant]} ${className}`}
      {...button}
    >
      {pending && (
        <span
          className="h-3 w-3 motion-safe:animate-spin rounded-full border-2 border-current border-t-transparent"
          aria-hidden="true"
        />
      )}
      {pending ? pendingLabel : children}
    </button>
  );
}
