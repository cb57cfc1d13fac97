import { Link } from 'react-router-dom';
import { formatDate, formatDateTime } from '@shared/format/dates';
import { createColumnHelper } from '@tanstack/react-table';
import { formatWithUncertainty } from '@shared/format/numbers';
import { DataTable } from '@/components/ui/data-table';
import type { ParameterSetSummary, QueueItem } from '../api/parameter-sets';
import { schemeText, validityText } from './frozen-values';
import { ParameterSetStateBadge } from './state-badge';

const col = createColumnHelper<ParameterSetSummary & Partial<Pick<QueueItem, 'submittedAt'>>>();

/** Parameter sets as a dense table; `queue` adds the submission time, `withSubstance` the substance name. */
export function ParameterSetTable({
  sets,
  caption,
  withSubstance = false,
  queue = false,
}: {
  sets: Array<ParameterSetSummary | QueueItem>;
  caption: string;
  withSubstance?: boolean;
  queue?: boolean;
}) {
  const columns = [
    col.accessor('version', {
      header: 'Parameter set',
      cell: (c) => (
        <Link
          className="font-semibold underline decoration-rule underline-offset-4 hover:decoration-copper"
          to={`/parameter-sets/${c.row.original.id}`}
        >
          {withSubstance ? `${c.row.original.substanceName} v${c.getValue()}` : `v${c.getValue()}`}
        </Link>
      ),
    }),
    col.accessor('scheme', { header: 'Scheme', cell: (c) => schemeText(c.row.original) }),
    col.accessor('state', { header: 'State', cell: (c) => <ParameterSetStateBadge state={c.getValue()} /> }),
    col.accessor('epsilonK', {
      header: () => <span className="normal-case">ε/k_B</span>,
      meta: { numeric: true },
      cell: (c) => formatWithUncertainty(c.getValue(), c.row.original.stdErr.epsilonK, 'K'),
    }),
    col.accessor('sigmaAngstrom', {
      header: () => <span className="normal-case">σ</span>,
      meta: { numeric: true },
      cell: (c) => formatWithUncertainty(c.getValue(), c.row.original.stdErr.sigmaAngstrom, 'Å'),
    }),
    col.accessor((s) => s.validity.temperatureMinK, {
      id: 'validity',
      header: 'Valid for',
      cell: (c) => <span className="num">{validityText(c.row.original.validity)}</span>,
    }),
    col.accessor('createdByName', { header: 'Author' }),
    queue
      ? col.accessor('submittedAt', { header: 'Submitted', cell: (c) => (c.getValue() ? formatDateTime(c.getValue()!) : '—') })
      : col.accessor('updatedAt', { header: 'Last change', cell: (c) => formatDate(c.getValue()) }),
  ];
  return <DataTable data={sets} columns={columns} caption={caption} rowKey={(s) => s.id} />;
}
