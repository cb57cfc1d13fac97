import type { LjResidual } from '@shared/fitting/lj-fit';
import type { PropertyContext } from '@shared/fitting/property-models';
import { formatSignificant, formatWithUncertainty } from '@shared/format/numbers';
import { measurementSetDeviations } from '@shared/parameter-sets/compare';
import type { ParameterSetSummary } from '../api/parameter-sets';

const UNIT: Record<string, string> = { b2: 'cm³/mol', viscosity: 'µPa·s', density: 'kg/m³' };

/** The change in units of the combined standard error, when both sets carry one. */
function inSigmas(delta: number, a: number | null, b: number | null): string {
  if (a == null || b == null) return '';
  const combined = Math.hypot(a, b);
  return combined > 0 ? `, ${signed(delta / combined, 2)} u` : '';
}

const signed = (x: number, digits: number) => `${x >= 0 ? '+' : '−'}${formatSignificant(Math.abs(x), digits)}`;

/**
 * This set against the approved version of the same substance and scheme: parameters side by side with
 * the change, and both parameter pairs measured against this set's fitted data, per measurement set.
 */
export function ApprovedComparison({
  set,
  approved,
  points,
  context,
  measurementSetNames,
}: {
  set: ParameterSetSummary;
  approved: ParameterSetSummary;
  points: LjResidual[];
  context: PropertyContext;
  measurementSetNames: Record<string, string>;
}) {
  const rows = [
    { label: 'ε/k_B', unit: 'K', a: approved.epsilonK, ua: approved.stdErr.epsilonK, b: set.epsilonK, ub: set.stdErr.epsilonK },
    {
      label: 'σ',
      unit: 'Å',
      a: approved.sigmaAngstrom,
      ua: approved.stdErr.sigmaAngstrom,
      b: set.sigmaAngstrom,
      ub: set.stdErr.sigmaAngstrom,
    },
  ];
  const mine = measurementSetDeviations(points, set.epsilonK, set.sigmaAngstrom, context);
  const theirs = measurementSetDeviations(points, approved.epsilonK, approved.sigmaAngstrom, context);
  return (
    <div className="grid gap-5">
      <table className="w-full text-sm" aria-label="Parameters against the approved version">
        <thead className="border-b border-rule text-xs tracking-wide text-ink-faint">
          <tr>
            <th className="py-1.5 text-left" />
            <th className="text-right">Approved v{approved.version}</th>
            <th className="text-right">This set v{set.version}</th>
            <th className="text-right">Change</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => {
            const delta = r.b - r.a;
            return (
              <tr key={r.label} className="border-b border-rule/60">
                <td className="py-1.5 text-ink-faint">{r.label}</td>
                <td className="num text-right">{formatWithUncertainty(r.a, r.ua, r.unit)}</td>
                <td className="num text-right">{formatWithUncertainty(r.b, r.ub, r.unit)}</td>
                <td className="num text-right">
                  {signed(delta, 3)} {r.unit} ({signed((100 * delta) / r.a, 2)} %{inSigmas(delta, r.ua, r.ub)})
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
      <div>
        <h3 className="mb-1 font-semibold">Deviations on this set’s data</h3>
        <table className="w-full text-sm" aria-label="Deviations per measurement set">
          <thead className="border-b border-rule text-xs tracking-wide text-ink-faint">
            <tr>
              <th className="py-1.5 text-left">Set</th>
              <th className="text-right">Points</th>
              <th className="text-right">RMS, approved</th>
              <th className="text-right">RMS, this set</th>
              <th className="text-right">AAD %, approved</th>
              <th className="text-right">AAD %, this set</th>
            </tr>
          </thead>
          <tbody>
            {mine.map((d, i) => {
              const o = theirs[i];
              const unit = UNIT[d.kind];
              return (
                <tr key={String(d.measurementSetId)} className="border-b border-rule/60">
                  <td className="py-1.5">{measurementSetNames[String(d.measurementSetId)] ?? d.measurementSetId}</td>
                  <td className="num text-right">{d.points}</td>
                  <td className="num text-right">{Number.isNaN(o.rms) ? '—' : `${formatSignificant(o.rms, 3)} ${unit}`}</td>
                  <td className="num text-right">{Number.isNaN(d.rms) ? '—' : `${formatSignificant(d.rms, 3)} ${unit}`}</td>
                  <td className="num text-right">{o.aadPercent == null ? '—' : o.aadPercent.toFixed(2)}</td>
                  <td className="num text-right">{d.aadPercent == null ? '—' : d.aadPercent.toFixed(2)}</td>
                </tr>
              );
            })}
          </tbody>
        </table>
        <p className="mt-1 text-xs text-ink-faint">
          Both parameter pairs evaluated with the same model and settings on the points this set was fitted to. The change in u is the
          difference over the combined standard error √(u₁² + u₂²).
        </p>
      </div>
    </div>
  );
}
