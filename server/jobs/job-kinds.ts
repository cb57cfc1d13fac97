import { fitJobKind } from '../features/fits/fits.service';
import { simulationJobKind } from '../features/simulations/simulations.service';
import type { JobKind } from './job-runner';

/** Every kind of long job, by name; the worker side lives in tasks.ts under the same names. */
export const JOB_KINDS: Record<string, JobKind> = {
  fit: fitJobKind,
  simulation: simulationJobKind,
};
