import { formatWithUncertainty } from '@shared/format/numbers';
import { CUTOFF_SCHEME_LABELS } from '@shared/physics/cutoff-schemes';
import type { ParameterSetSummary } from '../api/parameter-sets';

export const schemeText = (s: Pick<ParameterSetSummary, 'scheme' | 'cutoffSigma'>) =>
  `${CUTOFF_SCHEME_LABELS[s.scheme]}${s.cutoffSigma !== null ? `, r_c = ${s.cutoffSigma} σ` : ''}`;

/** A bound as typed or as the data gave it, without trailing zeros (170 K, 297.15 K). */
const bound = (x: number) => String(Number(x.toPrecision(6)));

export const validityText = (v: ParameterSetSummary['validity']) =>
  `${bound(v.temperatureMinK)}–${bound(v.temperatureMaxK)} K${v.pressureMinMPa !== null && v.pressureMaxMPa !== null ? `, ${bound(v.pressureMinMPa)}–${bound(v.pressureMaxMPa)} MPa` : ''}`;

/** The frozen ε/k_B and σ with standard errors, and what they are meant for. */
export function FrozenValues({ set }: { set: ParameterSetSummary }) {
  return (
    <div>
      <div className="grid gap-3 sm:grid-cols-2">
        <div className="rounded-md border border-rule bg-paper px-4 py-3">
          <div className="text-xs font-semibold tracking-wider text-ink-faint">ε/k_B (K)</div>
          <div className="num text-2xl font-bold" data-testid="set-epsilon">
            {formatWithUncertainty(set.epsilonK, set.stdErr.epsilonK, 'K')}
          </div>
        </div>
        <div className="rounded-md border border-rule bg-paper px-4 py-3">
          <div className="text-xs font-semibold tracking-wider text-ink-faint">σ (Å)</div>
          <div className="num text-2xl font-bold" data-testid="set-sigma">
            {formatWithUncertainty(set.sigmaAngstrom, set.stdErr.sigmaAngstrom, 'Å')}
          </div>
        </div>
      </div>
      <dl className="mt-4 grid grid-cols-[max-content_1fr] gap-x-4 gap-y-1 text-sm">
        <dt className="text-ink-faint">Model</dt>
        <dd data-testid="set-potential">
          {set.potential === 'mie' ? `${set.potentialLabel}: u = C ε[(σ/r)^${set.repulsiveExponent} − (σ/r)^6]` : 'Lennard-Jones 12-6'}
        </dd>
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
