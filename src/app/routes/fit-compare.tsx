import { Link, useSearchParams } from 'react-router-dom';
import { useQueries } from '@tanstack/react-query';
import { formatSignificant, formatWithUncertainty } from '@shared/format/numbers';
import type { LjFitResult } from '@shared/fitting/lj-fit';
import type { GasFitResult } from '@shared/fitting/gas-fit';
import { compareModels, informationCriteria, type RepulsiveExponentProfile } from '@shared/fitting/mie-fit';
import { ErrorState, LoadingState, PageHeader, Panel } from '@/components/ui/states';
import { fitQueryOptions, type Fit } from '@/features/fits/api/fits';
import { FitCurves } from '@/features/fits/components/fit-curves';
import { ResidualComparison } from '@/features/fits/components/residual-comparison';

/** AIC/BIC of a fit: from its result, or from χ² and its points for results stored before the criterion existed. */
function criterionOf(r: LjFitResult, label = '') {
  const c = (r as GasFitResult).criterion;
  return c
    ? { ...c, label: label || c.label }
    : informationCriteria(
        label,
        r.chi2,
        r.perMeasurementSet.reduce((s, d) => s + d.points, 0),
        2 - r.heldParameters.length,
      );
}

/** λr of a fit: 12 for LJ 12-6, held, or fitted with its profile interval. */
function repulsiveExponentText(r: LjFitResult) {
  if (r.model !== 'mie' || r.repulsiveExponent === undefined) return '12 (LJ 12-6)';
  const profile = (r as LjFitResult & { repulsiveExponentProfile?: RepulsiveExponentProfile }).repulsiveExponentProfile;
  const value = String(Number(r.repulsiveExponent.toFixed(2)));
  if (!profile) return `${value} (held)`;
  const ends =
    profile.lower95 !== null && profile.upper95 !== null
      ? `, 95 %: ${formatSignificant(profile.lower95, 3)}–${formatSignificant(profile.upper95, 3)}`
      : ', interval reaches 8 or 36';
  return `${value} (fitted${ends})`;
}

/** A parameter's posterior median and central 95 % interval, or a dash for a fit without a posterior. */
function posteriorText(r: LjFitResult, p: 'epsilonK' | 'sigmaAngstrom', unit: string) {
  const s = (r as GasFitResult).posterior?.[p];
  return s ? `${formatSignificant(s.median, 5)} (${formatSignificant(s.lower95, 5)}–${formatSignificant(s.upper95, 5)}) ${unit}` : '—';
}

