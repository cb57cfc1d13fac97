import { Link, useParams } from 'react-router-dom';
import { formatSignificant, formatWithUncertainty } from '@shared/format/numbers';
import { massDensityKgPerM3 } from '@shared/physics/corresponding-states';
import { Button } from '@/components/ui/button';
import { ProgressBar } from '@/components/ui/progress-bar';
import { ErrorState, LoadingState, PageHeader, Panel } from '@/components/ui/states';
import { useCan } from '@/lib/authorization';
import { FitStatusBadge } from '@/features/fits/components/fit-status-badge';
import { useSimulation, useSimulationAction } from '@/features/simulations/api/simulations';
import { PhaseBadge } from '@/features/simulations/components/phase-badge';
import { TraceChart } from '@/features/simulations/components/trace-chart';
import { useSubstance } from '@/features/substances/api/substances';

function OriginComparison({
  origin,
  rhoStar,
  rhoStarErr,
}: {
  origin: NonNullable<ReturnType<typeof useSimulation>['data']>['origin'] & {};
  rhoStar: number;
  rhoStarErr: number;
}) {
  const substance = useSubstance(origin.substanceId);
  if (!substance.data) return null;
  const M = substance.data.molarMassGPerMol;
  const rho = massDensityKgPerM3(rhoStar, M, origin.sigmaAngstrom);
  const err = massDensityKgPerM3(rhoStarErr, M, origin.sigmaAngstrom);
  return (
    <p className="num mt-2 text-sm">
      For {substance.data.name} at {origin.temperatureK.toFixed(2)} K and {origin.pressureMPa.toFixed(3)} MPa with ε/k_B = {origin.epsilonK}{' '}
      K, σ = {origin.sigmaAngstrom} Å: simulated ρ = {formatWithUncertainty(rho, err, 'kg/m³')}, measured{' '}
      {formatSignificant(origin.densityKgPerM3, 6)} kg/m³ (
      <Link className="text-copper underline" to={`/measurement-sets/${origin.measurementSetId}?version=${origin.version}`}>
        row {origin.fileRow}
      </Link>
      ).
    </p>
  );
}

