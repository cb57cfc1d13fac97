/**
 * Pure computations that run inside worker threads, by job kind. Each task is a thin wrapper over
 * separately tested code in shared/: a payload in, a JSON-able result out, progress through a callback.
 * Nothing here opens the database: worker processes (`npm run worker`) load this file and the shared code only.
 */
import { type FitMeasurementSet } from '../../shared/fitting/lj-fit';
import { gasPhaseFit, type GasFitOptions } from '../../shared/fitting/gas-fit';
import { runNpt, type NptOptions } from '../../shared/physics/md/npt';

export type ProgressReport = { fraction: number; stage: string };
/** A worker task; each names its own payload type (a method's parameters are compared bivariantly, so the table below may hold them all). */
export type Task = { run(payload: unknown, progress: (p: ProgressReport) => void): unknown | Promise<unknown> }['run'];

export interface FitTaskPayload {
  measurementSets: FitMeasurementSet[];
  options: GasFitOptions;
}

export const TASKS: Record<string, Task> = {
  fit: (payload: FitTaskPayload, progress) => gasPhaseFit(payload.measurementSets, payload.options, progress),
  simulation: (payload: NptOptions, progress) => runNpt(payload, progress),
};

/**
 * Lanes: fast tasks (B2, viscosity and equation-of-state fits, milliseconds) have threads and a queue of their
 * own, so they never wait behind a simulation that takes minutes.
 */
export type Lane = 'fast' | 'simulation';
export const TASK_LANES: Record<string, Lane> = { fit: 'fast', simulation: 'simulation' };
export const laneOf = (task: string): Lane => TASK_LANES[task] ?? 'simulation';

/**
 * Version of each task's computation. Bump it when a task's result changes for the same payload (a new
 * integrator, more fields in the result): cached results of the old version are no longer reused, and a worker
 * process running other code refuses the job with a clear message instead of computing something else.
 */
export const ENGINE_VERSIONS: Record<string, string> = { fit: 'lj-fit-2', simulation: 'npt-2' };
export const engineVersionOf = (task: string): string => ENGINE_VERSIONS[task] ?? 'unversioned';
