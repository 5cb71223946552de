import { Link } from 'react-router-dom';
import type { ComponentProps } from 'react';

/** An in-app link inside running text, underlined in the action colour. */
export function TextLink({ className = '', ...link }: ComponentProps<typeof Link>) {
  return (
    <Link
      className={`font-bold text-ink-800 underline decoration-glow-400 underline-offset-4 hover:text-ink-950 ${className}`}
      {...link}
    />
  );
}
