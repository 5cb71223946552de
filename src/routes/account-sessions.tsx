import { useState } from 'react';
import { Button } from '@/components/button';
import { EmptyState } from '@/components/empty-state';
import { ErrorNotice } from '@/components/error-notice';
import { Panel } from '@/components/panel';
import { Signal } from '@/components/signal';
import { TextLink } from '@/components/text-link';
import { useEndAccountSession } from '@/features/auth/api/end-account-sessions';
import { useAccountSessions } from '@/features/auth/api/get-account-sessions';
import { SessionList } from '@/features/auth/components/session-list';
import { paths } from '@/lib/paths';

/** Every browser signed in as me; I can sign out the ones I do not recognise. */
export function AccountSessionsRoute() {
  const sessions = useAccountSessions();
  const end = useEndAccountSession();
  const [endingId, setEndingId] = useState<string | null>(null);
  const others = sessions.data?.items.filter((session) => !session.current) ?? [];

  function endOne(sessionId: string | 'others') {
    setEndingId(sessionId);
    end.mutate(sessionId, { onSettled: () => setEndingId(null) });
  }

  return (
    <div className="max-w-3xl space-y-6">
      <header>
        <p className="text-caption font-bold text-ink-500">
          <TextLink to={paths.account()}>Account</TextLink> / Signed-in browsers
        </p>
        <h1 className="mt-1 text-display font-black text-ink-950">Signed-in browsers</h1>
        <p className="mt-1 text-lead text-ink-700">
          Each place you are signed in stays so for 12 hours without use and 7 days at most. Changing your password
          signs out every other browser.
        </p>
      </header>
      <Panel
        title="Where you are signed in"
        aside={sessions.data && <Signal tone="good">{`${sessions.data.items.length} open`}</Signal>}
      >
        {sessions.isPending && <Signal tone="waiting">Loading</Signal>}
        {sessions.isError && <ErrorNotice error={sessions.error} what="your signed-in browsers" />}
        {end.isError && <ErrorNotice error={end.error} what="that sign-out" />}
        {sessions.data &&
          (sessions.data.items.length ? (
            <SessionList sessions={sessions.data.items} endingId={endingId} onEnd={endOne} />
          ) : (
            <EmptyState title="No open sessions." />
          ))}
        {others.length > 1 && (
          <div className="mt-4">
            <Button
              variant="danger"
              pending={endingId === 'others'}
              pendingLabel="Signing out…"
              onClick={() => endOne('others')}
            >
              Sign out every other browser
            </Button>
          </div>
        )}
      </Panel>
    </div>
  );
}
