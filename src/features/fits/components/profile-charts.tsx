import { Scatter } from 'react-chartjs-2';
import type { LjFitResult } from '@shared/fitting/lj-fit';
import { formatSignificant } from '@shared/format/numbers';
import { CHART_COLORS } from '@/components/charts/chart-setup';

type Curve = { values: number[]; deltaChi2: number[]; lower: number | null; upper: number | null; threshold?: number };

const PARAMETERS = [
  { key: 'epsilonK', label: 'ε/k_B', unit: 'K', digits: 5 },
  { key: 'sigmaAngstrom', label: 'σ', unit: 'Å', digits: 5 },
] as const;

const interval = (lo: number | null, hi: number | null, unit: string) =>
  `${lo === null ? 'beyond the scanned range' : formatSignificant(lo, 5)} … ${hi === null ? 'beyond the scanned range' : formatSignificant(hi, 5)} ${unit}`;

/**
 * Profile χ² of ε and σ (the other parameter re-optimised at each value): the interval where Δχ² stays below
 * its threshold (1, scaled by χ²/ν when the standard errors are) beside the linearised ±1 standard error.
 * Where the two differ, χ² is not quadratic over the interval and the profile interval is the one to quote.
 */
export function ProfileCharts({ result, height = 220 }: { result: LjFitResult; height?: number }) {
  const profiles = (result as { profiles?: Record<string, Curve | null> }).profiles;
  const held = result.heldParameters ?? [];
  const shown = PARAMETERS.filter((p) => profiles?.[p.key]);
  if (!profiles)
    return <p className="text-sm text-ink-soft">This fit was run before profile χ² curves were computed; run it again to see them.</p>;
  return (
    <div className="grid gap-5">
      <div className="overflow-x-auto">
        <table className="w-full text-sm" aria-label="Intervals of ±1 standard error">
          <thead className="border-b border-rule text-xs tracking-wide text-ink-faint">
            <tr>
              <th className="py-1.5 pr-3 text-left">Parameter</th>
              <th className="px-3 text-right">Best value</th>
              <th className="px-3 text-right">Linearised (± 1 s.e.)</th>
              <th className="pl-3 text-right">Profile (Δχ² ≤ threshold)</th>
            </tr>
          </thead>
          <tbody>
            {PARAMETERS.map((p) => {
              const curve = profiles[p.key];
              const value = result[p.key];
              const se = result.stdErr[p.key];
              return (
                <tr key={p.key} className="border-b border-rule/60">
                  <td className="py-1.5 pr-3">
                    {p.label} ({p.unit})
                  </td>
                  <td className="num whitespace-nowrap px-3 text-right">{formatSignificant(value, p.digits)}</td>
                  <td className="num whitespace-nowrap px-3 text-right">
                    {held.includes(p.key) ? 'held' : se == null ? '—' : interval(value - se, value + se, p.unit)}
                  </td>
                  <td className="num whitespace-nowrap pl-3 text-right" data-testid={`profile-interval-${p.key}`}>
                    {held.includes(p.key) ? 'held' : curve ? interval(curve.lower, curve.upper, p.unit) : 'not computed (see the warnings)'}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      {shown.length > 0 && (
        <div className={`grid gap-5 ${shown.length > 1 ? 'md:grid-cols-2' : ''}`}>
          {shown.map((p) => {
            const curve = profiles[p.key]!;
            const threshold = curve.threshold ?? 1;
            const value = result[p.key];
            const se = result.stdErr[p.key];
            const ys = curve.deltaChi2.filter(Number.isFinite);
            const top = Math.max(threshold * 1.6, ...ys);
            const vertical = (x: number) => [
              { x, y: 0 },
              { x, y: top },
            ];
            return (
              <figure key={p.key} className="min-w-0" aria-label={`Profile χ² of ${p.label}`}>
                <div
                  style={{ height }}
                  role="img"
                  aria-label={`Δχ² against ${p.label} (${p.unit}), with the threshold ${formatSignificant(threshold, 3)}`}
                >
                  <Scatter
                    data={{
                      datasets: [
                        {
                          label: 'profile Δχ²',
                          data: curve.values.map((x, i) => ({ x, y: curve.deltaChi2[i] })),
                          showLine: true,
                          borderColor: CHART_COLORS.copper,
                          backgroundColor: CHART_COLORS.copper,
                          pointRadius: 2,
                          borderWidth: 2,
                        },
                        {
                          label: `Δχ² = ${formatSignificant(threshold, 3)}`,
                          data: [
                            { x: curve.values[0], y: threshold },
                            { x: curve.values[curve.values.length - 1], y: threshold },
                          ],
                          showLine: true,
                          borderColor: CHART_COLORS.inkFaint,
                          borderDash: [4, 3],
                          pointRadius: 0,
                          borderWidth: 1,
                        },
                        ...(se != null
                          ? [
                              {
                                label: '± 1 s.e. (linearised)',
                                data: [...vertical(value - se), { x: NaN, y: NaN }, ...vertical(value + se)],
                                showLine: true,
                                borderColor: CHART_COLORS.ink,
                                borderDash: [2, 3],
                                pointRadius: 0,
                                borderWidth: 1,
                                spanGaps: false,
                              },
                            ]
                          : []),
                      ],
                    }}
                    options={{
                      responsive: true,
                      maintainAspectRatio: false,
                      animation: false,
                      plugins: {
                        legend: {
                          position: 'top',
                          align: 'end',
                          labels: { usePointStyle: true, boxWidth: 7, boxHeight: 7, font: { size: 11 } },
                        },
                      },
                      scales: {
                        x: { type: 'linear', title: { display: true, text: `${p.label} (${p.unit})`, font: { weight: 600, size: 12 } } },
                        y: { min: 0, suggestedMax: top, title: { display: true, text: 'Δχ²', font: { weight: 600, size: 12 } } },
                      },
                    }}
                  />
                </div>
              </figure>
            );
          })}
        </div>
      )}
      <p className="text-xs text-ink-faint">
        Each curve is χ² with the other parameter re-optimised, minus the minimum. Its interval is read where it crosses the dashed line
        (Δχ² = 1, times χ²/ν when the standard errors are scaled by it); the dotted lines mark the linearised ±1 standard error. Where they
        disagree, χ² is not quadratic there and the profile interval is the better statement.
      </p>
    </div>
  );
}
