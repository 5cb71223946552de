import type { CaughtMail } from '@shared/schemas/members';
import { EmptyState } from '@/components/empty-state';
import { formatDateTime } from '@shared/format';

interface MailListProps {
  items: CaughtMail[];
  selectedId: string | null;
  onSelect: (id: string) => void;
}

/** Caught messages, newest first; choosing one opens it beside the list. */
export function MailList({ items, selectedId, onSelect }: MailListProps) {
  if (items.length === 0) {
    return (
      <EmptyState title="No mail caught yet.">
        Invitations and password links sent from this workspace land here instead of in real inboxes.
      </EmptyState>
    );
  }
  return (
    <ul className="divide-y divide-paper-200" aria-label="Caught messages">
      {items.map((mail) => (
        <li key={mail.id}>
          <button
            type="button"
            onClick={() => onSelect(mail.id)}
            aria-current={mail.id === selectedId ? 'true' : undefined}
            className={`w-full rounded-md px-3 py-2.5 text-left transition-colors ${
              mail.id === selectedId ? 'bg-glow-50 ring-1 ring-glow-300' : 'hover:bg-paper-100'
            }`}
          >
            <span className="block truncate text-body font-bold text-ink-900">{mail.subject || '(no subject)'}</span>
            <span className="block truncate text-caption text-ink-600">To {mail.to.join(', ')}</span>
            <span className="block text-caption text-ink-500">{formatDateTime(mail.receivedAt)}</span>
          </button>
        </li>
      ))}
    </ul>
  );
}
