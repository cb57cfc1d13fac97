import type { LjFitResult } from '@shared/fitting/lj-fit';
import { formatSignificant, formatWithUncertainty } from '@shared/format/numbers';
import { convertEpsilon, convertSigma, type EnergyUnit, type LengthUnit } from '@shared/physics/parameter-units';

const energySymbol = (u: EnergyUnit) => (u === 'K' ? 'ε/k_B' : 'ε');

/** ε and σ with standard errors in the chosen units, then the statistics of the fit. */
export function ParameterTable({ result, energy, length }: { result: LjFitResult; energy: EnergyUnit; length: LengthUnit }) {
  const eps = convertEpsilon(result.epsilonK, energy);
  const epsErr = result.stdErr.epsilonK == null ? null : convertEpsilon(result.stdErr.epsilonK, energy);
  const sig = convertSigma(result.sigmaAngstrom, length);
  const sigErr = result.stdErr.sigmaAngstrom == null ? null : convertSigma(result.stdErr.sigmaAngstrom, length);
  const held = result.heldParameters ?? [];
  const notConverged = result.converged === false || result.status === 'failed';
  const rows: Array<[string, string]> = [
    ...(held.length
      ? [
          [
            'Held',
            `${held.map((h) => (h === 'epsilonK' ? 'ε/k_B' : 'σ')).join(' and ')} at the given value: exact, no standard error, one degree of freedom fewer`,
          ] as [string, string],
        ]
      : []),
    [
      'Correlation ρ(ε, σ)',
      result.correlation == null
        ? '—'
        : `${result.correlation.toFixed(3)}${result.strongCorrelation ? ' — strong: the data fix a combination of ε and σ (see the warning)' : ''}`,
    ],
    ['χ²', formatSignificant(result.chi2, 5)],
    ['Degrees of freedom', String(result.dof)],
    ['Reduced χ²', result.reducedChi2 == null ? '—' : formatSignificant(result.reducedChi2, 4)],
    ['Standard errors', result.covarianceScaling === 'reduced-chi2' ? 'from (JᵀWJ)⁻¹ scaled by the reduced χ²' : 'from (JᵀWJ)⁻¹, unscaled'],
    [
      'Iterations',
      `${result.iterations} (${result.convergence === 'parameter-change' ? 'converged: parameter change below tolerance' : result.convergence === 'max-iterations' ? 'stopped at the iteration limit' : 'failed'})`,
    ],
    [
      'Start',
      `ε/k_B = ${formatSignificant(result.start.epsilonK, 5)} K, σ = ${formatSignificant(result.start.sigmaAngstrom, 5)} Å (${result.start.method})`,
    ],
    ['Bounds', `ε/k_B ∈ [${result.bounds.epsilonK.join(', ')}] K, σ ∈ [${result.bounds.sigmaAngstrom.join(', ')}] Å`],
    ['Restarts tried', String(result.restartsTried)],
    ['Quantum correction', result.quantumCorrection ? 'first-order Wigner–Kirkwood term included in B2' : 'none (classical B2)'],
  ];
  return (
    <div>
      {notConverged && (
        <p
          role="status"
          className="mb-3 rounded-md bg-changes-soft px-3 py-2 text-sm font-semibold text-changes"
          data-testid="not-converged"
        >
          Not converged: the last iterate of a failed fit, shown for diagnosis only. It is not an estimate.
        </p>
      )}
      <div className="grid gap-3 sm:grid-cols-2">
        <div className="rounded-md border border-rule bg-paper px-4 py-3">
          <div className="text-xs font-semibold tracking-wider text-ink-faint">
            {energySymbol(energy)} ({energy})
          </div>
          <div className="num text-2xl font-bold" data-testid="epsilon-value">
            {formatWithUncertainty(eps, epsErr, energy)}
          </div>
          {held.includes('epsilonK') && <div className="text-xs font-semibold text-copper">held at this value</div>}
        </div>
        <div className="rounded-md border border-rule bg-paper px-4 py-3">
          <div className="text-xs font-semibold tracking-wider text-ink-faint">σ ({length})</div>
          <div className="num text-2xl font-bold" data-testid="sigma-value">
            {formatWithUncertainty(sig, sigErr, length)}
          </div>
          {held.includes('sigmaAngstrom') && <div className="text-xs font-semibold text-copper">held at this value</div>}
        </div>
      </div>
      <dl className="mt-4 grid grid-cols-[max-content_1fr] gap-x-4 gap-y-1 text-sm">
        {rows.map(([k, v]) => (
          <div key={k} className="contents">
            <dt className="text-ink-faint">{k}</dt>
            <dd className="num">{v}</dd>
          </div>
        ))}
      </dl>
    </div>
  );
}

const KIND_UNIT: Record<string, string> = { b2: 'cm³/mol', viscosity: 'µPa·s', density: 'kg/m³' };

export function MeasurementSetStatsTable({ result, names }: { result: LjFitResult; names: Record<string, string> }) {
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm">
        <thead className="border-b border-rule text-xs tracking-wide text-ink-faint">
          <tr>
            <th className="py-1.5 pr-3 text-left">Set</th>
            <th className="px-3 text-right">Points</th>
            <th className="px-3 text-right">RMS deviation</th>
            <th className="px-3 text-right">AAD (%)</th>
            <th className="pl-3 text-right">χ²</th>
          </tr>
        </thead>
        <tbody>
          {result.perMeasurementSet.map((d) => (
            <tr key={String(d.measurementSetId)} className="border-b border-rule/60">
              <td className="py-1.5 pr-3">{names[String(d.measurementSetId)] ?? d.measurementSetId}</td>
              <td className="num px-3 text-right">
                {d.points}
                {d.excludedPoints ? <span className="text-ink-faint"> (+{d.excludedPoints} left out)</span> : null}
              </td>
              <td className="num whitespace-nowrap px-3 text-right">
                {formatSignificant(d.rms, 3)} {KIND_UNIT[d.kind] ?? ''}
              </td>
              <td className="num px-3 text-right">{d.aadPercent == null ? '—' : d.aadPercent.toFixed(2)}</td>
              <td className="num pl-3 text-right">{formatSignificant(d.chi2, 4)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
