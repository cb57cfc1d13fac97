import { useSearchParams } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { EmptyState, ErrorState, LoadingState, PageHeader, Panel } from '@/components/ui/states';
import { Authorization } from '@/lib/authorization';
import { AUDIT_FILTER_FIELDS, type AuditFilter, useAuditEvents } from '@/features/audit/api/audit';
import { AuditFilters } from '@/features/audit/components/audit-filters';
import { AuditTable } from '@/features/audit/components/audit-table';

export function AuditTrailRoute() {
  return (
    <>
      <PageHeader eyebrow="Admin" title="Audit trail" subtitle="Every change, who made it and when. Entries are never edited or removed." />
      <Authorization
        policy="audit:read"
        fallback={<EmptyState title="Not allowed for your roles">The audit trail is for admins.</EmptyState>}
      >
        <AuditTrail />
      </Authorization>
    </>
  );
}

/** Filters live in the address, so a filtered view can be bookmarked or sent to a colleague. */
function AuditTrail() {
  const [params, setParams] = useSearchParams();
  const filter: AuditFilter = {};
  for (const f of AUDIT_FILTER_FIELDS) {
    const v = params.get(f);
    if (v) filter[f] = v;
  }
  const events = useAuditEvents(filter);
  const rows = events.data?.pages.flatMap((p) => p.events) ?? [];
  return (
    <div className="grid gap-6">
      <Panel>
        <AuditFilters key={params.toString()} value={filter} onApply={(f) => setParams(Object.entries(f) as [string, string][])} />
      </Panel>
      <Panel
        title="Events"
        actions={
          events.isSuccess && (
            <span className="num text-sm text-ink-faint">
              {rows.length} shown{events.hasNextPage ? ', more below' : ''}
            </span>
          )
        }
      >
        {events.isPending ? (
          <LoadingState />
        ) : events.isError ? (
          <ErrorState error={events.error} onRetry={() => events.refetch()} />
        ) : rows.length === 0 ? (
          <EmptyState title="No events match these filters" />
        ) : (
          <>
            <AuditTable events={rows} />
            {events.hasNextPage && (
              <div className="mt-4 text-center">
                <Button onClick={() => events.fetchNextPage()} busy={events.isFetchingNextPage}>
                  Load older events
                </Button>
              </div>
            )}
          </>
        )}
      </Panel>
    </div>
  );
}
