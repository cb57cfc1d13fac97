import { convertEpsilon, convertSigma, type EnergyUnit, type LengthUnit } from '@shared/physics/parameter-units';
import { Badge } from '@/components/ui/badge';
import type { MixtureAnswer } from '../api/catalog';
import { epsilonHeader, sigmaHeader } from './unit-text';
import { formatSignificant } from '@shared/format/numbers';

/** Pure pairs from the approved sets, cross pairs from an approved pair set or else the rule, each row saying which it is. */
export function MixtureTable({ mixture, energy, length }: { mixture: MixtureAnswer; energy: EnergyUnit; length: LengthUnit }) {
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm" aria-label="Mixture pairs">
        <thead className="border-b border-rule text-xs tracking-wide text-ink-faint">
          <tr>
            <th className="py-1.5 text-left">Pair</th>
            <th className="text-left">Components</th>
            <th className="text-right normal-case">{epsilonHeader(energy)}</th>
            <th className="text-right normal-case">{sigmaHeader(length)}</th>
            <th className="pl-4 text-left">Origin</th>
          </tr>
        </thead>
        <tbody>
          {mixture.pairs.map((p) => (
            <tr key={`${p.i}-${p.j}`} className="border-b border-rule/60">
              <td className="num py-1.5">
                {p.i + 1}–{p.j + 1}
              </td>
              <td>{p.i === p.j ? p.substanceI : `${p.substanceI} + ${p.substanceJ}`}</td>
              <td className="num text-right">{formatSignificant(convertEpsilon(p.epsilonK, energy), 6)}</td>
              <td className="num text-right">{formatSignificant(convertSigma(p.sigmaAngstrom, length), 6)}</td>
              <td className="pl-4">
                {p.kind === 'pure' ? (
                  <Badge tone="approved">Approved set</Badge>
                ) : p.kind === 'fitted-pair-set' ? (
                  <span className="inline-flex flex-wrap items-baseline gap-1">
                    <Badge tone="teal">Fitted pair set #{p.pairSetId}</Badge>
                    <span className="num text-xs text-ink-faint">
                      k_ij = {p.kij?.toFixed(4)} ± {p.kijStdErr?.toFixed(4) ?? '?'}
                    </span>
                  </span>
                ) : (
                  <Badge tone="review">{mixture.ruleName} estimate</Badge>
                )}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
