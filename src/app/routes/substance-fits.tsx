import { useState } from 'react';
import { formatDate } from '@shared/format/dates';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { formatWithUncertainty, formatSignificant } from '@shared/format/numbers';
import { KindBadge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { EmptyState, ErrorState, LoadingState, PageHeader, Panel } from '@/components/ui/states';
import { useCan } from '@/lib/authorization';
import { useSubstanceFits } from '@/features/fits/api/fits';
import { FitStatusBadge } from '@/features/fits/components/fit-status-badge';
import { useSubstance } from '@/features/substances/api/substances';

/** The fit history of a substance; pick two to compare side by side. */
export function SubstanceFitsRoute() {
  const substanceId = Number(useParams().substanceId);
  const substance = useSubstance(substanceId);
  const fits = useSubstanceFits(substanceId);
  const canRun = useCan('fit:run');
  const navigate = useNavigate();
  const [picked, setPicked] = useState<number[]>([]);
  if (substance.isPending || fits.isPending) return <LoadingState />;
  if (substance.isError) return <ErrorState error={substance.error} onRetry={() => substance.refetch()} />;
  if (fits.isError) return <ErrorState error={fits.error} onRetry={() => fits.refetch()} />;
  const toggle = (id: number) => setPicked((p) => (p.includes(id) ? p.filter((x) => x !== id) : [...p.slice(-1), id]));
  return (
    <>
      <PageHeader
        eyebrow={
          <Link to={`/substances/${substanceId}`} className="hover:underline">
            {substance.data.name}
          </Link>
        }
        title="Fits"
        subtitle="Every fit is kept as it ran. Tick two to compare them."
        action={
          canRun && (
            <Link
              to={`/substances/${substanceId}/fits/new`}
              className="rounded-md bg-copper px-3.5 py-1.5 text-sm font-semibold text-white shadow-sm hover:bg-copper-dark"
            >
              New fit
            </Link>
          )
        }
      />
      <Panel>
        {fits.data.length === 0 ? (
          <EmptyState title="No fits yet">
            {canRun ? 'Run the first fit from the measurement sets of this substance.' : 'A modeller runs fits.'}
          </EmptyState>
        ) : (
          <>
            <div className="overflow-x-auto">
              <table className="w-full text-left text-sm">
                <thead className="border-b border-rule text-xs tracking-wide text-ink-faint">
                  <tr>
                    <th className="py-1.5">Compare</th>
                    <th>Fit</th>
                    <th>Status</th>
                    <th>Data</th>
                    <th className="text-right">ε/k_B (K)</th>
                    <th className="text-right">σ (Å)</th>
                    <th className="text-right">χ²ν</th>
                    <th>Run</th>
                  </tr>
                </thead>
                <tbody>
                  {fits.data.map((f) => (
                    <tr key={f.id} className="border-b border-rule/60">
                      <td className="py-1.5">
                        <input
                          type="checkbox"
                          className="accent-copper"
                          aria-label={`Compare Fit #${f.number}`}
                          checked={picked.includes(f.id)}
                          disabled={f.status !== 'succeeded'}
                          onChange={() => toggle(f.id)}
                        />
                      </td>
                      <td>
                        <Link
                          className="font-semibold underline decoration-rule underline-offset-4 hover:decoration-copper"
                          to={`/fits/${f.id}`}
                        >
                          Fit #{f.number}
                        </Link>
                        {f.warnings.length > 0 && (
                          <span className="ml-2 text-xs text-review" title={f.warnings.join('\n')}>
                            ⚠ {f.warnings.length}
                          </span>
                        )}
                      </td>
                      <td className="whitespace-nowrap">
                        <FitStatusBadge status={f.status} />
                        {f.converged === false && f.epsilonK != null && (
                          <div className="text-xs font-semibold text-changes">not converged: last iterate</div>
                        )}
                        {(f.heldParameters ?? []).length > 0 && (
                          <div className="text-xs text-copper">
                            {f.heldParameters!.map((h) => (h === 'epsilonK' ? 'ε/k_B' : 'σ')).join(', ')} held
                          </div>
                        )}
                      </td>
                      <td>
                        <span className="flex flex-wrap gap-1">
                          {f.measurementSets.map((d) => (
                            <span key={d.measurementSetId} className="inline-flex items-center gap-1">
                              <KindBadge kind={d.kind} />
                              <span className="text-xs text-ink-soft">
                                {d.name} v{d.version}
                                {d.excludeRows?.length ? ` (${d.excludeRows.length} rows left out)` : ''}
                              </span>
                            </span>
                          ))}
                        </span>
                      </td>
                      <td className="num text-right">{f.epsilonK == null ? '—' : formatWithUncertainty(f.epsilonK, f.stdErr?.epsilonK)}</td>
                      <td className="num text-right">
                        {f.sigmaAngstrom == null ? '—' : formatWithUncertainty(f.sigmaAngstrom, f.stdErr?.sigmaAngstrom)}
                      </td>
                      <td className="num text-right">{f.reducedChi2 == null ? '—' : formatSignificant(f.reducedChi2, 3)}</td>
                      <td className="text-ink-soft">
                        {f.createdByName}, {formatDate(f.createdAt)}
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
            <div className="mt-4">
              <Button
                variant="primary"
                disabled={picked.length !== 2}
                onClick={() => navigate(`/fits/compare?a=${picked[0]}&b=${picked[1]}`)}
              >
                Compare {picked.length === 2 ? 'these two' : 'two fits'}
              </Button>
            </div>
          </>
        )}
      </Panel>
    </>
  );
}
