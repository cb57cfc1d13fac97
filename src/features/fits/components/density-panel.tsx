import { useMemo } from 'react';
import { Link } from 'react-router-dom';
import type { GasFitResult } from '@shared/fitting/gas-fit';
import type { LjFitResult, LjResidual } from '@shared/fitting/lj-fit';
import { summarise } from '@shared/fitting/posterior';
import { PROPERTY_MODELS } from '@shared/fitting/property-models';
import { formatSignificant, formatWithUncertainty } from '@shared/format/numbers';
import { CUTOFF_SCHEME_LABELS, type CutoffScheme } from '@shared/physics/cutoff-schemes';
import { PropertyChart, type ChartSeries } from '@/components/charts/property-chart';
import { Badge } from '@/components/ui/badge';
import { isLeftOut, RESIDUAL_AXIS_TITLE, type CurveParameters } from './fit-curves';
import { temperatureGrid, thinDraws } from './model-curves';

type DensityResidual = LjResidual & { modelUncertainty?: number; simulationId?: number | null; included?: boolean };

export interface DensityFitResult extends LjFitResult {
  eosStage?: LjFitResult;
  mdSettings?: { atoms: number; steps: number; cutoff: number; scheme: string; seed: number };
  mdRunCount?: number;
  mdRunsReused?: number;
  schemeNote?: string;
  stoppingRule?: string;
  mdIterations?: Array<{
    iteration: number;
    epsilonK: number;
    sigmaAngstrom: number;
    chi2: number;
    accepted: boolean;
    runs: number;
    reusedRuns: number;
    excludedPoints: unknown[];
  }>;
  mdRuns?: Array<{
    id: number;
    reused: boolean;
    temperatureK: number;
    pressureMPa: number;
    reducedTemperature: number;
    reducedPressure: number;
    reducedDensity: number;
    stdErr: number;
    phase: string;
    iteration: number;
  }>;
}

/** A cutoff scheme in words ("truncated with tail corrections"), whatever spelling the result carries. */
export const schemeWords = (scheme: string) => (CUTOFF_SCHEME_LABELS[scheme as CutoffScheme] ?? scheme.replace(/-/g, ' ')).toLowerCase();

const capitalised = (s?: string) => (s ? s[0].toUpperCase() + s.slice(1) : '');
const round = (x: number, digits: number) => Number(x.toFixed(digits));
const percent = (r: LjResidual) => r.relativeDeviationPercent ?? (r.measured !== 0 ? (100 * (r.predicted - r.measured)) / r.measured : NaN);

/**
 * The equation-of-state density along one isobar on a temperature grid; a jump between neighbouring grid
 * points (a phase change of the model) is left as a gap rather than drawn as a line.
 */
function eosIsobar(
  pressureMPa: number,
  temperaturesK: number[],
  p: CurveParameters,
  context: { molarMassGPerMol?: number; quantumCorrection: boolean },
  steps = 60,
) {
  if (context.molarMassGPerMol === undefined) return [];
  const lo = Math.min(...temperaturesK);
  const hi = Math.max(...temperaturesK);
  const span = hi - lo || lo * 0.2;
  const from = Math.max(lo - span * 0.1, 1);
  const to = hi + span * 0.1;
  const out: Array<{ x: number; y: number }> = [];
  let last: number | null = null;
  for (let i = 0; i <= steps; i++) {
    const t = from + ((to - from) * i) / steps;
    try {
      const y = PROPERTY_MODELS.density.evaluate({ temperatureK: t, pressureMPa }, p.epsilonK, p.sigmaAngstrom, context).value;
      if (!Number.isFinite(y)) throw new Error('no density');
      if (last !== null && Math.abs(y - last) > 0.25 * Math.max(Math.abs(y), Math.abs(last))) out.push({ x: t, y: NaN });
      out.push({ x: t, y });
      last = y;
    } catch {
      if (last !== null) out.push({ x: t, y: NaN });
      last = null;
    }
  }
  return out;
}

/**
 * The central 95 % of the equation-of-state density over posterior draws along one isobar (posterior-predictive band,
 * model only); a temperature where fewer than 9 in 10 draws give a density (a phase change) is left out.
 */
