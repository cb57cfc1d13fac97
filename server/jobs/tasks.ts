/**
 * Pure computations that run inside worker threads, by job kind. Each task is a thin wrapper over
 * separately tested code in shared/: a payload in, a JSON-able result out, progress through a callback.
 */
import { fitLennardJones, type FitDataset, type LjFitOptions } from '../../shared/fitting/lj-fit';
import { runNpt, type NptOptions } from '../../shared/physics/md/npt';

export type ProgressReport = { fraction: number; stage: string };
export type Task = (payload: any, progress: (p: ProgressReport) => void) => unknown | Promise<unknown>;

export interface FitTaskPayload {
  datasets: FitDataset[];
  options: LjFitOptions;
}

export const TASKS: Record<string, Task> = {
  fit: (payload: FitTaskPayload, progress) => fitLennardJones(payload.datasets, payload.options, progress),
  simulation: (payload: NptOptions, progress) => runNpt(payload, progress),
};
