import { useMemo, useState } from 'react';
import { formatDate, formatDateTime } from '@shared/format/dates';
import { Link, useParams } from 'react-router-dom';
import { createColumnHelper } from '@tanstack/react-table';
import { Badge, KindBadge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { DataTable } from '@/components/ui/data-table';
import { EmptyState, ErrorState, LoadingState, PageHeader, Panel } from '@/components/ui/states';
import { useCan } from '@/lib/authorization';
import type { MeasurementSetSummary } from '@/features/measurement-sets/api/measurement-sets';
import { useSubstance, useUpdateSubstance } from '@/features/substances/api/substances';
import { useSubstanceFits } from '@/features/fits/api/fits';
import { SubstanceForm } from '@/features/substances/components/substance-form';
import { FollowButton } from '@/features/follows/components/follow-button';
import { SubstanceParameterSetsPanel } from '@/features/parameter-sets/components/substance-parameter-sets';

const col = createColumnHelper<MeasurementSetSummary>();
/** "In use" only when a fit of the substance used the set; otherwise it is plainly not used yet. */
const columnsFor = (usedBy: Map<number, number[]>) => [
  col.accessor('name', {
    header: 'Measurement set',
    cell: (c) => (
      <Link
        className="font-semibold underline decoration-rule underline-offset-4 hover:decoration-copper"
        to={`/measurement-sets/${c.row.original.id}`}
      >
        {c.getValue()}
      </Link>
    ),
  }),
  col.accessor('kind', { header: 'Kind', cell: (c) => <KindBadge kind={c.getValue()} /> }),
  col.accessor('version', { header: 'Version', meta: { numeric: true }, cell: (c) => `v${c.getValue()}` }),
  col.accessor('rowCount', { header: 'Points', meta: { numeric: true } }),
  col.accessor('source', {
    header: 'Source',
    cell: (c) => <span className="line-clamp-1 max-w-xs text-ink-soft">{c.getValue() ?? '—'}</span>,
  }),
  col.accessor('uploadedAt', { header: 'Uploaded', cell: (c) => formatDate(c.getValue()) }),
  col.accessor('withdrawn', {
    header: 'State',
    cell: (c) => {
      if (c.getValue()) return <Badge tone="slate">Withdrawn</Badge>;
      const fits = usedBy.get(c.row.original.id);
      return fits?.length ? (
        <span title={`Used by ${fits.map((n) => `Fit #${n}`).join(', ')}`}>
          <Badge tone="approved">In use</Badge>
        </span>
      ) : (
        <Badge tone="neutral">Not used yet</Badge>
      );
    },
  }),
];

export function SubstanceDetailRoute() {
  const id = Number(useParams().substanceId);
  const substance = useSubstance(id);
  const canUpload = useCan('measurement-set:upload');
  const canEdit = useCan('substance:write');
  const [editing, setEditing] = useState(false);
  const update = useUpdateSubstance(id);
  const fits = useSubstanceFits(id);
  const columns = useMemo(() => {
    const usedBy = new Map<number, number[]>();
    for (const f of fits.data ?? [])
      if (f.status === 'succeeded')
        for (const d of f.measurementSets) usedBy.set(d.measurementSetId, [...(usedBy.get(d.measurementSetId) ?? []), f.number]);
    return columnsFor(usedBy);
  }, [fits.data]);
  if (substance.isPending) return <LoadingState />;
  if (substance.isError) return <ErrorState error={substance.error} onRetry={() => substance.refetch()} />;
  const s = substance.data;
  return (
    <>
      <PageHeader
        eyebrow={
          <Link to="/substances" className="hover:underline">
            Substances
          </Link>
        }
        title={s.name}
        subtitle={<span className="num">{[s.formula, `M = ${s.molarMassGPerMol} g/mol`].filter(Boolean).join(' · ')}</span>}
        action={
          <div className="flex flex-wrap items-center gap-3">
            <FollowButton substanceId={id} substanceName={s.name} />
            <Link
              to={`/substances/${id}/fits`}
              className="rounded-md border border-rule bg-paper-raised px-3.5 py-1.5 text-sm font-semibold hover:bg-paper-deep"
            >
              Fits
            </Link>
            {canUpload && (
              <Link
                to={`/substances/${id}/upload`}
                className="rounded-md bg-copper px-3.5 py-1.5 text-sm font-semibold text-white shadow-sm hover:bg-copper-dark"
              >
                Upload measurements
              </Link>
            )}
          </div>
        }
      />
      {s.description && <p className="-mt-2 mb-6 max-w-prose text-ink-soft">{s.description}</p>}
      <div className="grid gap-6">
        <Panel title="Measurement sets">
          {(s.measurementSets ?? []).length === 0 ? (
            <EmptyState title="No measurement sets yet">
              {canUpload ? 'Upload a CSV table of B2, density or viscosity values.' : 'A modeller uploads measurement tables.'}
            </EmptyState>
          ) : (
            <DataTable data={s.measurementSets ?? []} columns={columns} caption={`Measurement sets of ${s.name}`} rowKey={(d) => d.id} />
          )}
        </Panel>
        <SubstanceParameterSetsPanel substanceId={id} substanceName={s.name} />
        {canEdit && (
          <Panel title="Details" actions={!editing && <Button onClick={() => setEditing(true)}>Edit</Button>}>
            {editing ? (
              <SubstanceForm
                initial={{
                  name: s.name,
                  formula: s.formula ?? undefined,
                  description: s.description ?? undefined,
                  molarMassGPerMol: s.molarMassGPerMol,
                }}
                molarMassLocked={(s.measurementSets ?? []).length > 0}
                submitLabel="Save changes"
                busy={update.isPending}
                error={update.error}
                onSubmit={(v) =>
                  update.mutate(
                    (s.measurementSets ?? []).length > 0
                      ? { name: v.name, formula: v.formula ?? '', description: v.description ?? '' }
                      : { ...v, formula: v.formula ?? '', description: v.description ?? '' },
                    { onSuccess: () => setEditing(false) },
                  )
                }
              />
            ) : (
              <p className="text-sm text-ink-soft">
                Created by {s.createdByName} on {formatDate(s.createdAt)}; last changed {formatDateTime(s.updatedAt)}. Edits are recorded in
                the audit trail.
              </p>
            )}
          </Panel>
        )}
      </div>
    </>
  );
}
