import { Link } from 'react-router-dom';
import { formatDateTime } from '@shared/format/dates';
import { createColumnHelper } from '@tanstack/react-table';
import { Badge } from '@/components/ui/badge';
import { DataTable } from '@/components/ui/data-table';
import type { AuditEvent } from '../api/audit';

const col = createColumnHelper<AuditEvent>();

/** Pages that show a target, by the target type written in the audit row. */
const TARGET_PAGES: Record<string, (id: string) => string> = {
  substance: (id) => `/substances/${id}`,
  dataset: (id) => `/measurement-sets/${id}`, // stored audit code: a measurement set's target type in the append-only log
  fit: (id) => `/fits/${id}`,
  parameterSet: (id) => `/parameter-sets/${id}`,
};

/** The target as people name it ("Fit #3 of norrane"), with the internal type and id only when no name was recorded. */
const targetText = (e: AuditEvent) =>
  (e as AuditEvent & { targetLabel?: string | null }).targetLabel ?? `${e.targetType}${e.targetId ? ` ${e.targetId}` : ''}`;

function Target({ event }: { event: AuditEvent }) {
  const label = targetText(event);
  const page = event.targetId ? TARGET_PAGES[event.targetType]?.(event.targetId) : undefined;
  return page ? (
    <Link to={page} className="underline decoration-rule underline-offset-4 hover:decoration-copper">
      {label}
    </Link>
  ) : (
    <span>{label}</span>
  );
}

function Changes({ event }: { event: AuditEvent }) {
  if (event.before == null && event.after == null) return <span className="text-ink-faint">—</span>;
  return (
    <details>
      <summary className="cursor-pointer whitespace-nowrap text-xs font-semibold text-copper-dark">Before / after</summary>
      <div className="mt-1 grid gap-2 sm:grid-cols-2">
        {(['before', 'after'] as const).map((k) => (
          <div key={k}>
            <div className="text-[11px] uppercase tracking-wider text-ink-faint">{k}</div>
            <pre className="max-h-48 overflow-auto rounded bg-paper-deep/60 p-2 text-xs">
              {event[k] == null ? '—' : JSON.stringify(event[k], null, 2)}
            </pre>
          </div>
        ))}
      </div>
    </details>
  );
}

const columns = [
  col.accessor('id', { header: '#', meta: { numeric: true } }),
  col.accessor('at', { header: 'When', cell: (c) => <span className="num whitespace-nowrap">{formatDateTime(c.getValue())}</span> }),
  col.accessor('actorEmail', { header: 'Actor', cell: (c) => c.getValue() ?? <span className="text-ink-faint">system</span> }),
  col.accessor('action', { header: 'Action', cell: (c) => <Badge>{c.getValue()}</Badge> }),
  col.accessor(targetText, { id: 'target', header: 'Target', cell: (c) => <Target event={c.row.original} /> }),
  col.accessor('summary', { header: 'Summary', enableSorting: false, cell: (c) => <span className="text-ink-soft">{c.getValue()}</span> }),
  col.display({ id: 'changes', header: 'Changes', cell: (c) => <Changes event={c.row.original} /> }),
];

/** The audit trail as a dense table, newest first. */
export function AuditTable({ events }: { events: AuditEvent[] }) {
  return <DataTable data={events} columns={columns} caption="Audit trail" rowKey={(e) => e.id} minWidthClass="min-w-[56rem]" />;
}
