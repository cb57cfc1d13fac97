import { useMemo, useState } from 'react';
import type { LjFitResult, LjResidual } from '@shared/fitting/lj-fit';
import { PROPERTY_MODELS, type FitKind } from '@shared/fitting/property-models';
import { formatSignificant } from '@shared/format/numbers';
import { Button } from '@/components/ui/button';
import { Input } from '@/components/ui/field';
import { DensityCharts } from './density-panel';
import { FitCurves } from './fit-curves';

type Context = { molarMassGPerMol?: number; quantumCorrection: boolean };

/**
 * Residuals and χ² of the fitted data at trial parameters, computed in the browser by the same models the
 * fit uses. Densities use the LJ equation of state: a fit's simulations cannot run here. Left-out points
 * are predicted but never counted. Null where a model cannot be evaluated (outside its range).
 */
function trialResiduals(
  result: LjFitResult,
  epsilonK: number,
  sigmaAngstrom: number,
  context: Context,
  weights: Record<string, number>,
): { residuals: LjResidual[]; chi2: number } | null {
  const residuals: LjResidual[] = [];
  let chi2 = 0;
  try {
    for (const r of result.residuals) {
      const predicted = PROPERTY_MODELS[r.kind as FitKind].evaluate(
        { temperatureK: r.temperatureK, pressureMPa: r.pressureMPa, measured: r.measured },
        epsilonK,
        sigmaAngstrom,
        context,
      ).value;
      if (!Number.isFinite(predicted)) return null;
      const w = weights[String(r.measurementSetId)] ?? 1;
      const residual = (w * (predicted - r.measured)) / r.uncertainty;
      const leftOut = r.excluded === true;
      if (!leftOut) chi2 += residual ** 2;
      residuals.push({
        ...r,
        predicted,
        residual,
        relativeDeviationPercent: r.measured !== 0 ? (100 * (predicted - r.measured)) / r.measured : null,
        excluded: leftOut,
        ...({ included: !leftOut, modelUncertainty: 0 } as object),
      });
    }
  } catch {
    return null;
  }
  return { residuals, chi2 };
}

/**
 * Move ε and σ by hand and watch every plot follow — model curves and the residual panels — with χ² of the
 * trial parameters against the fitted data. For a fit with densities it says plainly that the densities here
 * come from the equation of state, and compares with the same calculation at the fitted values.
 */
export function WhatIfPanel({
  result,
  names,
  context,
  weights,
}: {
  result: LjFitResult;
  names: Record<string, string>;
  context: Context;
  weights: Record<string, number>;
}) {
  const [eps, setEps] = useState(result.epsilonK);
  const [sigma, setSigma] = useState(result.sigmaAngstrom);
  const epsRange: [number, number] = [result.epsilonK * 0.6, result.epsilonK * 1.4];
  const sigmaRange: [number, number] = [result.sigmaAngstrom * 0.85, result.sigmaAngstrom * 1.15];
  const hasDensity = result.residuals.some((r) => r.kind === 'density');
  const trial = useMemo(() => trialResiduals(result, eps, sigma, context, weights), [eps, sigma, result, context, weights]);
  const atFit = useMemo(
    () => (hasDensity ? trialResiduals(result, result.epsilonK, result.sigmaAngstrom, context, weights) : null),
    [hasDensity, result, context, weights],
  );
  const chi2Text = trial ? formatSignificant(trial.chi2, 5) : 'outside the model range';
  const moved = eps !== result.epsilonK || sigma !== result.sigmaAngstrom;
  return (
    <div className="grid gap-4">
      <div className="grid gap-4 md:grid-cols-2">
        <label className="grid gap-1 text-sm">
          <span className="font-semibold">ε/k_B (K)</span>
          <div className="flex items-center gap-3">
            <input
              type="range"
              aria-label="What-if ε/k_B (K)"
              className="min-w-0 flex-1 accent-copper"
              min={epsRange[0]}
              max={epsRange[1]}
              step={(epsRange[1] - epsRange[0]) / 400}
              value={eps}
              onChange={(e) => setEps(Number(e.target.value))}
            />
            <Input
              aria-label="What-if ε/k_B value (K)"
              className="num !w-28 shrink-0"
              type="number"
              step="0.1"
              value={Number(eps.toFixed(3))}
              onChange={(e) => Number(e.target.value) > 0 && setEps(Number(e.target.value))}
            />
          </div>
        </label>
        <label className="grid gap-1 text-sm">
          <span className="font-semibold">σ (Å)</span>
          <div className="flex items-center gap-3">
            <input
              type="range"
              aria-label="What-if σ (Å)"
              className="min-w-0 flex-1 accent-copper"
              min={sigmaRange[0]}
              max={sigmaRange[1]}
              step={(sigmaRange[1] - sigmaRange[0]) / 400}
              value={sigma}
              onChange={(e) => setSigma(Number(e.target.value))}
            />
            <Input
              aria-label="What-if σ value (Å)"
              className="num !w-28 shrink-0"
              type="number"
              step="0.001"
              value={Number(sigma.toFixed(4))}
              onChange={(e) => Number(e.target.value) > 0 && setSigma(Number(e.target.value))}
            />
          </div>
        </label>
      </div>
      <div className="grid gap-2 text-sm">
        {hasDensity ? (
          <>
            <p className="rounded-md bg-paper-deep px-3 py-2 text-ink-soft">
              The fit computed its densities by molecular dynamics, which cannot run in the browser. Here densities come from the LJ
              equation of state (Johnson, Zollweg & Gubbins 1993) and the gas-phase properties from their usual models, so this χ² is an
              approximation to compare with itself, not with the fit’s.
            </p>
            <p className="num" data-testid="what-if-chi2">
              χ² with equation-of-state densities at these values: <strong>{chi2Text}</strong>; the same calculation at the fitted values:{' '}
              {atFit ? formatSignificant(atFit.chi2, 5) : 'outside the model range'}. (The fit’s own χ², with simulated densities:{' '}
              {formatSignificant(result.chi2, 5)}.)
            </p>
          </>
        ) : (
          <p className="num" data-testid="what-if-chi2">
            χ² at these values: <strong>{chi2Text}</strong> (fit: {formatSignificant(result.chi2, 5)})
          </p>
        )}
        <div>
          <Button
            variant="quiet"
            onClick={() => {
              setEps(result.epsilonK);
              setSigma(result.sigmaAngstrom);
            }}
            disabled={!moved}
          >
            Back to the fit
          </Button>
        </div>
      </div>
      <FitCurves
        result={result}
        posteriorBand={false}
        measurementSetNames={names}
        context={context}
        curves={[
          { label: 'fit', epsilonK: result.epsilonK, sigmaAngstrom: result.sigmaAngstrom },
          { label: 'what-if', epsilonK: eps, sigmaAngstrom: sigma },
        ]}
        residuals={trial?.residuals ?? []}
        residualsLabel="at the what-if values"
        height={260}
      />
      {hasDensity && trial && (
        <DensityCharts
          result={result}
          posteriorBand={false}
          context={context}
          curves={[{ label: 'what-if', epsilonK: eps, sigmaAngstrom: sigma }]}
          predictions={trial.residuals}
          predictedLabel="equation of state"
          residualsLabel="at the what-if values (equation-of-state densities)"
          height={260}
        />
      )}
    </div>
  );
}
