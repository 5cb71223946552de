import type { ReactNode } from 'react';
import { Tag } from './tag';

/**
 * The top of a screen: the lab it belongs to (marked when it is demo data), the title, then what
 * the screen is for (the children, usually one lead paragraph).
 */
export function ScreenHeader({
  lab,
  title,
  className,
  children,
}: {
  lab?: { labName: string; isDemo?: boolean };
  title: ReactNode;
  className?: string;
  children?: ReactNode;
}) {
  return (
    <header className={className}>
      {lab && (
        <p className="flex items-center gap-2 text-caption tracking-wide text-ink-500">
          {lab.labName} {lab.isDemo && <Tag tone="demo">Demo</Tag>}
        </p>
      )}
      <h1 className="text-display font-black text-ink-950">{title}</h1>
      {children}
    </header>
  );
}
