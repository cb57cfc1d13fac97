import type { LjFitResult, LjResidual } from '@shared/fitting/lj-fit';
import type { FitKind } from '@shared/fitting/property-models';
import { PROPERTY_KINDS, type PropertyKind } from '@shared/measurements/property-kinds';
import { PropertyChart, type ChartSeries } from '@/components/charts/property-chart';
import { valueAxisTitle } from '@/features/datasets/components/dataset-chart';
import { modelCurve } from './model-curves';

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
export function FitCurves({ result, datasetNames, context, curves, height = 300, residuals, residualsLabel }: { result: LjFitResult; datasetNames: Record<string, string>; context: { molarMassGPerMol?: number; quantumCorrection: boolean }; curves: CurveParameters[]; height?: number; residuals?: LjResidual[]; residualsLabel?: string }) {
  // Densities are state functions of T and P: they get their own panels (density-panel.tsx).
  const kinds = [...new Set(result.residuals.map((r) => r.kind))].filter((k) => k !== 'density') as FitKind[];
  if (!kinds.length) return null;
  const plotted = residuals ?? result.residuals;
  return (
    <div className={`grid gap-6 ${kinds.length > 1 ? 'xl:grid-cols-2' : ''}`}>
      {kinds.map((kind) => {
        const points = result.residuals.filter((r) => r.kind === kind);
        const byDataset = [...new Set(points.map((p) => String(p.datasetId)))];
        const measured: ChartSeries[] = byDataset.map((id) => ({
          label: datasetNames[id] ?? `set ${id}`,
          kind: 'measured',
          points: points.filter((p) => String(p.datasetId) === id).map((p) => ({ x: p.temperatureK, y: p.measured, u: p.uncertainty, hollow: isLeftOut(p) })),
        }));
        const temps = points.map((p) => p.temperatureK);
        const model: ChartSeries[] = curves.map((c) => ({ label: c.label, kind: 'model', points: modelCurve(kind, temps, c.epsilonK, c.sigmaAngstrom, c.repulsiveExponent !== undefined && c.repulsiveExponent !== 12 ? ({ ...context, repulsiveExponent: c.repulsiveExponent } as typeof context) : context) }));
        const residualSeries: ChartSeries[] = byDataset.map((id) => ({
          label: datasetNames[id] ?? `set ${id}`,
          kind: 'measured',
          points: plotted.filter((p) => p.kind === kind && String(p.datasetId) === id).map((p) => ({ x: p.temperatureK, y: p.residual, hollow: isLeftOut(p) })),
        }));
        return (
          <div key={kind} className="min-w-0">
            <h3 className="mb-1 font-semibold">{kind === 'b2' ? 'Second virial coefficient' : kind === 'viscosity' ? 'Dilute-gas viscosity' : (PROPERTY_KINDS[kind as PropertyKind]?.label ?? kind)}</h3>
            <PropertyChart
              ariaLabel={`${kind} data and model`}
              series={[...measured, ...model]}
              xTitle="T (K)"
              yTitle={valueAxisTitle(kind)}
              residuals={{ title: RESIDUAL_AXIS_TITLE, series: residualSeries }}
              height={height}
            />
            <p className="mt-1 text-xs text-ink-faint">
              Lower panel: residuals {residualsLabel ?? 'of the fit'}, (model − measured) divided by the measurement’s standard uncertainty u{points.some(isLeftOut) ? '; open markers are points left out of the fit' : ''}.
            </p>
          </div>
        );
      })}
    </div>
  );
}
