import { Link, useNavigate } from 'react-router-dom';
import { createColumnHelper } from '@tanstack/react-table';
import { KindBadge } from '@/components/ui/badge';
import { DataTable } from '@/components/ui/data-table';
import { EmptyState, ErrorState, LoadingState, PageHeader, Panel } from '@/components/ui/states';
import { useCan } from '@/lib/authorization';
import { type SubstanceListItem, useCreateSubstance, useSubstances } from '@/features/substances/api/substances';
import { SubstanceForm } from '@/features/substances/components/substance-form';

const col = createColumnHelper<SubstanceListItem>();
const columns = [
  col.accessor('name', {
    header: 'Substance',
    cell: (c) => (
      <Link
        className="font-semibold text-ink underline decoration-rule underline-offset-4 hover:decoration-copper"
        to={`/substances/${c.row.original.id}`}
      >
        {c.getValue()}
      </Link>
    ),
  }),
  col.accessor('formula', { header: 'Formula', cell: (c) => c.getValue() ?? '—' }),
  col.accessor('molarMassGPerMol', { header: 'M (g/mol)', meta: { numeric: true }, cell: (c) => c.getValue().toFixed(3) }),
  col.accessor('measurementSetCount', { header: 'Measurement sets', meta: { numeric: true } }),
  col.accessor('kinds', {
    header: 'Kinds',
    enableSorting: false,
    cell: (c) => (
      <span className="flex gap-1">
        {(c.getValue() ?? []).map((k) => (
          <KindBadge key={k} kind={k} />
        ))}
      </span>
    ),
  }),
];

export function SubstancesRoute() {
  const substances = useSubstances();
  const canWrite = useCan('substance:write');
  const create = useCreateSubstance();
  const navigate = useNavigate();
  return (
    <>
      <PageHeader eyebrow="Measurements" title="Substances" subtitle="Atoms, molecules and beads with their measurement sets." />
      <div className={`grid gap-6 ${canWrite ? 'lg:grid-cols-[2fr_1fr]' : ''}`}>
        <Panel>
          {substances.isPending ? (
            <LoadingState />
          ) : substances.isError ? (
            <ErrorState error={substances.error} onRetry={() => substances.refetch()} />
          ) : substances.data.length === 0 ? (
            <EmptyState title="No substances yet">
              {canWrite ? 'Add the first one with the form.' : 'A modeller adds substances.'}
            </EmptyState>
          ) : (
            <DataTable data={substances.data} columns={columns} caption="Substances" rowKey={(s) => s.id} />
          )}
        </Panel>
        {canWrite && (
          <Panel title="New substance">
            <SubstanceForm
              submitLabel="Create substance"
              busy={create.isPending}
              error={create.error}
              onSubmit={(v) => create.mutate(v, { onSuccess: (s) => navigate(`/substances/${s.id}`) })}
            />
          </Panel>
        )}
      </div>
    </>
  );
}
