import type { EnergyUnit, LengthUnit } from '@shared/physics/parameter-units';
import { CUTOFF_SCHEME_LABELS } from '@shared/physics/cutoff-schemes';
import type { ParameterCard } from '../api/catalog';
import { epsilonHeader, epsilonText, sigmaHeader, sigmaText, temperatureRangeText, bound } from './unit-text';

/** ε and σ with standard errors in the person's units, and what the set is meant for. */
export function ParameterValues({ card, energy, length }: { card: ParameterCard; energy: EnergyUnit; length: LengthUnit }) {
  const v = card.validity;
  return (
    <div>
      <div className="grid gap-3 sm:grid-cols-2">
        <div className="rounded-md border border-rule bg-paper px-4 py-3">
          <div className="text-xs font-semibold tracking-wider text-ink-faint">{epsilonHeader(energy)}</div>
          <div className="num text-2xl font-bold" data-testid="card-epsilon">
            {epsilonText(card.epsilonK, card.stdErr.epsilonK, energy)}
          </div>
        </div>
        <div className="rounded-md border border-rule bg-paper px-4 py-3">
          <div className="text-xs font-semibold tracking-wider text-ink-faint">{sigmaHeader(length)}</div>
          <div className="num text-2xl font-bold" data-testid="card-sigma">
            {sigmaText(card.sigmaAngstrom, card.stdErr.sigmaAngstrom, length)}
          </div>
        </div>
      </div>
      <dl className="mt-4 grid grid-cols-[max-content_1fr] gap-x-4 gap-y-1 text-sm">
        <dt className="text-ink-faint">Model</dt>
        <dd data-testid="card-model">
          {card.potential === 'mie'
            ? `${card.potentialLabel}, u(r) = Cε[(σ/r)^${card.repulsiveExponent} − (σ/r)⁶], C = ${((card.repulsiveExponent / (card.repulsiveExponent - 6)) * Math.pow(card.repulsiveExponent / 6, 6 / (card.repulsiveExponent - 6))).toFixed(4)}`
            : 'Lennard-Jones 12-6, u(r) = 4ε[(σ/r)¹² − (σ/r)⁶]'}
        </dd>
        <dt className="text-ink-faint">Fitted for</dt>
        <dd>
          {CUTOFF_SCHEME_LABELS[card.scheme]}
          {card.cutoffSigma !== null && (
            <span className="num">
              , r_c = {card.cutoffSigma} σ = {sigmaText(card.cutoffSigma * card.sigmaAngstrom, null, length)}
            </span>
          )}
        </dd>
        <dt className="text-ink-faint">Valid for</dt>
        <dd className="num">
          {temperatureRangeText(v)}
          {v.pressureMinMPa !== null && v.pressureMaxMPa !== null && `, ${bound(v.pressureMinMPa)}–${bound(v.pressureMaxMPa)} MPa`}
        </dd>
        <dt className="text-ink-faint">Correlation ρ(ε, σ)</dt>
        <dd className="num">{card.correlation == null ? '—' : card.correlation.toFixed(3)}</dd>
        <dt className="text-ink-faint">Uncertainties</dt>
        <dd>standard errors of the fit (1σ)</dd>
        <dt className="text-ink-faint">Molar mass</dt>
        <dd className="num">{card.molarMassGPerMol} g/mol</dd>
      </dl>
    </div>
  );
}