export function SimulationDetailRoute() {
  const id = Number(useParams().simulationId);
  const sim = useSimulation(id);
  const canRun = useCan('simulation:run');
  const cancel = useSimulationAction(id, 'cancel');
  const retry = useSimulationAction(id, 'retry');
  if (sim.isPending) return <LoadingState />;
  if (sim.isError) return <ErrorState error={sim.error} onRetry={() => sim.refetch()} />;
  const s = sim.data;
  const r = s.summary;
  const d = r?.diagnostics;
  return (
    <>
      <PageHeader
        eyebrow={
          <Link to="/simulations" className="hover:underline">
            Simulations
          </Link>
        }
        title={`Simulation ${s.id}`}
        subtitle={
          <span className="flex flex-wrap items-center gap-2">
            <FitStatusBadge status={s.status} /> NPT at T* = {s.state.reducedTemperature}, P* = {s.state.reducedPressure} · {s.state.atoms}{' '}
            atoms · {s.state.steps} steps · rc = {s.state.cutoff}σ, {s.state.scheme} · seed {s.state.seed}
            {s.ranOn && (
              <>
                {' '}
                · {s.status === 'running' ? 'running on' : 'ran on'} {s.ranOn}
              </>
            )}
          </span>
        }
      />
      {(s.status === 'queued' || s.status === 'running') && (
        <Panel title="Running" className="mb-6">
          <ProgressBar fraction={s.progress} label={s.status === 'queued' ? 'Waiting for a free worker…' : (s.stage ?? 'Running…')} />
          {canRun && (
            <Button className="mt-4" variant="danger" busy={cancel.isPending} onClick={() => cancel.mutate()}>
              Cancel
            </Button>
          )}
        </Panel>
      )}
      {(s.status === 'failed' || s.status === 'cancelled') && (
        <div role="alert" className="mb-6 rounded-lg border border-changes/30 bg-changes-soft/70 px-5 py-4">
          <p className="font-semibold text-changes">{s.status === 'failed' ? 'This run failed.' : 'This run was cancelled.'}</p>
          {s.error && <p className="mt-1 text-sm text-ink-soft">{s.error}</p>}
          {canRun && (
            <Button className="mt-3" busy={retry.isPending} onClick={() => retry.mutate()}>
              Run it again with the same seed
            </Button>
          )}
        </div>
      )}
      {r && d && (
        <div className="grid gap-6">
          {r.phase !== 'fluid' && (
            <div role="alert" className="rounded-lg border border-changes/30 bg-changes-soft/70 px-5 py-3">
              <p className="font-semibold text-changes">
                Phase check: {r.phase === 'solid' ? 'the system froze into an ordered solid' : 'the system split into vapour and liquid'}
              </p>
              <p className="text-sm text-ink-soft">
                Q6 = {r.orderParameter.q6Mean.toFixed(3)} (≥ 0.3 ordered), local-density variance/mean ={' '}
                {r.orderParameter.localDensityVarianceToMean.toFixed(2)}, sparse cells{' '}
                {(100 * r.orderParameter.sparseCellFraction).toFixed(1)} %. A fit does not use this state point.
              </p>
            </div>
          )}
          <div className="grid gap-6 lg:grid-cols-2">
            <Panel title="Result" actions={<PhaseBadge phase={r.phase} />}>
              <dl className="grid grid-cols-[max-content_1fr] gap-x-4 gap-y-1 text-sm">
                <dt className="text-ink-faint">ρ*</dt>
                <dd className="num text-lg font-bold text-teal">{formatWithUncertainty(r.reducedDensity, r.stdErr)}</dd>
                <dt className="text-ink-faint">U*/N</dt>
                <dd className="num">{formatWithUncertainty(r.reducedPotentialEnergy, r.reducedPotentialEnergyStdErr)}</dd>
                <dt className="text-ink-faint">H*/N</dt>
                <dd className="num">{formatSignificant(r.reducedEnthalpy, 5)}</dd>
                <dt className="text-ink-faint">(∂ρ*/∂T*)_P*</dt>
                <dd className="num">{formatWithUncertainty(r.dRhoDT, r.dRhoDTStdErr)}</dd>
                <dt className="text-ink-faint">(∂ρ*/∂P*)_T*</dt>
                <dd className="num">{formatWithUncertainty(r.dRhoDP, r.dRhoDPStdErr)}</dd>
                <dt className="text-ink-faint">κ_T*</dt>
                <dd className="num">{formatSignificant(r.isothermalCompressibility, 4)}</dd>
              </dl>
              {s.origin && <OriginComparison origin={s.origin} rhoStar={r.reducedDensity} rhoStarErr={r.stdErr} />}
            </Panel>
            <Panel title="Diagnostics">
              <dl className="grid grid-cols-[max-content_1fr] gap-x-4 gap-y-1 text-sm">
                <dt className="text-ink-faint">Production starts</dt>
                <dd className="num">step {d.equilibrationStep} (detected, Chodera 2016)</dd>
                <dt className="text-ink-faint">Samples</dt>
                <dd className="num">
                  {d.productionSamples} kept, statistical inefficiency {formatSignificant(d.statisticalInefficiency, 3)}, ≈{' '}
                  {Math.round(d.effectiveSamples)} independent
                </dd>
                <dt className="text-ink-faint">⟨T*⟩</dt>
                <dd className="num">
                  {formatWithUncertainty(d.meanTemperature, d.temperatureStdErr)} (set {s.state.reducedTemperature})
                </dd>
                <dt className="text-ink-faint">⟨P*⟩ virial</dt>
                <dd className="num">
                  {formatWithUncertainty(d.meanPressure, d.meanPressureStdErr)} (set {s.state.reducedPressure})
                </dd>
                <dt className="text-ink-faint">Volume moves</dt>
                <dd className="num">{(100 * d.volumeAcceptance).toFixed(1)} % accepted</dd>
                <dt className="text-ink-faint">Drift</dt>
                <dd className="num">{d.conservedEnergyDriftPerAtomPerTime.toExponential(2)} ε per atom per τ</dd>
                <dt className="text-ink-faint">Wall time</dt>
                <dd className="num">{d.wallSeconds.toFixed(1)} s</dd>
              </dl>
            </Panel>
          </div>
          {s.trace && (
            <Panel title="Traces">
              <div className="grid gap-4 lg:grid-cols-2">
                <TraceChart
                  steps={s.trace.step}
                  values={s.trace.reducedDensity}
                  label="ρ*"
                  yTitle="ρ*"
                  equilibrationStep={d.equilibrationStep}
                />
                <TraceChart
                  steps={s.trace.step}
                  values={s.trace.potentialEnergyPerAtom}
                  label="U*/N"
                  yTitle="U*/N"
                  equilibrationStep={d.equilibrationStep}
                />
                <TraceChart
                  steps={s.trace.step}
                  values={s.trace.reducedTemperature}
                  label="T*"
                  yTitle="T*"
                  equilibrationStep={d.equilibrationStep}
                />
                <TraceChart
                  steps={s.trace.step}
                  values={s.trace.q6}
                  label="Q6 order parameter"
                  yTitle="Q6"
                  equilibrationStep={d.equilibrationStep}
                  threshold={{ value: 0.3, label: 'ordered above' }}
                />
              </div>
            </Panel>
          )}
        </div>
      )}
    </>
  );
}
