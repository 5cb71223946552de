import type { ReactNode } from 'react';
import { Tag } from './tag';

/**
 * The top of a screen: the lab it belongs to (marked when it is demo data), the title, then what
 * the screen is for (the children, usually one lead paragraph). An `action` (the screen's main
 * next step, e.g. a LinkButton) sits at the right, level with the bottom of the text.
 */
export function ScreenHeader({
  lab,
  title,
  className = '',
  action,
  children,
}: {
  lab?: { labName: string; isDemo?: boolean };
  title: ReactNode;
  className?: string;
  action?: ReactNode;
  children?: ReactNode;
}) {
  const text = (
    <>
      {lab && (
        <p className="flex items-center gap-2 text-caption tracking-wide text-ink-500">
          {lab.labName} {lab.isDemo && <Tag tone="demo">Demo</Tag>}
        </p>
      )}
      <h1 className="text-display font-black text-ink-950">{title}</h1>
      {children}
    </>
  );
  if (!action) return <header className={className}>{text}</header>;
  return (
    <header className={`flex items-end justify-between gap-4 ${className}`}>
      <div>{text}</div>
      {action}
    </header>
  );
}
