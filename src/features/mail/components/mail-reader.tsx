import type { CaughtMail } from '@shared/schemas/members';
import { formatDateTime } from '@shared/format';
import { LinkedText } from './linked-text';

/** One caught message: who sent it to whom, and its plain-text body. */
export function MailReader({ mail }: { mail: CaughtMail }) {
  return (
    <article aria-label={`Message: ${mail.subject}`} className="space-y-4">
      <header className="space-y-1 border-b border-paper-200 pb-3">
        <h3 className="text-lead font-bold text-ink-950">{mail.subject || '(no subject)'}</h3>
        <dl className="grid grid-cols-[auto_1fr] gap-x-3 text-caption text-ink-700">
          <dt className="font-bold">From</dt>
          <dd>{mail.from}</dd>
          <dt className="font-bold">To</dt>
          <dd>{mail.to.join(', ')}</dd>
          <dt className="font-bold">Caught</dt>
          <dd>{formatDateTime(mail.receivedAt)}</dd>
        </dl>
      </header>
      {mail.text.trim() ? (
        <LinkedText text={mail.text} />
      ) : (
        <p className="text-body text-ink-500">This message has no plain-text part.</p>
      )}
    </article>
  );
}
