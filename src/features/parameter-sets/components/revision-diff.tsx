import { Link } from 'react-router-dom';
import { ErrorState, LoadingState } from '@/components/ui/states';
import { useParameterSetDiff } from '../api/parameter-sets';

/** A value as stored, without padding zeros (1, 2.5, 131.004). */
const text = (v: string | number | null) => (v === null ? '—' : typeof v === 'number' ? String(Number(v.toPrecision(8))) : v);

/** A revision against the version it revises: every value, scheme, validity and data change, before and after. */
export function RevisionDiff({ parameterSetId }: { parameterSetId: number }) {
  const diff = useParameterSetDiff(parameterSetId);
  if (diff.isPending) return <LoadingState label="Comparing with the previous version…" />;
  if (diff.isError) return <ErrorState error={diff.error} onRetry={() => diff.refetch()} />;
  const { previous, changes } = diff.data;
  if (!previous) return <p className="text-sm text-ink-soft">No earlier version to compare with.</p>;
  return (
    <div className="grid gap-3">
      <p className="text-sm text-ink-soft">
        Against{' '}
        <Link className="text-copper underline" to={`/parameter-sets/${previous.id}`}>
          v{previous.version}
        </Link>
        {changes.length === 0 ? ': nothing changed.' : `: ${changes.length} change${changes.length > 1 ? 's' : ''}.`}
      </p>
      {changes.length > 0 && (
        <div className="overflow-x-auto">
          <table className="w-full text-sm" aria-label="Changes from the previous version">
            <thead className="border-b border-rule text-xs tracking-wide text-ink-faint">
              <tr>
                <th className="py-1.5 text-left">What</th>
                <th className="text-left">v{previous.version}</th>
                <th className="text-left">This version</th>
              </tr>
            </thead>
            <tbody>
              {changes.map((c) => (
                <tr key={c.field} className="border-b border-rule/60 align-top">
                  <td className="py-1.5 font-semibold">{c.label}</td>
                  <td className={`text-ink-soft line-through decoration-ink-faint/50 ${typeof c.before === 'number' ? 'num' : ''}`}>
                    {text(c.before)}
                  </td>
                  <td className={typeof c.after === 'number' ? 'num' : ''}>{text(c.after)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </div>
  );
}
