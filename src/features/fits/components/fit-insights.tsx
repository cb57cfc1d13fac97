import type { GasFitResult } from '@shared/fitting/gas-fit';
import type { LjFitResult } from '@shared/fitting/lj-fit';
import { Panel } from '@/components/ui/states';

type Insights = Pick<GasFitResult, 'posterior' | 'tension' | 'nextMeasurements' | 'criterion' | 'model' | 'repulsiveExponent'>;

const fmt = (x: number, digits = 5) => Number(x.toPrecision(digits)).toString();
const PARAMS = [
  { key: 'epsilonK', label: 'ε/k_B', unit: 'K' },
  { key: 'sigmaAngstrom', label: 'σ', unit: 'Å' },
] as const;

/** What a modeller reads next to a gas-phase fit: posterior, tension between kinds, next measurements, model criterion. */
export function FitInsights({ result }: { result: LjFitResult }) {
  const r = result as LjFitResult & Insights;
  if (!r.posterior && !r.tension && !r.nextMeasurements?.length && !r.criterion) return null;
  return (
    <div className="grid gap-6 lg:grid-cols-2">
      {r.posterior && (
        <Panel title="Posterior (Bayesian)">
          <table className="w-full text-sm" aria-label="Posterior against linearised intervals">
            <thead>
              <tr className="text-left text-xs text-ink-faint">
                <th className="py-1 font-semibold">Parameter</th>
                <th className="py-1 text-right font-semibold">Median</th>
                <th className="py-1 text-right font-semibold">Posterior 95 %</th>
                <th className="py-1 text-right font-semibold">Linearised 95 %</th>
              </tr>
            </thead>
            <tbody>
              {PARAMS.map((p) => {
                const s = r.posterior![p.key];
                const lin = r.posterior!.linearised[p.key];
                return (
                  <tr key={p.key} className="border-t border-rule">
                    <td className="py-1">
                      {p.label} ({p.unit})
                    </td>
                    <td className="num py-1 text-right">{fmt(s.median, 6)}</td>
                    <td className="num py-1 text-right">
                      {fmt(s.lower95)} … {fmt(s.upper95)}
                    </td>
                    <td className="num py-1 text-right">{lin ? `${fmt(lin.lower95)} … ${fmt(lin.upper95)}` : '—'}</td>
                  </tr>
                );
              })}
            </tbody>
          </table>
          <p className="mt-2 text-xs text-ink-faint">
            {r.posterior.likelihood}; priors {r.posterior.priors}. {r.posterior.diagnostics.walkers} walkers ×{' '}
            {r.posterior.diagnostics.steps} steps after {r.posterior.diagnostics.burnIn} burn-in, seed {r.posterior.diagnostics.seed},
            acceptance {(100 * r.posterior.diagnostics.acceptanceFraction).toFixed(0)} %, R-hat{' '}
            {Object.values(r.posterior.diagnostics.rHat)
              .map((x) => (x as number).toFixed(3))
              .join(', ')}
            .
          </p>
          {r.posterior.messages.length > 0 && (
            <ul className="mt-2 list-disc pl-5 text-sm" role="note">
              {r.posterior.messages.map((m) => (
                <li key={m}>{m}</li>
              ))}
            </ul>
          )}
        </Panel>
      )}
      {r.nextMeasurements && r.nextMeasurements.length > 0 && (
        <Panel title="The next measurement to make">
          <ol className="list-decimal pl-5 text-sm" aria-label="Next measurements, best first">
            {r.nextMeasurements.map((s) => (
              <li key={`${s.kind}-${s.temperatureK}-${s.pressureMPa ?? ''}`}>{s.text}</li>
            ))}
          </ol>
          <p className="mt-2 text-xs text-ink-faint">
            Ranked by how much each would shrink the joint 95 % region (D-optimal), each assumed as uncertain as the fit's own data of its
            kind.
          </p>
        </Panel>
      )}
      {r.tension && (
        <Panel title="Each kind of data alone">
          <ul className="text-sm">
            {r.tension.regions.map((g) => (
              <li key={g.kind}>
                {g.constrainsBoth ? `${g.kind}: ε/k_B = ${fmt(g.epsilonK!)} K, σ = ${fmt(g.sigmaAngstrom!)} Å` : `${g.kind}: ${g.reason}`}
              </li>
            ))}
          </ul>
          {r.tension.messages.length > 0 ? (
            <ul className="mt-2 list-disc pl-5 text-sm text-changes" role="alert">
              {r.tension.messages.map((m) => (
                <li key={m}>{m}</li>
              ))}
            </ul>
          ) : (
            r.tension.pairs.length > 0 && (
              <p className="mt-2 text-sm">The 95 % regions of the kinds overlap: they agree within their uncertainties.</p>
            )
          )}
        </Panel>
      )}
      {r.criterion && (
        <Panel title="Model">
          <p className="text-sm">
            {r.criterion.label}: χ² = {fmt(r.criterion.chi2)}, {r.criterion.parameters} free parameters, {r.criterion.points} points; AIC ={' '}
            {fmt(r.criterion.aic)}, BIC = {fmt(r.criterion.bic)}.
          </p>
          <p className="mt-1 text-xs text-ink-faint">
            Compare a 12-6 and a Mie fit of the same data by these: the lower BIC is preferred when it is lower by more than 2.
          </p>
        </Panel>
      )}
    </div>
  );
}
