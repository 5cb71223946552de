import type { ReactNode } from 'react';

interface PublicScreenProps {
  title: ReactNode;
  /** One line above the title, e.g. "Invitation". */
  kicker?: string;
  lead?: ReactNode;
  children?: ReactNode;
  /** The way elsewhere under the form, e.g. back to sign in. */
  footer?: ReactNode;
}

/** The content of a screen in the signed-out card (sign in, passwords, invitations): heading, lead, form, way out. */
export function PublicScreen({ title, kicker, lead, children, footer }: PublicScreenProps) {
  return (
    <div className="space-y-5">
      <header className="space-y-1">
        {kicker && <p className="text-caption tracking-wide text-ink-500">{kicker}</p>}
        <h1 className="text-title font-black text-ink-950">{title}</h1>
        {lead && <p className="text-body text-ink-700">{lead}</p>}
      </header>
      {children}
      {footer && <p className="text-body text-ink-700">{footer}</p>}
    </div>
  );
}
