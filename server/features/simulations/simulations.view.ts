import {
  simulationSummarySchema,
  storedSimulationInput,
  storedSimulationResult,
  type Simulation,
} from '../../../shared/contracts/simulation';
import { readStoredJson } from '../../../shared/schemas/old-names';
import type { SimulationJobRow } from './simulations.repository';

/**
 * The one place a simulation's job row becomes its API view (shared/contracts/simulation.ts): input and result are
 * parsed with their contracts (after readStoredJson, for rows written with the old names); frames (base64, for
 * reweighting) live in simulation_frames and the trace is shown on the detail only.
 */
export function toSimulationView(row: SimulationJobRow, { withTrace }: { withTrace: boolean }): Simulation {
  const input = storedSimulationInput.parse(readStoredJson(row.inputJson));
  const result = row.resultJson ? storedSimulationResult.parse(readStoredJson(row.resultJson)) : null;
  const { trace, frames: _frames, ...summary } = result ?? {};
  return {
    id: row.id,
    kind: row.kind,
    status: row.status,
    progress: row.progress,
    stage: row.stage,
    error: row.error,
    retryable: row.retryable === 1,
    attempts: row.attempts,
    seed: row.seed,
    ranOn: row.ranOn ?? null,
    createdAt: row.createdAt,
    startedAt: row.startedAt,
    finishedAt: row.finishedAt,
    state: input.state,
    origin: input.origin ?? null,
    summary: result ? simulationSummarySchema.parse(summary) : null,
    ...(withTrace && trace ? { trace } : {}),
  };
}
