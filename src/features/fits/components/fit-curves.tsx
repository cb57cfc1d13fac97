import type { LjFitResult } from '@shared/fitting/lj-fit';
import type { FitKind } from '@shared/fitting/property-models';
import { PropertyChart, type ChartSeries } from '@/components/charts/property-chart';
import { valueAxisTitle } from '@/features/datasets/components/dataset-chart';
import { modelCurve } from './model-curves';

export interface CurveParameters {
  label: string;
  epsilonK: number;
  sigmaAngstrom: number;
}

/**
 * One chart per property kind: measured points with ±u, the model curve of each parameter pair, and the
 * residuals (model − measured)/u of the fit underneath.
 */
export function FitCurves({ result, datasetNames, context, curves, height = 300 }: { result: LjFitResult; datasetNames: Record<string, string>; context: { molarMassGPerMol?: number; quantumCorrection: boolean }; curves: CurveParameters[]; height?: number }) {
  // Densities are state functions of T and P: they get their own panel (density-panel.tsx).
  const kinds = [...new Set(result.residuals.map((r) => r.kind))].filter((k) => k !== 'density') as FitKind[];
  return (
    <div className="grid gap-6 xl:grid-cols-2">
      {kinds.map((kind) => {
        const points = result.residuals.filter((r) => r.kind === kind);
        const byDataset = [...new Set(points.map((p) => String(p.datasetId)))];
        const measured: ChartSeries[] = byDataset.map((id) => ({
          label: datasetNames[id] ?? `set ${id}`,
          kind: 'measured',
          points: points.filter((p) => String(p.datasetId) === id).map((p) => ({ x: p.temperatureK, y: p.measured, u: p.uncertainty })),
        }));
        const temps = points.map((p) => p.temperatureK);
        const model: ChartSeries[] = curves.map((c) => ({ label: c.label, kind: 'model', points: modelCurve(kind, temps, c.epsilonK, c.sigmaAngstrom, context) }));
        const residuals: ChartSeries[] = byDataset.map((id) => ({
          label: datasetNames[id] ?? `set ${id}`,
          kind: 'measured',
          points: points.filter((p) => String(p.datasetId) === id).map((p) => ({ x: p.temperatureK, y: p.residual })),
        }));
        return (
          <div key={kind}>
            <h3 className="mb-1 font-semibold">{kind === 'b2' ? 'Second virial coefficient' : 'Dilute-gas viscosity'}</h3>
            <PropertyChart
              ariaLabel={`${kind} data and model`}
              series={[...measured, ...model]}
              xTitle="T (K)"
              yTitle={valueAxisTitle(kind)}
              residuals={{ title: '(model − meas.)/u', series: residuals }}
              height={height}
            />
          </div>
        );
      })}
    </div>
  );
}
