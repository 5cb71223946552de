import type { AccountSession } from '@shared/schemas/auth';
import { Button } from '@/components/button';
import { Signal } from '@/components/signal';
import { formatDateTime } from '@shared/format';
import { describeBrowser } from './describe-browser';

interface SessionListProps {
  sessions: AccountSession[];
  endingId: string | null;
  onEnd: (sessionId: string) => void;
}

/** One row per signed-in browser: what it is, from where, since when; others can be signed out. */
export function SessionList({ sessions, endingId, onEnd }: SessionListProps) {
  return (
    <ul className="divide-y divide-paper-200" aria-label="Signed-in browsers">
      {sessions.map((session) => {
        const what = describeBrowser(session.userAgent);
        return (
          <li key={session.id} className="flex flex-wrap items-center justify-between gap-3 py-3">
            <div className="min-w-0">
              <p className="flex items-center gap-2 text-body font-bold text-ink-900">
                {what}
                {session.current && <Signal tone="good">This browser</Signal>}
              </p>
              <p className="text-caption text-ink-600">
                {session.ip ? `From ${session.ip} · ` : ''}
                {session.signedInAt ? `signed in ${formatDateTime(session.signedInAt)} · ` : ''}
                last active {formatDateTime(session.lastActiveAt)} · ends by {formatDateTime(session.endsAt)}
              </p>
            </div>
            {!session.current && (
              <Button
                variant="quiet"
                pending={endingId === session.id}
                pendingLabel="Signing out…"
                onClick={() => onEnd(session.id)}
                aria-label={`Sign out ${what}${session.ip ? ` from ${session.ip}` : ''}`}
              >
                Sign out
              </Button>
            )}
          </li>
        );
      })}
    </ul>
  );
}
