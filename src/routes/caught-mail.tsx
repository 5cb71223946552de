import { useState } from 'react';
import { PageNav } from '@/components/page-nav';
import { EmptyState } from '@/components/empty-state';
import { ErrorNotice } from '@/components/error-notice';
import { Panel } from '@/components/panel';
import { Signal } from '@/components/signal';
import { useSession } from '@/features/auth/api/get-session';
import { NotYourLab } from '@/features/labs/components/not-your-lab';
import { useCaughtMail } from '@/features/mail/api/get-caught-mail';
import { MailList } from '@/features/mail/components/mail-list';
import { MailReader } from '@/features/mail/components/mail-reader';
import { ScreenHeader } from '@/components/screen-header';
import { Tag } from '@/components/tag';

const pageSize = 20;

/**
 * Mail the workspace sent to me (and invitations I sent) while a local catcher stands in for a
 * real mail relay.
 */
export function CaughtMailRoute() {
  const session = useSession();
  if (!session.mailCatcher)
    return <NotYourLab reason="This workspace sends real e-mail, so there is no caught mail to read." />;
  return <CaughtMailScreen />;
}

function CaughtMailScreen() {
  const [page, setPage] = useState(1);
  const [selectedId, setSelectedId] = useState<string | null>(null);
  const mail = useCaughtMail({ page, pageSize });
  const selected = mail.data?.items.find((item) => item.id === selectedId) ?? null;
  const pages = mail.data ? Math.max(1, Math.ceil(mail.data.total / pageSize)) : 1;

  return (
    <div className="max-w-6xl space-y-6">
      <ScreenHeader title="Caught mail">
        <p className="mt-1 max-w-2xl text-lead text-ink-700">
          No mail leaves this workspace: a local catcher keeps every message it sends. Here are the ones addressed to
          you, and the invitations you sent, so you can pass their links on by hand. Whoever runs the machine finds
          every message as a file in the data folder.
        </p>
      </ScreenHeader>
      <div className="grid gap-6 lg:grid-cols-[minmax(0,2fr)_minmax(0,3fr)]">
        <Panel title="Messages" aside={mail.data && <Tag tone="neutral">{`${mail.data.total} caught`}</Tag>}>
          {mail.isPending && <Signal tone="waiting">Loading messages</Signal>}
          {mail.isError && <ErrorNotice error={mail.error} what="the caught mail" />}
          {mail.data && <MailList items={mail.data.items} selectedId={selectedId} onSelect={setSelectedId} />}
          <PageNav page={page} pages={pages} onPage={setPage} label="Pages of messages" back="Newer" forward="Older" />
        </Panel>
        <Panel title="Reading">
          {selected ? <MailReader mail={selected} /> : <EmptyState title="Choose a message to read it." />}
        </Panel>
      </div>
    </div>
  );
}
