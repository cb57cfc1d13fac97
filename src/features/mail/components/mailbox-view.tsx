import { useState } from 'react';
import { formatDateTime } from '@shared/format/dates';
import { Field, Input } from '@/components/ui/field';
import { EmptyState, ErrorState, LoadingState, Panel } from '@/components/ui/states';
import { isApiError } from '@/lib/api-client';
import { useMailbox } from '../api/mailbox';
import { MailReader } from './mail-reader';

/** The local fake mail service's inbox: a list on the left, the chosen message on the right. */
export function MailboxView() {
  const [to, setTo] = useState('');
  const mailbox = useMailbox({ to: to.trim() || undefined });
  const [selectedId, setSelectedId] = useState<number | null>(null);

  if (mailbox.isError && isApiError(mailbox.error, 409)) {
    return (
      <EmptyState title="Mail goes to an outside server">
        This server sends mail to the SMTP server in <code>SMTP_URL</code>, so there is no local mailbox to read. Unset{' '}
        <code>SMTP_URL</code> to use the local mail service.
      </EmptyState>
    );
  }

  const messages = mailbox.data ?? [];
  const selected = messages.find((m) => m.id === selectedId) ?? messages[0];

  return (
    <div className="grid gap-6 lg:grid-cols-[minmax(18rem,2fr)_3fr]">
      <Panel title="Received">
        <div className="mb-3">
          <Field label="Recipient contains" htmlFor="mailbox-to">
            <Input id="mailbox-to" type="search" value={to} onChange={(e) => setTo(e.target.value)} placeholder="reviewer@" />
          </Field>
        </div>
        {mailbox.isPending ? (
          <LoadingState />
        ) : mailbox.isError ? (
          <ErrorState error={mailbox.error} onRetry={() => mailbox.refetch()} />
        ) : messages.length === 0 ? (
          <EmptyState title={to ? 'No mail to that address' : 'No mail yet'}>
            Mail appears here when a parameter set is submitted, reviewed or retired.
          </EmptyState>
        ) : (
          <ul aria-label="Messages" className="-mx-2 divide-y divide-rule/60">
            {messages.map((m) => (
              <li key={m.id}>
                <button
                  type="button"
                  aria-current={m.id === selected?.id ? 'true' : undefined}
                  onClick={() => setSelectedId(m.id)}
                  className={`w-full rounded-md px-2 py-2 text-left ${m.id === selected?.id ? 'bg-copper-soft' : 'hover:bg-paper-deep/60'}`}
                >
                  <div className="flex items-baseline justify-between gap-3">
                    <span className="truncate font-semibold">{m.subject || '(no subject)'}</span>
                    <span className="num shrink-0 text-xs text-ink-faint">{formatDateTime(m.receivedAt)}</span>
                  </div>
                  <div className="truncate text-sm text-ink-soft">To {m.to.join(', ')}</div>
                </button>
              </li>
            ))}
          </ul>
        )}
      </Panel>
      <Panel title="Message">
        {selected ? <MailReader message={selected} /> : <p className="text-sm text-ink-soft">Choose a message to read it.</p>}
      </Panel>
    </div>
  );
}