/** Two fits of one substance side by side: parameters, statistics, and both model curves over the data. */
export function FitCompareRoute() {
  const [params] = useSearchParams();
  const ids = [Number(params.get('a')), Number(params.get('b'))];
  const [a, b] = useQueries({ queries: ids.map((id) => fitQueryOptions(id)) });
  if (a.isPending || b.isPending) return <LoadingState />;
  if (a.isError || b.isError) return <ErrorState error={a.error ?? b.error} />;
  const fits = [a.data, b.data] as Fit[];
  if (fits[0].substanceId !== fits[1].substanceId)
    return <ErrorState error={new Error('Only fits of the same substance can be compared.')} />;
  if (!fits.every((f) => f.result?.status === 'succeeded'))
    return <ErrorState error={new Error('Both fits must have succeeded to be compared.')} />;
  const results = fits.map((f) => f.result!) as [LjFitResult, LjFitResult];
  const rows: Array<[string, (r: LjFitResult) => string]> = [
    ['ε/k_B', (r) => formatWithUncertainty(r.epsilonK, r.stdErr.epsilonK, 'K')],
    ['σ', (r) => formatWithUncertainty(r.sigmaAngstrom, r.stdErr.sigmaAngstrom, 'Å')],
    ['Correlation', (r) => (r.correlation == null ? '—' : r.correlation.toFixed(3))],
    ['χ² / dof', (r) => `${formatSignificant(r.chi2, 4)} / ${r.dof}`],
    ['Reduced χ²', (r) => (r.reducedChi2 == null ? '—' : formatSignificant(r.reducedChi2, 4))],
    [
      'Model',
      (r) =>
        r.model === 'mie' && r.repulsiveExponent !== undefined
          ? `Mie ${Number(r.repulsiveExponent.toFixed(2))}-6${(r as GasFitResult).criterion?.parameters === 3 ? ' (λr fitted)' : ''}`
          : 'LJ 12-6',
    ],
    ['λr', repulsiveExponentText],
    ['Free parameters', (r) => String(criterionOf(r).parameters)],
    ...(results.some((r) => (r as GasFitResult).posterior)
      ? ([
          ['ε/k_B, posterior 95 %', (r) => posteriorText(r, 'epsilonK', 'K')],
          ['σ, posterior 95 %', (r) => posteriorText(r, 'sigmaAngstrom', 'Å')],
        ] as Array<[string, (r: LjFitResult) => string]>)
      : []),
    ['AIC', (r) => formatSignificant(criterionOf(r).aic, 5)],
    ['BIC', (r) => formatSignificant(criterionOf(r).bic, 5)],
    ['Warnings', (r) => String(r.warnings.length + r.hitBounds.length)],
  ];
  const sameData =
    JSON.stringify(fits[0].measurementSets.map((d) => [d.measurementSetId, d.version, d.excludeRows])) ===
    JSON.stringify(fits[1].measurementSets.map((d) => [d.measurementSetId, d.version, d.excludeRows]));
  const verdict = compareModels(criterionOf(results[0], `Fit #${fits[0].number}`), criterionOf(results[1], `Fit #${fits[1].number}`));
  // The union of both fits' data, with the residuals of the first, carries every measured point.
  const names = Object.fromEntries(
    fits.flatMap((f) => f.measurementSets.map((d) => [String(d.measurementSetId), `${d.name} v${d.version}`])),
  );
  const merged: LjFitResult = {
    ...results[0],
    residuals: [
      ...results[0].residuals,
      ...results[1].residuals.filter((r) => !results[0].residuals.some((q) => q.measurementSetId === r.measurementSetId)),
    ],
  };
  return (
    <>
      <PageHeader
        eyebrow={
          <Link to={`/substances/${fits[0].substanceId}/fits`} className="hover:underline">
            {fits[0].substanceName} · fits
          </Link>
        }
        title={`Fit #${fits[0].number} and Fit #${fits[1].number}`}
      />
      <div className="grid gap-6">
        <Panel title="Side by side">
          <div className="overflow-x-auto">
            <table className="w-full text-xs sm:text-sm" aria-label="Fits side by side">
              <thead className="border-b border-rule text-xs tracking-wide text-ink-faint">
                <tr>
                  <th className="py-1.5 text-left" />
                  {fits.map((f) => (
                    <th key={f.id} className="text-right">
                      <Link to={`/fits/${f.id}`} className="underline">
                        Fit #{f.number}
                      </Link>
                    </th>
                  ))}
                </tr>
              </thead>
              <tbody>
                {rows.map(([label, fn]) => (
                  <tr key={label} className="border-b border-rule/60">
                    <td className="py-1.5 text-ink-faint">{label}</td>
                    {results.map((r, i) => (
                      <td key={i} className="num text-right">
                        {fn(r)}
                      </td>
                    ))}
                  </tr>
                ))}
                <tr>
                  <td className="py-1.5 text-ink-faint">Data</td>
                  {fits.map((f) => (
                    <td key={f.id} className="text-right text-xs">
                      {f.measurementSets.map((d) => `${d.name} v${d.version}`).join(', ')}
                    </td>
                  ))}
                </tr>
              </tbody>
            </table>
          </div>
          <p className="mt-2 text-sm" role="note">
            {sameData ? verdict.text : 'The two fits use different data, so their AIC and BIC cannot be compared.'}
          </p>
        </Panel>
        <Panel title="Both models over the data">
          <FitCurves
            result={merged}
            measurementSetNames={names}
            context={{ molarMassGPerMol: fits[0].options.molarMassGPerMol, quantumCorrection: !!fits[0].options.quantumCorrection }}
            curves={fits.map((f) => ({
              label: `Fit #${f.number}`,
              epsilonK: f.result!.epsilonK,
              sigmaAngstrom: f.result!.sigmaAngstrom,
              repulsiveExponent: f.result!.repulsiveExponent,
            }))}
            posteriorBand={false}
          />
          <p className="mt-2 text-xs text-ink-faint">
            Residuals underneath are those of Fit #{fits[0].number}
            {fits[0].options.quantumCorrection !== fits[1].options.quantumCorrection
              ? '; the two fits differ in the quantum correction, and both curves are drawn with the first fit’s setting'
              : ''}
            .
          </p>
        </Panel>
        <Panel title="Residuals of both fits" className="min-w-0">
          <ResidualComparison fits={fits.map((f, i) => ({ label: `Fit #${f.number}`, result: results[i] }))} names={names} />
        </Panel>
      </div>
    </>
  );
}
