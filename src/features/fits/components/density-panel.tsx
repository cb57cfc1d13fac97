import { Link } from 'react-router-dom';
import type { LjFitResult, LjResidual } from '@shared/fitting/lj-fit';
import { formatSignificant, formatWithUncertainty } from '@shared/format/numbers';
import { PropertyChart, type ChartSeries } from '@/components/charts/property-chart';
import { Badge } from '@/components/ui/badge';

type DensityResidual = LjResidual & { modelUncertainty?: number; simulationId?: number | null; included?: boolean };

export interface DensityFitResult extends LjFitResult {
  eosStage?: LjFitResult;
  mdSettings?: { atoms: number; steps: number; cutoff: number; scheme: string; seed: number };
  mdRunCount?: number;
  mdRunsReused?: number;
  schemeNote?: string;
  stoppingRule?: string;
  mdIterations?: Array<{ iteration: number; epsilonK: number; sigmaAngstrom: number; chi2: number; accepted: boolean; runs: number; reusedRuns: number; excludedPoints: unknown[] }>;
  mdRuns?: Array<{ id: number; reused: boolean; temperatureK: number; pressureMPa: number; reducedTemperature: number; reducedPressure: number; reducedDensity: number; stdErr: number; phase: string; iteration: number }>;
}

/** Measured densities against simulated ones, one isotherm per marker shape, with both error bars. */
export function DensityCharts({ result }: { result: DensityFitResult }) {
  const rows = result.residuals.filter((r) => r.kind === 'density') as DensityResidual[];
  if (!rows.length) return null;
  const isotherms = [...new Set(rows.map((r) => Number(r.temperatureK.toFixed(2))))].sort((a, b) => a - b);
  const byT = (t: number) => rows.filter((r) => Number(r.temperatureK.toFixed(2)) === t).sort((a, b) => (a.pressureMPa ?? 0) - (b.pressureMPa ?? 0));
  const series: ChartSeries[] = [
    ...isotherms.map((t) => ({ label: `measured, ${t} K`, kind: 'measured' as const, points: byT(t).map((r) => ({ x: r.pressureMPa ?? 0, y: r.measured, u: r.uncertainty })) })),
    ...isotherms.map((t) => ({ label: `simulated, ${t} K`, kind: 'simulated' as const, points: byT(t).map((r) => ({ x: r.pressureMPa ?? 0, y: r.predicted, u: r.modelUncertainty })) })),
  ];
  const residualSeries: ChartSeries[] = [
    { label: 'measurement u', kind: 'measured', points: rows.map((r) => ({ x: r.pressureMPa ?? 0, y: 0, u: r.uncertainty })) },
    { label: 'simulated − measured', kind: 'simulated', points: rows.map((r) => ({ x: r.pressureMPa ?? 0, y: r.predicted - r.measured, u: r.modelUncertainty })) },
  ];
  return (
    <div>
      <h3 className="mb-1 font-semibold">Fluid density</h3>
      <PropertyChart ariaLabel="density data and simulations" series={series} xTitle="P (MPa)" yTitle="ρ (kg/m³)" residuals={{ title: 'ρ_sim − ρ_meas (kg/m³)', series: residualSeries }} height={320} />
      {rows.some((r) => r.included === false) && <p className="mt-1 text-xs text-changes">Points left out of the final round are listed in the warnings above.</p>}
    </div>
  );
}

