import { Link } from 'react-router-dom';
import { formatDate } from '@shared/format/dates';
import { createColumnHelper } from '@tanstack/react-table';
import type { EnergyUnit, LengthUnit } from '@shared/physics/parameter-units';
import { convertEpsilon, convertSigma } from '@shared/physics/parameter-units';
import { KindBadge } from '@/components/ui/badge';
import { DataTable } from '@/components/ui/data-table';
import type { CatalogEntry } from '../api/catalog';
import { epsilonHeader, epsilonText, sigmaHeader, sigmaText, temperatureRangeText } from './unit-text';

const col = createColumnHelper<CatalogEntry>();

/** One row per current approved version; ε and σ in the person's units, sortable by their values. */
export function CatalogTable({ sets, energy, length }: { sets: CatalogEntry[]; energy: EnergyUnit; length: LengthUnit }) {
  const columns = [
    col.accessor('substanceName', {
      header: 'Substance',
      cell: (c) => (
        <Link
          className="font-semibold text-ink underline decoration-rule underline-offset-4 hover:decoration-copper"
          to={`/catalog/${c.row.original.id}`}
        >
          {c.getValue()}
        </Link>
      ),
    }),
    col.accessor('formula', { header: 'Formula', cell: (c) => c.getValue() ?? '—' }),
    col.accessor('version', { header: 'Version', meta: { numeric: true }, cell: (c) => `v${c.getValue()}` }),
    col.accessor('schemeLabel', {
      header: 'Scheme',
      cell: (c) => `${c.getValue()}${c.row.original.cutoffSigma !== null ? `, r_c = ${c.row.original.cutoffSigma} σ` : ''}`,
    }),
    col.accessor((s) => convertEpsilon(s.epsilonK, energy), {
      id: 'epsilon',
      header: () => <span className="normal-case">{epsilonHeader(energy)}</span>,
      meta: { numeric: true },
      cell: (c) => epsilonText(c.row.original.epsilonK, c.row.original.stdErr.epsilonK, energy),
    }),
    col.accessor((s) => convertSigma(s.sigmaAngstrom, length), {
      id: 'sigma',
      header: () => <span className="normal-case">{sigmaHeader(length)}</span>,
      meta: { numeric: true },
      cell: (c) => sigmaText(c.row.original.sigmaAngstrom, c.row.original.stdErr.sigmaAngstrom, length),
    }),
    col.accessor((s) => s.validity.temperatureMinK, {
      id: 'validity',
      header: 'Valid for',
      meta: { numeric: true },
      cell: (c) => temperatureRangeText(c.row.original.validity),
    }),
    col.accessor('kinds', {
      header: 'Data',
      enableSorting: false,
      cell: (c) => (
        <span className="flex gap-1">
          {c.getValue().map((k) => (
            <KindBadge key={k} kind={k} />
          ))}
        </span>
      ),
    }),
    col.accessor('approvedAt', {
      header: 'Approved',
      cell: (c) => (c.getValue() ? <time dateTime={c.getValue()!}>{formatDate(c.getValue()!)}</time> : '—'),
    }),
    col.accessor('olderVersions', { header: 'Older', meta: { numeric: true }, cell: (c) => (c.getValue() ? c.getValue() : '—') }),
  ];
  return (
    <DataTable
      data={sets}
      columns={columns}
      caption="Approved parameter sets"
      rowKey={(s) => s.id}
      initialSorting={[{ id: 'substanceName', desc: false }]}
    />
  );
}
