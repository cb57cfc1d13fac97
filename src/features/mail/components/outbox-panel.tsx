import { useState } from 'react';
import { formatDateTime, formatTime } from '@shared/format/dates';
import { createColumnHelper } from '@tanstack/react-table';
import { Badge, type BadgeTone } from '@/components/ui/badge';
import { DataTable } from '@/components/ui/data-table';
import { Field, Select } from '@/components/ui/field';
import { EmptyState, ErrorState, LoadingState, Panel } from '@/components/ui/states';
import { type OutboxMessage, type OutboxStatus, useOutbox } from '../api/mailbox';

const STATUS_TONE: Record<OutboxStatus, BadgeTone> = { queued: 'review', sent: 'approved', failed: 'changes' };

const col = createColumnHelper<OutboxMessage>();
const columns = [
  col.accessor('createdAt', {
    header: 'Queued',
    cell: (c) => <span className="num whitespace-nowrap">{formatDateTime(c.getValue())}</span>,
  }),
  col.accessor('subject', { header: 'Subject' }),
  col.accessor((m) => m.to.join(', '), { id: 'to', header: 'To', cell: (c) => <span className="text-ink-soft">{c.getValue()}</span> }),
  col.accessor('status', { header: 'Status', cell: (c) => <Badge tone={STATUS_TONE[c.getValue()]}>{c.getValue()}</Badge> }),
  col.accessor('attempts', { header: 'Attempts', meta: { numeric: true } }),
  col.accessor('lastError', {
    header: 'Last error / next try',
    enableSorting: false,
    cell: (c) => {
      const m = c.row.original;
      return (
        <span className="text-xs text-ink-soft">
          {m.lastError ?? '—'}
          {m.nextAttemptAt && m.attempts > 0 && <span className="num block">next try {formatTime(m.nextAttemptAt)}</span>}
        </span>
      );
    },
  }),
];

/** What the app tried to send: queued, sent and failed mail with the last error, in either mail mode. */
export function OutboxPanel() {
  const [status, setStatus] = useState<OutboxStatus | ''>('');
  const outbox = useOutbox(status || undefined);
  const counts = outbox.data?.counts;
  return (
    <Panel
      title="Outbox"
      actions={
        counts && (
          <span className="num text-sm text-ink-faint">
            {counts.queued} queued · {counts.sent} sent · {counts.failed} failed
          </span>
        )
      }
    >
      <div className="mb-3 max-w-56">
        <Field label="Status" htmlFor="outbox-status">
          <Select id="outbox-status" value={status} onChange={(e) => setStatus(e.target.value as OutboxStatus | '')}>
            <option value="">Any status</option>
            <option value="queued">Queued</option>
            <option value="sent">Sent</option>
            <option value="failed">Failed</option>
          </Select>
        </Field>
      </div>
      {outbox.isPending ? (
        <LoadingState />
      ) : outbox.isError ? (
        <ErrorState error={outbox.error} onRetry={() => outbox.refetch()} />
      ) : outbox.data.messages.length === 0 ? (
        <EmptyState title="Nothing in the outbox" />
      ) : (
        <DataTable data={outbox.data.messages} columns={columns} caption="Outbox" rowKey={(m) => m.id} />
      )}
    </Panel>
  );
}