/** The equation-of-state stage and the simulation stage side by side, then the rounds and the runs behind the fit. */
export function SimulationStage({ result }: { result: DensityFitResult }) {
  if (!result.eosStage || !result.mdRuns) return null;
  const eos = result.eosStage;
  const md = result.mdSettings;
  return (
    <div className="grid gap-5">
      <table className="w-full max-w-2xl text-sm">
        <thead className="border-b border-rule text-xs tracking-wide text-ink-faint">
          <tr><th className="py-1.5 text-left">Stage</th><th className="text-right">ε/k_B (K)</th><th className="text-right">σ (Å)</th><th className="text-right">χ²ν</th></tr>
        </thead>
        <tbody>
          <tr className="border-b border-rule/60"><td className="py-1.5">Equation of state (Johnson, Zollweg & Gubbins 1993)</td><td className="num text-right">{formatWithUncertainty(eos.epsilonK, eos.stdErr.epsilonK)}</td><td className="num text-right">{formatWithUncertainty(eos.sigmaAngstrom, eos.stdErr.sigmaAngstrom)}</td><td className="num text-right">{eos.reducedChi2 == null ? '—' : formatSignificant(eos.reducedChi2, 3)}</td></tr>
          <tr><td className="py-1.5">Molecular dynamics (NPT){md ? `, ${md.atoms} atoms, ${md.steps} steps, rc = ${md.cutoff}σ, ${md.scheme}` : ''}</td><td className="num text-right text-teal">{formatWithUncertainty(result.epsilonK, result.stdErr.epsilonK)}</td><td className="num text-right text-teal">{formatWithUncertainty(result.sigmaAngstrom, result.stdErr.sigmaAngstrom)}</td><td className="num text-right">{result.reducedChi2 == null ? '—' : formatSignificant(result.reducedChi2, 3)}</td></tr>
        </tbody>
      </table>
      <p className="text-sm text-ink-soft">
        {result.stoppingRule}. {result.schemeNote} The simulation standard errors are added to the measurement uncertainties, so the parameter uncertainties include the simulation noise. {result.mdRunCount} runs, {result.mdRunsReused} of them reused from earlier fits or rounds.
      </p>
      {result.mdIterations && (
        <table className="w-full max-w-2xl text-sm" aria-label="Simulation rounds">
          <thead className="border-b border-rule text-xs tracking-wide text-ink-faint">
            <tr><th className="py-1.5 text-left">Round</th><th className="text-right">ε/k_B (K)</th><th className="text-right">σ (Å)</th><th className="text-right">χ²</th><th className="text-right">Runs (reused)</th><th className="text-right">Step</th></tr>
          </thead>
          <tbody>
            {result.mdIterations.map((it) => (
              <tr key={it.iteration} className="border-b border-rule/60">
                <td className="py-1">{it.iteration}</td>
                <td className="num text-right">{it.epsilonK.toFixed(3)}</td>
                <td className="num text-right">{it.sigmaAngstrom.toFixed(5)}</td>
                <td className="num text-right">{formatSignificant(it.chi2, 5)}</td>
                <td className="num text-right">{it.runs} ({it.reusedRuns})</td>
                <td className="text-right">{it.accepted ? 'kept' : 'rejected'}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      <div className="max-h-96 overflow-auto">
        <table className="w-full text-sm" aria-label="Simulations behind the fit">
          <thead className="sticky top-0 border-b border-rule bg-paper-raised text-xs tracking-wide text-ink-faint">
            <tr><th className="py-1.5 text-left">Run</th><th className="text-right">Round</th><th className="text-right">T (K)</th><th className="text-right">P (MPa)</th><th className="text-right">T*</th><th className="text-right">P*</th><th className="text-right">ρ*</th><th className="text-left pl-3">Phase</th></tr>
          </thead>
          <tbody>
            {result.mdRuns.map((r, i) => (
              <tr key={`${r.id}-${i}`} className="border-b border-rule/50">
                <td className="py-1"><Link className="text-copper underline" to={`/simulations/${r.id}`}>Simulation {r.id}</Link>{r.reused && <span className="ml-2 text-xs text-ink-faint">reused</span>}</td>
                <td className="num text-right">{r.iteration}</td>
                <td className="num text-right">{r.temperatureK.toFixed(2)}</td>
                <td className="num text-right">{r.pressureMPa.toFixed(3)}</td>
                <td className="num text-right">{r.reducedTemperature.toFixed(4)}</td>
                <td className="num text-right">{r.reducedPressure.toFixed(4)}</td>
                <td className="num text-right text-teal">{formatWithUncertainty(r.reducedDensity, r.stdErr)}</td>
                <td className="pl-3">{r.phase === 'fluid' ? <Badge tone="teal">fluid</Badge> : <Badge tone="changes">{r.phase}</Badge>}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
