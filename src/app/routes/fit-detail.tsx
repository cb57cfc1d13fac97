import { useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { formatDateTime } from '@shared/format/dates';
import type { EnergyUnit, LengthUnit } from '@shared/physics/parameter-units';
import { Button } from '@/components/ui/button';
import { ProgressBar } from '@/components/ui/progress-bar';
import { ErrorState, LoadingState, PageHeader, Panel } from '@/components/ui/states';
import { UnitSwitch } from '@/components/ui/unit-switch';
import { useCan } from '@/lib/authorization';
import { useCancelFit, useFit } from '@/features/fits/api/fits';
import { FitEvidence, fitContext, hasEvidence } from '@/features/fits/components/fit-evidence';
import { FitStatusBadge } from '@/features/fits/components/fit-status-badge';
import { FitInsights } from '@/features/fits/components/fit-insights';
import { WhatIfPanel } from '@/features/fits/components/what-if-panel';
import { DraftParameterSetPanel } from '@/features/parameter-sets/components/draft-panel';

export function FitDetailRoute() {
  const id = Number(useParams().fitId);
  const fit = useFit(id);
  const cancel = useCancelFit(id);
  const canRun = useCan('fit:run');
  const canDraft = useCan('parameterSet:draft');
  const [units, setUnits] = useState<{ energy: EnergyUnit; length: LengthUnit }>({ energy: 'K', length: 'Å' });
  if (fit.isPending) return <LoadingState label="Loading the fit…" />;
  if (fit.isError) return <ErrorState error={fit.error} onRetry={() => fit.refetch()} />;
  const f = fit.data;
  const { names, weights, context } = fitContext(f);
  const r = f.result;
  const leftOut = f.measurementSets.filter((d) => d.excludeRows?.length);
  return (
    <>
      <PageHeader
        eyebrow={
          <Link to={`/substances/${f.substanceId}`} className="hover:underline">
            {f.substanceName}
          </Link>
        }
        title={`Fit #${f.number}`}
        subtitle={
          <span className="flex flex-wrap items-center gap-2">
            <FitStatusBadge status={f.status} />{' '}
            {r?.model === 'mie' && r.repulsiveExponent !== undefined ? `Mie ${Number(r.repulsiveExponent.toFixed(2))}-6` : 'LJ 12-6'} on{' '}
            {f.measurementSets.map((d) => `${d.name} v${d.version}${d.weight !== 1 ? ` (weight ${d.weight})` : ''}`).join(', ')}
          </span>
        }
        action={
          <Link to={`/substances/${f.substanceId}/fits`} className="text-sm font-semibold text-copper underline underline-offset-4">
            All fits of {f.substanceName}
          </Link>
        }
      />
      {(f.status === 'queued' || f.status === 'running') && (
        <Panel title="Running" className="mb-6">
          <ProgressBar
            fraction={f.progress}
            label={f.status === 'queued' ? 'Waiting for a free worker…' : (f.stage ?? 'Starting the fit…')}
          />
          {canRun && (
            <Button className="mt-4" variant="danger" busy={cancel.isPending} onClick={() => cancel.mutate()}>
              Cancel fit
            </Button>
          )}
        </Panel>
      )}
      {(f.status === 'failed' || f.status === 'cancelled') && (
        <div role="alert" className="mb-6 rounded-lg border border-changes/30 bg-changes-soft/70 px-5 py-4">
          <p className="font-semibold text-changes">{f.status === 'cancelled' ? 'This fit was cancelled.' : 'This fit failed.'}</p>
          {f.error && <p className="mt-1 text-sm text-ink-soft">{f.error}</p>}
          <p className="mt-1 text-sm text-ink-soft">A fit is never edited: run a new one with changed data or options.</p>
        </div>
      )}
      {leftOut.length > 0 && (
        <div role="note" className="mb-6 rounded-md bg-paper-deep px-4 py-2 text-sm">
          {leftOut.map((d) => (
            <p key={d.measurementSetId}>
              Left out of {d.name} v{d.version}: row{d.excludeRows!.length > 1 ? 's' : ''} {d.excludeRows!.join(', ')}
              {d.excludeReason ? ` — “${d.excludeReason}”` : ''}.
            </p>
          ))}
        </div>
      )}
      {hasEvidence(r) && (
        <div className="grid gap-6">
          <FitEvidence
            fit={f}
            result={r}
            curves={[{ label: `Fit #${f.number}`, epsilonK: r.epsilonK, sigmaAngstrom: r.sigmaAngstrom }]}
            energy={units.energy}
            length={units.length}
            unitSwitch={<UnitSwitch energy={units.energy} length={units.length} onChange={setUnits} />}
          />
          {r.status === 'succeeded' && (
            <Panel title="What if?" className="min-w-0">
              <WhatIfPanel result={r} names={names} context={context} weights={weights} />
            </Panel>
          )}
          {r.status === 'succeeded' && <FitInsights result={r} />}
          {canDraft && r.status === 'succeeded' && <DraftParameterSetPanel fitId={f.id} result={r} />}
        </div>
      )}
      <Panel title="Record" className="mt-6">
        <dl className="grid grid-cols-[max-content_1fr] gap-x-4 gap-y-1 text-sm">
          <dt className="text-ink-faint">Run by</dt>
          <dd>
            {f.createdByName}, {formatDateTime(f.createdAt)}
          </dd>
          <dt className="text-ink-faint">Finished</dt>
          <dd>{f.finishedAt ? formatDateTime(f.finishedAt) : '—'}</dd>
          <dt className="text-ink-faint">Code version</dt>
          <dd className="break-all font-mono text-xs">{f.codeVersion}</dd>
          <dt className="text-ink-faint">Molar mass</dt>
          <dd className="num">{f.options.molarMassGPerMol ?? '—'} g/mol</dd>
          <dt className="text-ink-faint">Data versions</dt>
          <dd>
            {f.measurementSets.map((d) => (
              <Link
                key={d.measurementSetId}
                className="mr-3 text-copper underline"
                to={`/measurement-sets/${d.measurementSetId}?version=${d.version}`}
              >
                {d.name} v{d.version}
              </Link>
            ))}
          </dd>
        </dl>
      </Panel>
    </>
  );
}
