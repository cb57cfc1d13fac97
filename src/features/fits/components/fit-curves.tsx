import { useMemo } from 'react';
import type { GasFitResult } from '@shared/fitting/gas-fit';
import type { LjFitResult, LjResidual } from '@shared/fitting/lj-fit';
import type { FitKind } from '@shared/fitting/property-models';
import { PROPERTY_KINDS, type PropertyKind } from '@shared/measurements/property-kinds';
import { PropertyChart, type ChartSeries } from '@/components/charts/property-chart';
import { valueAxisTitle } from '@/lib/quantity-labels';
import { modelBand, modelCurve, thinDraws } from './model-curves';

export interface CurveParameters {
  label: string;
  epsilonK: number;
  sigmaAngstrom: number;
  /** λr of a Mie λr-6 curve (absent or 12: LJ 12-6). */
  repulsiveExponent?: number;
}

/** The residual axis: what is plotted, in the order it is computed. */
export const RESIDUAL_AXIS_TITLE = '(model − meas.)/u';

/** A residual was left out of the fit, by the modeller or by the simulation stage (hollow marker). */
export const isLeftOut = (r: LjResidual) => r.excluded === true || (r as { included?: boolean }).included === false;

/**
 * One chart per gas-phase property kind: measured points with ±u, the model curve of each parameter pair,
 * and the residuals (model − measured)/u underneath — of the fit, or of `residuals` when given (What if?).
 * Points left out of the fit are drawn hollow.
 */
export function FitCurves({
  result,
  measurementSetNames,
  context,
  curves,
  height = 300,
  residuals,
  residualsLabel,
  posteriorBand = true,
}: {
  result: LjFitResult;
  measurementSetNames: Record<string, string>;
  context: { molarMassGPerMol?: number; quantumCorrection: boolean; repulsiveExponent?: number };
  curves: CurveParameters[];
  height?: number;
  residuals?: LjResidual[];
  residualsLabel?: string;
  posteriorBand?: boolean;
}) {
  // Densities are state functions of T and P: they get their own panels (density-panel.tsx).
  const kinds = [...new Set(result.residuals.map((r) => r.kind))].filter((k) => k !== 'density') as FitKind[];
  const bands = usePosteriorBands(posteriorBand ? result : null, kinds, context);
  if (!kinds.length) return null;
  const plotted = residuals ?? result.residuals;
  return (
    <div className={`grid gap-6 ${kinds.length > 1 ? 'xl:grid-cols-2' : ''}`}>
      {kinds.map((kind) => {
        const points = result.residuals.filter((r) => r.kind === kind);
        const byMeasurementSet = [...new Set(points.map((p) => String(p.measurementSetId)))];
        const measured: ChartSeries[] = byMeasurementSet.map((id) => ({
          label: measurementSetNames[id] ?? `set ${id}`,
          kind: 'measured',
          points: points
            .filter((p) => String(p.measurementSetId) === id)
            .map((p) => ({ x: p.temperatureK, y: p.measured, u: p.uncertainty, hollow: isLeftOut(p) })),
        }));
        const temps = points.map((p) => p.temperatureK);
        const model: ChartSeries[] = curves.map((c) => ({
          label: c.label,
          kind: 'model',
          points: modelCurve(
            kind,
            temps,
            c.epsilonK,
            c.sigmaAngstrom,
            c.repulsiveExponent !== undefined && c.repulsiveExponent !== 12
              ? ({ ...context, repulsiveExponent: c.repulsiveExponent } as typeof context)
              : context,
          ),
        }));
        const residualSeries: ChartSeries[] = byMeasurementSet.map((id) => ({
          label: measurementSetNames[id] ?? `set ${id}`,
          kind: 'measured',
          points: plotted
            .filter((p) => p.kind === kind && String(p.measurementSetId) === id)
            .map((p) => ({ x: p.temperatureK, y: p.residual, hollow: isLeftOut(p) })),
        }));
        return (
          <div key={kind} className="min-w-0">
            <h3 className="mb-1 font-semibold">
              {kind === 'b2'
                ? 'Second virial coefficient'
                : kind === 'viscosity'
                  ? 'Dilute-gas viscosity'
                  : (PROPERTY_KINDS[kind as PropertyKind]?.label ?? kind)}
            </h3>
            <PropertyChart
              ariaLabel={`${kind} data and model`}
              series={[
                ...(bands[kind]?.length ? [{ label: 'posterior 95 % band', kind: 'band' as const, points: bands[kind]! }] : []),
                ...measured,
                ...model,
              ]}
              xTitle="T (K)"
              yTitle={valueAxisTitle(kind)}
              residuals={{ title: RESIDUAL_AXIS_TITLE, series: residualSeries }}
              height={height}
            />
            <p className="mt-1 text-xs text-ink-faint">
              {bands[kind]?.length ? `${bandSentence(bands[kind]!, valueAxisTitle(kind))} ` : ''}
              Lower panel: residuals {residualsLabel ?? 'of the fit'}, (model − measured) divided by the measurement’s standard uncertainty
              u{points.some(isLeftOut) ? '; open markers are points left out of the fit' : ''}.
            </p>
          </div>
        );
      })}
    </div>
  );
}

/**
 * The band in words, with its widest point: a band narrower than the curve's line cannot be seen, so its width is
 * said as well as drawn.
 */
export function bandSentence(band: Array<{ x: number; y: number; lower: number }>, axisTitle: string) {
  const widest = band.reduce((w, p) => (p.y - p.lower > w.y - w.lower ? p : w), band[0]);
  const unit = /\(([^)]+)\)\s*$/.exec(axisTitle)?.[1] ?? '';
  const width = Number((widest.y - widest.lower).toPrecision(2));
  return `Shaded: the central 95 % of the model over the posterior draws (posterior-predictive band, without measurement noise); at its widest, ${Math.round(widest.x)} K, it spans ${width}${unit ? ` ${unit}` : ''}.`;
}

/** Draws a band is computed from: a couple of hundred keep a page with several kinds quick (viscosity integrates per draw). */
const BAND_DRAWS = 200;

/** Posterior-predictive bands per kind, when the result carries posterior draws; computed once per result. */
export function usePosteriorBands(
  result: LjFitResult | null,
  kinds: FitKind[],
  context: { molarMassGPerMol?: number; quantumCorrection: boolean; repulsiveExponent?: number },
) {
  const draws = (result as GasFitResult | null)?.posterior?.draws;
  const key = kinds.join(',');
  const { molarMassGPerMol, quantumCorrection, repulsiveExponent } = context;
  return useMemo(() => {
    const out: Partial<Record<FitKind, Array<{ x: number; y: number; lower: number }>>> = {};
    if (!result || !draws?.length) return out;
    const used = thinDraws(draws, BAND_DRAWS);
    const ctx = {
      molarMassGPerMol,
      quantumCorrection,
      ...(repulsiveExponent !== undefined && repulsiveExponent !== 12 ? { repulsiveExponent } : {}),
    };
    for (const kind of key.split(',').filter(Boolean) as FitKind[]) {
      try {
        out[kind] = modelBand(
          kind,
          result.residuals.filter((r) => r.kind === kind).map((r) => r.temperatureK),
          used,
          ctx,
        );
      } catch {
        // A kind the model cannot evaluate over the draws gets no band rather than a wrong one.
      }
    }
    return out;
  }, [result, draws, key, molarMassGPerMol, quantumCorrection, repulsiveExponent]);
}
