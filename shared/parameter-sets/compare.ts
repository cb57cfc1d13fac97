/**
 * Deviations of a parameter pair from the measured points of a fit, per measurement set, so a reviewer
 * can see what replacing the approved ε/σ would change on the same data. Same measures as the fit's own
 * summary (lj-fit.ts): RMS of model − measured in the set's unit, and the mean absolute relative deviation.
 * Density points carry their pressure, and the measured value picks the phase where the EOS has two roots.
 */
import type { LjResidual } from '../fitting/lj-fit';
import { PROPERTY_MODELS, type FitKind, type PropertyContext } from '../fitting/property-models';

export interface MeasurementSetDeviation {
  measurementSetId: string | number;
  kind: FitKind;
  points: number;
  /** √(mean (model − measured)²), in the set's unit (cm³/mol for B2, µPa·s for viscosity, kg/m³ for density). */
  rms: number;
  /** Mean |model − measured|/|measured| in percent; null when every measured value is 0. */
  aadPercent: number | null;
  /** Points where the model could not be evaluated (outside its tabulated range); left out of rms and AAD. */
  skipped: number;
}

export function measurementSetDeviations(
  points: ReadonlyArray<Pick<LjResidual, 'measurementSetId' | 'kind' | 'temperatureK' | 'measured'> & { pressureMPa?: number }>,
  epsilonK: number,
  sigmaAngstrom: number,
  context: PropertyContext,
): MeasurementSetDeviation[] {
  const ids = [...new Set(points.map((p) => String(p.measurementSetId)))];
  return ids.map((id) => {
    const mine = points.filter((p) => String(p.measurementSetId) === id);
    let sumSq = 0;
    let n = 0;
    let sumRel = 0;
    let nRel = 0;
    for (const p of mine) {
      let predicted: number;
      try {
        predicted = PROPERTY_MODELS[p.kind].evaluate(
          { temperatureK: p.temperatureK, pressureMPa: p.pressureMPa, measured: p.measured },
          epsilonK,
          sigmaAngstrom,
          context,
        ).value;
      } catch {
        continue;
      }
      sumSq += (predicted - p.measured) ** 2;
      n += 1;
      if (p.measured !== 0) {
        sumRel += Math.abs((100 * (predicted - p.measured)) / p.measured);
        nRel += 1;
      }
    }
    return {
      measurementSetId: mine[0].measurementSetId,
      kind: mine[0].kind,
      points: mine.length,
      rms: n ? Math.sqrt(sumSq / n) : NaN,
      aadPercent: nRel ? sumRel / nRel : null,
      skipped: mine.length - n,
    };
  });
}