function eosBand(
  pressureMPa: number,
  temperaturesK: number[],
  draws: ReadonlyArray<{ epsilonK: number; sigmaAngstrom: number }>,
  context: { molarMassGPerMol?: number; quantumCorrection: boolean },
  steps = 24,
) {
  if (context.molarMassGPerMol === undefined) return [];
  const out: Array<{ x: number; y: number; lower: number }> = [];
  for (const t of temperatureGrid(temperaturesK, steps)) {
    const values: number[] = [];
    for (const d of draws) {
      try {
        const y = PROPERTY_MODELS.density.evaluate({ temperatureK: t, pressureMPa }, d.epsilonK, d.sigmaAngstrom, context).value;
        if (Number.isFinite(y)) values.push(y);
      } catch {
        // no density of this draw here: counted as missing below
      }
    }
    if (values.length < 0.9 * draws.length) continue;
    const s = summarise(values);
    out.push({ x: t, y: s.upper95, lower: s.lower95 });
  }
  return out;
}

/** Draws the density bands are computed from: each is a solve of the equation of state per grid point. */
const DENSITY_BAND_DRAWS = 100;

/**
 * Densities two ways: ρ against P per isotherm with the predicted values (the fit's simulations, or the
 * equation of state in "What if?") and their deviation in %; and ρ against T per isobar with the
 * equation-of-state curve at the given parameters, residuals (model − meas.)/u underneath. Left-out points are hollow.
 */
