import type { ReactNode } from 'react';
import type { GasFitResult } from '@shared/fitting/gas-fit';
import type { LjFitResult } from '@shared/fitting/lj-fit';
import type { EnergyUnit, LengthUnit } from '@shared/physics/parameter-units';
import { Panel } from '@/components/ui/states';
import type { Fit } from '../api/fits';
import { DensityCharts, SimulationStage, type DensityFitResult } from './density-panel';
import { EllipseChart } from './ellipse-chart';
import { FitCurves, type CurveParameters } from './fit-curves';
import { MeasurementSetStatsTable, ParameterTable } from './parameter-table';
import { ProfileCharts } from './profile-charts';

/** Names, weights and model context of a fit's data, as its result's residuals refer to them. */
export function fitContext(fit: Fit) {
  return {
    names: Object.fromEntries(fit.measurementSets.map((d) => [String(d.measurementSetId), `${d.name} v${d.version}`])),
    weights: Object.fromEntries(fit.measurementSets.map((d) => [String(d.measurementSetId), d.weight])),
    // A Mie fit's curves and what-if values use its λr (held or fitted); absent or 12 is LJ 12-6.
    context: {
      molarMassGPerMol: fit.options.molarMassGPerMol,
      quantumCorrection: !!fit.options.quantumCorrection,
      ...(fit.result?.repulsiveExponent !== undefined && fit.result.repulsiveExponent !== 12
        ? { repulsiveExponent: fit.result.repulsiveExponent }
        : {}),
    },
  };
}

/** A result worth showing: a finished fit, or a failed one that kept its last iterate. */
export function hasEvidence(result: LjFitResult | null): result is LjFitResult {
  return !!result && Number.isFinite(result.epsilonK) && Number.isFinite(result.sigmaAngstrom) && Array.isArray(result.residuals);
}

/**
 * Everything behind a fit, shown the same way wherever the fit is judged — the fit page, the review page of a
 * parameter set and the catalog card: warnings, parameters and their joint region, every property against
 * the model (B2, viscosity, densities per isotherm and per isobar), the simulation stage of a density fit,
 * profile-χ² intervals, and the statistics per measurement set.
 */
export function FitEvidence({
  fit,
  result,
  curves,
  energy = 'K',
  length = 'Å',
  unitSwitch,
  parametersTitle = 'Parameters',
  dataTitle = 'Data and model',
  comparison,
}: {
  fit: Fit;
  result: LjFitResult;
  curves: CurveParameters[];
  energy?: EnergyUnit;
  length?: LengthUnit;
  unitSwitch?: ReactNode;
  parametersTitle?: string;
  dataTitle?: string;
  comparison?: ReactNode;
}) {
  const { names, context } = fitContext(fit);
  const density = result as DensityFitResult;
  const warnings = result.warnings ?? [];
  const hitBounds = result.hitBounds ?? [];
  return (
    <div className="grid gap-6" data-testid="fit-evidence">
      {(warnings.length > 0 || hitBounds.length > 0) && (
        <div role="status" className="rounded-lg border border-review/40 bg-review-soft/70 px-5 py-3">
          <p className="font-semibold text-review">Read before use: Fit #{fit.number}</p>
          <ul className="mt-1 list-disc pl-5 text-sm">
            {hitBounds.map((b) => (
              <li key={b}>The fit ended on the bound of {b}; the value is a limit, not an estimate.</li>
            ))}
            {warnings.map((w) => (
              <li key={w} className={/strongly correlated/i.test(w) ? 'font-semibold' : ''}>
                {w}
              </li>
            ))}
          </ul>
        </div>
      )}
      <div className="grid gap-6 lg:grid-cols-[3fr_2fr]">
        <Panel title={parametersTitle} actions={unitSwitch} className="min-w-0">
          <ParameterTable result={result} energy={energy} length={length} />
        </Panel>
        <Panel
          title={
            (result as GasFitResult).posterior || (result as GasFitResult).tension
              ? '95 % regions of ε/k_B and σ'
              : '95 % joint confidence region'
          }
          className="min-w-0"
        >
          <EllipseChart result={result} />
        </Panel>
      </div>
      {comparison}
      <Panel title={dataTitle} className="min-w-0">
        <div className="grid gap-8">
          <FitCurves result={result} measurementSetNames={names} context={context} curves={curves} />
          {curves.length > 1 && (
            <p className="-mt-6 text-xs text-ink-faint">
              Residuals underneath are those of the fit behind {curves[0].label.toLowerCase()}.
            </p>
          )}
          <DensityCharts
            result={result}
            context={context}
            curves={curves.slice(0, 1)}
            predictedLabel={density.mdRuns ? 'simulated' : 'equation of state'}
            residualsLabel={density.mdRuns ? 'of the fit (simulated densities)' : 'of the fit'}
          />
        </div>
      </Panel>
      {density.mdRuns && (
        <Panel title="Simulation stage" className="min-w-0">
          <SimulationStage result={density} />
        </Panel>
      )}
      <Panel title="Profile χ²: intervals beside the linearised ones" className="min-w-0">
        <ProfileCharts result={result} />
      </Panel>
      <Panel title="Per measurement set" className="min-w-0">
        <MeasurementSetStatsTable result={result} names={names} />
      </Panel>
    </div>
  );
}
