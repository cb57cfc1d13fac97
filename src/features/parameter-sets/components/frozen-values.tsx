import { formatSignificant, formatWithUncertainty } from '@shared/format/numbers';
import { CUTOFF_SCHEME_LABELS } from '@shared/schemas/parameter-sets';
import type { ParameterSetSummary } from '../api/parameter-sets';

export const schemeText = (s: Pick<ParameterSetSummary, 'scheme' | 'cutoffSigma'>) => `${CUTOFF_SCHEME_LABELS[s.scheme]}${s.cutoffSigma !== null ? `, r_c = ${s.cutoffSigma} σ` : ''}`;

export const validityText = (v: ParameterSetSummary['validity']) =>
  `${formatSignificant(v.temperatureMinK, 5)}–${formatSignificant(v.temperatureMaxK, 5)} K${v.pressureMinMPa !== null && v.pressureMaxMPa !== null ? `, ${formatSignificant(v.pressureMinMPa, 4)}–${formatSignificant(v.pressureMaxMPa, 4)} MPa` : ''}`;

/** The frozen ε/k_B and σ with standard errors, and what they are meant for. */
export function FrozenValues({ set }: { set: ParameterSetSummary }) {
  return (
    <div>
      <div className="grid gap-3 sm:grid-cols-2">
        <div className="rounded-md border border-rule bg-paper px-4 py-3">
          <div className="text-xs font-semibold uppercase tracking-wider text-ink-faint">ε/k_B (K)</div>
          <div className="num text-2xl font-bold" data-testid="set-epsilon">{formatWithUncertainty(set.epsilonK, set.stdErr.epsilonK, 'K')}</div>
        </div>
        <div className="rounded-md border border-rule bg-paper px-4 py-3">
          <div className="text-xs font-semibold uppercase tracking-wider text-ink-faint">σ (Å)</div>
          <div className="num text-2xl font-bold" data-testid="set-sigma">{formatWithUncertainty(set.sigmaAngstrom, set.stdErr.sigmaAngstrom, 'Å')}</div>
        </div>
      </div>
      <dl className="mt-4 grid grid-cols-[max-content_1fr] gap-x-4 gap-y-1 text-sm">
        <dt className="text-ink-faint">Model</dt>
        <dd>Lennard-Jones 12-6</dd>
        <dt className="text-ink-faint">Cutoff scheme</dt>
        <dd>{schemeText(set)}</dd>
        <dt className="text-ink-faint">Valid for</dt>
        <dd className="num">{validityText(set.validity)}</dd>
        <dt className="text-ink-faint">Correlation ρ(ε, σ)</dt>
        <dd className="num">{set.correlation == null ? '—' : set.correlation.toFixed(3)}</dd>
        <dt className="text-ink-faint">Uncertainties</dt>
        <dd>standard errors of the fit (1σ)</dd>
      </dl>
    </div>
  );
}