export function DensityCharts({
  result,
  context,
  curves,
  predictions,
  predictedLabel = 'simulated',
  residualsLabel = 'of the fit (simulations)',
  height = 300,
  posteriorBand = true,
}: {
  result: LjFitResult;
  context: { molarMassGPerMol?: number; quantumCorrection: boolean };
  curves: CurveParameters[];
  predictions?: LjResidual[];
  predictedLabel?: string;
  residualsLabel?: string;
  height?: number;
  posteriorBand?: boolean;
}) {
  const rows = result.residuals.filter((r) => r.kind === 'density') as DensityResidual[];
  const draws = posteriorBand ? (result as GasFitResult).posterior?.draws : undefined;
  const { molarMassGPerMol, quantumCorrection } = context;
  // Posterior-predictive bands per isobar, when the result has posterior draws (computed once per result).
  const bands = useMemo(() => {
    const densities = result.residuals.filter((r) => r.kind === 'density');
    if (!draws?.length || !densities.length) return new Map<number, Array<{ x: number; y: number; lower: number }>>();
    const used = thinDraws(draws, DENSITY_BAND_DRAWS);
    const temps = densities.map((r) => r.temperatureK);
    const pressures = [...new Set(densities.map((r) => round(r.pressureMPa ?? 0, 3)))];
    return new Map(pressures.map((p) => [p, eosBand(p, temps, used, { molarMassGPerMol, quantumCorrection })]));
  }, [result, draws, molarMassGPerMol, quantumCorrection]);
  if (!rows.length) return null;
  const predicted = ((predictions ?? result.residuals).filter((r) => r.kind === 'density') as DensityResidual[]).map((r, i) => ({
    ...rows[i],
    ...r,
  }));
  const isotherms = [...new Set(rows.map((r) => round(r.temperatureK, 2)))].sort((a, b) => a - b);
  const isobars = [...new Set(rows.map((r) => round(r.pressureMPa ?? 0, 3)))].sort((a, b) => a - b);
  const atT = <T extends DensityResidual>(list: T[], t: number) =>
    list.filter((r) => round(r.temperatureK, 2) === t).sort((a, b) => (a.pressureMPa ?? 0) - (b.pressureMPa ?? 0));
  const atP = <T extends DensityResidual>(list: T[], p: number) =>
    list.filter((r) => round(r.pressureMPa ?? 0, 3) === p).sort((a, b) => a.temperatureK - b.temperatureK);
  const byPressure: ChartSeries[] = [
    ...isotherms.map((t) => ({
      label: `measured, ${t} K`,
      kind: 'measured' as const,
      points: atT(rows, t).map((r) => ({ x: r.pressureMPa ?? 0, y: r.measured, u: r.uncertainty, hollow: isLeftOut(r) })),
    })),
    ...isotherms.map((t) => ({
      label: `${predictedLabel}, ${t} K`,
      kind: 'simulated' as const,
      points: atT(predicted, t).map((r) => ({ x: r.pressureMPa ?? 0, y: r.predicted, u: r.modelUncertainty, hollow: isLeftOut(r) })),
    })),
  ];
  const percentSeries: ChartSeries[] = isotherms.map((t) => ({
    label: `${t} K`,
    kind: 'simulated' as const,
    points: atT(predicted, t).map((r) => ({ x: r.pressureMPa ?? 0, y: percent(r), hollow: isLeftOut(r) })),
  }));
  const temps = rows.map((r) => r.temperatureK);
  const byTemperature: ChartSeries[] = [
    ...isobars.flatMap((p, i) =>
      bands.get(p)?.length ? [{ label: 'posterior 95 % band', kind: 'band' as const, points: bands.get(p)!, inLegend: i === 0 }] : [],
    ),
    ...isobars.map((p) => ({
      label: `measured, ${p} MPa`,
      kind: 'measured' as const,
      points: atP(rows, p).map((r) => ({ x: r.temperatureK, y: r.measured, u: r.uncertainty, hollow: isLeftOut(r) })),
    })),
    ...curves.flatMap((c) =>
      isobars.map((p, i) => ({
        label: i === 0 ? `equation of state (${c.label})` : `equation of state (${c.label}), ${p} MPa`,
        kind: 'model' as const,
        points: eosIsobar(p, temps, c, context),
        inLegend: i === 0,
        endLabel: `${p} MPa`,
      })),
    ),
  ];
  const residualSeries: ChartSeries[] = isobars.map((p) => ({
    label: `${p} MPa`,
    kind: 'measured' as const,
    points: atP(predicted, p).map((r) => ({ x: r.temperatureK, y: r.residual, hollow: isLeftOut(r) })),
  }));
  const leftOut = rows.some(isLeftOut);
  return (
    <div className="grid gap-6 xl:grid-cols-2">
      <div className="min-w-0">
        <h3 className="mb-1 font-semibold">Fluid density against pressure, per isotherm</h3>
        <PropertyChart
          ariaLabel="density against pressure"
          series={byPressure}
          xTitle="P (MPa)"
          yTitle="ρ (kg/m³)"
          residuals={{ title: 'deviation (%)', series: percentSeries }}
          height={height}
        />
        <p className="mt-1 text-xs text-ink-faint">
          Lower panel: 100·({predictedLabel} − measured)/measured in %.{leftOut ? ' Open markers are points left out of the fit.' : ''}
        </p>
      </div>
      <div className="min-w-0">
        <h3 className="mb-1 font-semibold">Fluid density against temperature, per isobar</h3>
        <PropertyChart
          ariaLabel="density against temperature"
          series={byTemperature}
          xTitle="T (K)"
          yTitle="ρ (kg/m³)"
          residuals={{ title: RESIDUAL_AXIS_TITLE, series: residualSeries }}
          height={height}
        />
        <p className="mt-1 text-xs text-ink-faint">
          Curves: the LJ equation of state (Johnson, Zollweg & Gubbins 1993), one per measured pressure (named at its end), at{' '}
          {curves
            .map((c) => `${c.label} ε/k_B = ${formatSignificant(c.epsilonK, 5)} K, σ = ${formatSignificant(c.sigmaAngstrom, 5)} Å`)
            .join('; ')}
          . Lower panel: residuals {residualsLabel}, (model − measured)/u.
          {bands.size > 0 && [...bands.values()].some((b) => b.length)
            ? ' Shaded: the central 95 % of the equation-of-state density over the posterior draws (posterior-predictive band, without measurement noise).'
            : ''}
        </p>
      </div>
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
      <div className="overflow-x-auto">
        <table className="w-full max-w-3xl text-sm" aria-label="Stages of the fit">
          <thead className="border-b border-rule text-xs tracking-wide text-ink-faint">
            <tr>
              <th className="py-1.5 pr-4 text-left">Stage</th>
              <th className="px-3 text-right">ε/k_B (K)</th>
              <th className="px-3 text-right">σ (Å)</th>
              <th className="pl-3 text-right">χ²ν</th>
            </tr>
          </thead>
          <tbody>
            <tr className="border-b border-rule/60">
              <td className="py-1.5 pr-4">Equation of state (Johnson, Zollweg & Gubbins 1993), the starting point</td>
              <td className="num whitespace-nowrap px-3 text-right">{formatWithUncertainty(eos.epsilonK, eos.stdErr.epsilonK)}</td>
              <td className="num whitespace-nowrap px-3 text-right">
                {formatWithUncertainty(eos.sigmaAngstrom, eos.stdErr.sigmaAngstrom)}
              </td>
              <td className="num pl-3 text-right">{eos.reducedChi2 == null ? '—' : formatSignificant(eos.reducedChi2, 3)}</td>
            </tr>
            <tr>
              <td className="py-1.5 pr-4">
                Molecular dynamics (NPT)
                {md ? `, ${md.atoms} atoms, ${md.steps} steps, r_c = ${md.cutoff} σ, ${schemeWords(md.scheme)}` : ''} — the result
              </td>
              <td className="num whitespace-nowrap px-3 text-right text-teal">
                {formatWithUncertainty(result.epsilonK, result.stdErr.epsilonK)}
              </td>
              <td className="num whitespace-nowrap px-3 text-right text-teal">
                {formatWithUncertainty(result.sigmaAngstrom, result.stdErr.sigmaAngstrom)}
              </td>
              <td className="num pl-3 text-right">{result.reducedChi2 == null ? '—' : formatSignificant(result.reducedChi2, 3)}</td>
            </tr>
          </tbody>
        </table>
      </div>
      <p className="text-sm text-ink-soft">
        {capitalised(result.stoppingRule)}. {result.schemeNote} The simulation standard errors are added to the measurement uncertainties,
        so the parameter uncertainties include the simulation noise. {result.mdRunCount} runs, {result.mdRunsReused} of them reused from
        earlier fits or rounds.
      </p>
      {result.mdIterations && (
        <div className="overflow-x-auto">
          <table className="w-full max-w-3xl text-sm" aria-label="Simulation rounds">
            <thead className="border-b border-rule text-xs tracking-wide text-ink-faint">
              <tr>
                <th className="py-1.5 pr-3 text-left">Round</th>
                <th className="px-3 text-right">ε/k_B (K)</th>
                <th className="px-3 text-right">σ (Å)</th>
                <th className="px-3 text-right">χ²</th>
                <th className="px-3 text-right">Runs (reused)</th>
                <th className="pl-3 text-right">Step</th>
              </tr>
            </thead>
            <tbody>
              {result.mdIterations.map((it) => (
                <tr key={it.iteration} className="border-b border-rule/60">
                  <td className="py-1 pr-3">{it.iteration}</td>
                  <td className="num px-3 text-right">{it.epsilonK.toFixed(3)}</td>
                  <td className="num px-3 text-right">{it.sigmaAngstrom.toFixed(5)}</td>
                  <td className="num px-3 text-right">{formatSignificant(it.chi2, 5)}</td>
                  <td className="num px-3 text-right">
                    {it.runs} ({it.reusedRuns})
                  </td>
                  <td className="pl-3 text-right">{it.accepted ? 'kept' : 'rejected'}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      <div className="max-h-96 overflow-auto">
        <table className="w-full text-sm" aria-label="Simulations behind the fit">
          <thead className="sticky top-0 border-b border-rule bg-paper-raised text-xs tracking-wide text-ink-faint">
            <tr>
              <th className="py-1.5 pr-3 text-left">Run</th>
              <th className="px-3 text-right">Round</th>
              <th className="px-3 text-right">T (K)</th>
              <th className="px-3 text-right">P (MPa)</th>
              <th className="px-3 text-right">T*</th>
              <th className="px-3 text-right">P*</th>
              <th className="px-3 text-right">ρ*</th>
              <th className="pl-3 text-left">Phase</th>
            </tr>
          </thead>
          <tbody>
            {result.mdRuns.map((r, i) => (
              <tr key={`${r.id}-${i}`} className="border-b border-rule/50">
                <td className="whitespace-nowrap py-1 pr-3">
                  <Link className="text-copper underline" to={`/simulations/${r.id}`}>
                    Simulation {r.id}
                  </Link>
                  {r.reused && <span className="ml-2 text-xs text-ink-faint">reused</span>}
                </td>
                <td className="num px-3 text-right">{r.iteration}</td>
                <td className="num px-3 text-right">{r.temperatureK.toFixed(2)}</td>
                <td className="num px-3 text-right">{r.pressureMPa.toFixed(3)}</td>
                <td className="num px-3 text-right">{r.reducedTemperature.toFixed(4)}</td>
                <td className="num px-3 text-right">{r.reducedPressure.toFixed(4)}</td>
                <td className="num whitespace-nowrap px-3 text-right text-teal">{formatWithUncertainty(r.reducedDensity, r.stdErr)}</td>
                <td className="pl-3">{r.phase === 'fluid' ? <Badge tone="teal">fluid</Badge> : <Badge tone="changes">{r.phase}</Badge>}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
