import { Link } from 'react-router-dom';
import { formatDate } from '@shared/format/dates';
import { convertEpsilon, convertSigma, type EnergyUnit, type LengthUnit } from '@shared/physics/parameter-units';
import { Badge } from '@/components/ui/badge';
import type { ParameterCard } from '../api/catalog';
import { epsilonHeader, epsilonText, sigmaHeader, sigmaText, signedText, temperatureRangeText } from './unit-text';

/** Every published version of the substance and scheme, newest first, with the change from the one before. */
export function VersionHistory({ card, energy, length }: { card: ParameterCard; energy: EnergyUnit; length: LengthUnit }) {
  const rows = [...card.versions].reverse();
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm">
        <thead className="border-b border-rule text-xs tracking-wide text-ink-faint">
          <tr>
            <th className="py-1.5 text-left">Version</th>
            <th className="text-left">State</th>
            <th className="text-right normal-case">{epsilonHeader(energy)}</th>
            <th className="text-right normal-case">Δε</th>
            <th className="text-right normal-case">{sigmaHeader(length)}</th>
            <th className="text-right normal-case">Δσ</th>
            <th className="pl-4 text-left">Valid for</th>
            <th className="text-left">Approved</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((v) => (
            <tr
              key={v.id}
              className={`border-b border-rule/60 ${v.id === card.id ? 'bg-paper-deep/50' : ''}`}
              aria-current={v.id === card.id ? 'page' : undefined}
            >
              <td className="py-1.5">
                {v.id === card.id ? (
                  <span className="font-semibold">v{v.version} (this)</span>
                ) : (
                  <Link className="underline" to={`/catalog/${v.id}`}>
                    v{v.version}
                  </Link>
                )}
              </td>
              <td>
                <Badge tone={v.state === 'approved' ? 'approved' : 'slate'}>{v.stateLabel}</Badge>
              </td>
              <td className="num text-right">{epsilonText(v.epsilonK, v.stdErr.epsilonK, energy)}</td>
              <td className="num text-right">{v.change ? signedText(convertEpsilon(v.change.epsilonK, energy), energy) : '—'}</td>
              <td className="num text-right">{sigmaText(v.sigmaAngstrom, v.stdErr.sigmaAngstrom, length)}</td>
              <td className="num text-right">{v.change ? signedText(convertSigma(v.change.sigmaAngstrom, length), length) : '—'}</td>
              <td className="num pl-4">{temperatureRangeText(v.validity)}</td>
              <td>{v.approvedAt ? `${formatDate(v.approvedAt)}${v.approvedByName ? `, ${v.approvedByName}` : ''}` : '—'}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="mt-2 text-xs text-ink-faint">Δ is the change from the previous published version.</p>
    </div>
  );
}
