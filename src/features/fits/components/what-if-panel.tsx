import { useMemo, useState } from 'react';
import type { LjFitResult } from '@shared/fitting/lj-fit';
import { PROPERTY_MODELS, type FitKind } from '@shared/fitting/property-models';
import { formatSignificant } from '@shared/format/numbers';
import { Button } from '@/components/ui/button';
import { Input } from '@/components/ui/field';
import { FitCurves } from './fit-curves';

/**
 * Move ε and σ by hand and watch the B2 and viscosity curves follow, computed in the browser by the same
 * code the fit runs, with χ² of the trial parameters against the fitted data.
 */
export function WhatIfPanel({ result, names, context, weights }: { result: LjFitResult; names: Record<string, string>; context: { molarMassGPerMol?: number; quantumCorrection: boolean }; weights: Record<string, number> }) {
  const [eps, setEps] = useState(result.epsilonK);
  const [sigma, setSigma] = useState(result.sigmaAngstrom);
  const epsRange: [number, number] = [result.epsilonK * 0.6, result.epsilonK * 1.4];
  const sigmaRange: [number, number] = [result.sigmaAngstrom * 0.85, result.sigmaAngstrom * 1.15];
  const chi2 = useMemo(() => {
    let sum = 0;
    for (const r of result.residuals) {
      try {
        const predicted = PROPERTY_MODELS[r.kind as FitKind].evaluate({ temperatureK: r.temperatureK, pressureMPa: r.pressureMPa, measured: r.measured }, eps, sigma, context).value;
        const w = weights[String(r.datasetId)] ?? 1;
        sum += ((w * (predicted - r.measured)) / r.uncertainty) ** 2;
      } catch {
        return NaN;
      }
    }
    return sum;
  }, [eps, sigma, result, context, weights]);
  return (
    <div className="grid gap-4">
      <div className="grid gap-4 md:grid-cols-2">
        <label className="grid gap-1 text-sm">
          <span className="font-semibold">ε/k_B (K)</span>
          <div className="flex items-center gap-3">
            <input type="range" aria-label="What-if ε/k_B (K)" className="flex-1 accent-copper" min={epsRange[0]} max={epsRange[1]} step={(epsRange[1] - epsRange[0]) / 400} value={eps} onChange={(e) => setEps(Number(e.target.value))} />
            <Input aria-label="What-if ε/k_B value (K)" className="w-28 num" type="number" step="0.1" value={Number(eps.toFixed(3))} onChange={(e) => Number(e.target.value) > 0 && setEps(Number(e.target.value))} />
          </div>
        </label>
        <label className="grid gap-1 text-sm">
          <span className="font-semibold">σ (Å)</span>
          <div className="flex items-center gap-3">
            <input type="range" aria-label="What-if σ (Å)" className="flex-1 accent-copper" min={sigmaRange[0]} max={sigmaRange[1]} step={(sigmaRange[1] - sigmaRange[0]) / 400} value={sigma} onChange={(e) => setSigma(Number(e.target.value))} />
            <Input aria-label="What-if σ value (Å)" className="w-28 num" type="number" step="0.001" value={Number(sigma.toFixed(4))} onChange={(e) => Number(e.target.value) > 0 && setSigma(Number(e.target.value))} />
          </div>
        </label>
      </div>
      <div className="flex flex-wrap items-center gap-4 text-sm">
        <span className="num" data-testid="what-if-chi2">χ² at these values: <strong>{Number.isFinite(chi2) ? formatSignificant(chi2, 5) : 'outside the model range'}</strong> (fit: {formatSignificant(result.chi2, 5)})</span>
        <Button variant="quiet" onClick={() => { setEps(result.epsilonK); setSigma(result.sigmaAngstrom); }}>Back to the fit</Button>
      </div>
      <FitCurves
        result={result}
        datasetNames={names}
        context={context}
        curves={[
          { label: 'fit', epsilonK: result.epsilonK, sigmaAngstrom: result.sigmaAngstrom },
          { label: 'what-if', epsilonK: eps, sigmaAngstrom: sigma },
        ]}
        height={260}
      />
    </div>
  );
}
