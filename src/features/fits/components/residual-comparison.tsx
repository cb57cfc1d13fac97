import type { LjFitResult } from '@shared/fitting/lj-fit';
import type { FitKind } from '@shared/fitting/property-models';
import { PROPERTY_MODELS } from '@shared/fitting/property-models';
import { formatSignificant } from '@shared/format/numbers';
import { PropertyChart, type ChartSeries } from '@/components/charts/property-chart';
import { isLeftOut, RESIDUAL_AXIS_TITLE } from './fit-curves';

interface Compared {
  label: string;
  result: LjFitResult;
}

/**
 * The residuals of two (or more) fits of the same data, per kind on one plot ((model − measured)/u against T, one
 * marker per fit), and per measurement set the points, χ² and RMS deviation of each fit.
 */
export function ResidualComparison({ fits, names }: { fits: Compared[]; names: Record<string, string> }) {
  const kinds = [...new Set(fits.flatMap((f) => f.result.residuals.map((r) => r.kind)))] as FitKind[];
  const sets = [...new Set(fits.flatMap((f) => f.result.perMeasurementSet.map((d) => String(d.measurementSetId))))];
  return (
    <div className="grid gap-6">
      <div className={`grid gap-6 ${kinds.length > 1 ? 'xl:grid-cols-2' : ''}`}>
        {kinds.map((kind) => {
          // The first fit in ink circles, the second in teal diamonds: the chart's 'measured' and 'simulated' styles.
          const series: ChartSeries[] = fits.map((f, i) => ({
            label: f.label,
            kind: i === 0 ? 'measured' : 'simulated',
            points: f.result.residuals
              .filter((r) => r.kind === kind)
              .map((r) => ({ x: r.temperatureK, y: r.residual, hollow: isLeftOut(r) })),
          }));
          return (
            <div key={kind} className="min-w-0">
              <h3 className="mb-1 font-semibold">Residuals: {PROPERTY_MODELS[kind]?.label ?? kind}</h3>
              <PropertyChart
                ariaLabel={`${kind} residuals of both fits`}
                series={series}
                xTitle={kind === 'density' ? 'T (K), all isobars' : 'T (K)'}
                yTitle={RESIDUAL_AXIS_TITLE}
                height={220}
              />
            </div>
          );
        })}
      </div>
      <div className="overflow-x-auto">
        <table className="w-full text-sm" aria-label="Residuals per measurement set">
          <thead className="border-b border-rule text-xs tracking-wide text-ink-faint">
            <tr>
              <th className="py-1.5 text-left">Measurement set</th>
              {fits.map((f) => (
                <th key={f.label} className="text-right" colSpan={3}>
                  {f.label}
                </th>
              ))}
            </tr>
            <tr>
              <th />
              {fits.map((f) =>
                ['points', 'χ²', 'RMS'].map((h) => (
                  <th key={`${f.label}-${h}`} className="pl-3 text-right font-normal">
                    {h}
                  </th>
                )),
              )}
            </tr>
          </thead>
          <tbody>
            {sets.map((id) => (
              <tr key={id} className="border-b border-rule/60">
                <td className="py-1.5">{names[id] ?? `set ${id}`}</td>
                {fits.map((f) => {
                  const d = f.result.perMeasurementSet.find((x) => String(x.measurementSetId) === id);
                  return d ? (
                    [
                      <td key="n" className="num pl-3 text-right">
                        {d.points}
                      </td>,
                      <td key="c" className="num pl-3 text-right">
                        {formatSignificant(d.chi2, 4)}
                      </td>,
                      <td key="r" className="num pl-3 text-right">
                        {formatSignificant(d.rms, 3)}
                      </td>,
                    ]
                  ) : (
                    <td key="none" colSpan={3} className="pl-3 text-right text-ink-faint">
                      not in this fit
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
        <p className="mt-1 text-xs text-ink-faint">
          RMS of predicted − measured in the set's own unit; χ² counts weight·(model − measured)/u squared over the points in the fit.
        </p>
      </div>
    </div>
  );
}
