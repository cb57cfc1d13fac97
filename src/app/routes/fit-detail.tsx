import { useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import type { EnergyUnit, LengthUnit } from '@shared/physics/parameter-units';
import { Button } from '@/components/ui/button';
import { ProgressBar } from '@/components/ui/progress-bar';
import { ErrorState, LoadingState, PageHeader, Panel } from '@/components/ui/states';
import { UnitSwitch } from '@/components/ui/unit-switch';
import { useCan } from '@/lib/authorization';
import { useCancelFit, useFit } from '@/features/fits/api/fits';
import { EllipseChart } from '@/features/fits/components/ellipse-chart';
import { FitCurves } from '@/features/fits/components/fit-curves';
import { DensityCharts, SimulationStage, type DensityFitResult } from '@/features/fits/components/density-panel';
import { FitStatusBadge } from '@/features/fits/components/fit-status-badge';
import { DatasetStatsTable, ParameterTable } from '@/features/fits/components/parameter-table';
import { WhatIfPanel } from '@/features/fits/components/what-if-panel';
import { DraftParameterSetPanel } from '@/features/parameter-sets/components/draft-panel';

export function FitDetailRoute() {
  const id = Number(useParams().fitId);
  const fit = useFit(id);
  const cancel = useCancelFit(id);
  const canRun = useCan('fit:run');
  const canDraft = useCan('parameterSet:draft');
  const [units, setUnits] = useState<{ energy: EnergyUnit; length: LengthUnit }>({ energy: 'K', length: 'Å' });
  if (fit.isPending) return <LoadingState />;
  if (fit.isError) return <ErrorState error={fit.error} onRetry={() => fit.refetch()} />;
  const f = fit.data;
  const names = Object.fromEntries(f.datasets.map((d) => [String(d.datasetId), `${d.name} v${d.version}`]));
  const weights = Object.fromEntries(f.datasets.map((d) => [String(d.datasetId), d.weight]));
  const context = { molarMassGPerMol: f.options.molarMassGPerMol, quantumCorrection: !!f.options.quantumCorrection };
  const r = f.result;
  return (
    <>
      <PageHeader
        eyebrow={<Link to={`/substances/${f.substanceId}`} className="hover:underline">{f.substanceName}</Link>}
        title={`Fit #${f.number}`}
        subtitle={
          <span className="flex flex-wrap items-center gap-2">
            <FitStatusBadge status={f.status} /> LJ 12-6 on {f.datasets.map((d) => `${d.name} v${d.version}${d.weight !== 1 ? ` (weight ${d.weight})` : ''}`).join(', ')}
          </span>
        }
        action={<Link to={`/substances/${f.substanceId}/fits`} className="text-sm font-semibold text-copper underline underline-offset-4">All fits of {f.substanceName}</Link>}
      />
      {(f.status === 'queued' || f.status === 'running') && (
        <Panel title="Running" className="mb-6">
          <ProgressBar fraction={f.progress} label={f.status === 'queued' ? 'Waiting for a free worker…' : f.stage ?? 'Working…'} />
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
      {r && r.status === 'succeeded' && (
        <div className="grid gap-6">
          {(r.warnings.length > 0 || r.hitBounds.length > 0) && (
            <div role="status" className="rounded-lg border border-review/40 bg-review-soft/70 px-5 py-3">
              <p className="font-semibold text-review">Read before use</p>
              <ul className="mt-1 list-disc pl-5 text-sm">
                {r.hitBounds.map((b) => <li key={b}>The fit ended on the bound of {b}; the value is a limit, not an estimate.</li>)}
                {r.warnings.map((w) => <li key={w}>{w}</li>)}
              </ul>
            </div>
          )}
          <div className="grid gap-6 lg:grid-cols-[3fr_2fr]">
            <Panel title="Parameters" actions={<UnitSwitch energy={units.energy} length={units.length} onChange={setUnits} />}>
              <ParameterTable result={r} energy={units.energy} length={units.length} />
            </Panel>
            <Panel title="95 % joint confidence region">
              <EllipseChart result={r} />
            </Panel>
          </div>
          <Panel title="Data and model">
            <div className="grid gap-6">
              <FitCurves result={r} datasetNames={names} context={context} curves={[{ label: `Fit #${f.number}`, epsilonK: r.epsilonK, sigmaAngstrom: r.sigmaAngstrom }]} />
              <DensityCharts result={r as DensityFitResult} />
            </div>
          </Panel>
          {(r as DensityFitResult).mdRuns && (
            <Panel title="Simulation stage">
              <SimulationStage result={r as DensityFitResult} />
            </Panel>
          )}
          <Panel title="Per measurement set">
            <DatasetStatsTable result={r} names={names} />
          </Panel>
          <Panel title="What if?">
            <WhatIfPanel result={r} names={names} context={context} weights={weights} />
          </Panel>
          {canDraft && <DraftParameterSetPanel fitId={f.id} result={r} />}
          <Panel title="Record">
            <dl className="grid grid-cols-[max-content_1fr] gap-x-4 gap-y-1 text-sm">
              <dt className="text-ink-faint">Run by</dt><dd>{f.createdByName}, {new Date(f.createdAt).toLocaleString()}</dd>
              <dt className="text-ink-faint">Finished</dt><dd>{f.finishedAt ? new Date(f.finishedAt).toLocaleString() : '—'}</dd>
              <dt className="text-ink-faint">Code version</dt><dd className="font-mono text-xs">{f.codeVersion}</dd>
              <dt className="text-ink-faint">Molar mass</dt><dd className="num">{f.options.molarMassGPerMol} g/mol</dd>
              <dt className="text-ink-faint">Data versions</dt><dd>{f.datasets.map((d) => <Link key={d.datasetId} className="mr-3 text-copper underline" to={`/datasets/${d.datasetId}?version=${d.version}`}>{d.name} v{d.version}</Link>)}</dd>
            </dl>
          </Panel>
        </div>
      )}
    </>
  );
}
