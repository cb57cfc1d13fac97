import { z } from 'zod';

/** Engine settings of an NPT run in reduced units (σ = ε = m = k_B = 1). Defaults are the engine's. */
export const mdSettingsSchema = z.object({
  atoms: z.number().int().min(108).max(20000).optional(),
  steps: z.number().int().min(1000).max(2_000_000).optional(),
  cutoff: z.number().min(2).max(4).optional(),
  scheme: z.enum(['truncated-tail', 'truncated-shifted']).optional(),
  seed: z.number().int().min(0).max(2 ** 32 - 1).optional(),
});
export type MdSettings = z.infer<typeof mdSettingsSchema>;

/** POST /api/simulations: one reduced state point. */
export const createSimulationBody = mdSettingsSchema.extend({
  reducedTemperature: z.number().min(0.3).max(10),
  reducedPressure: z.number().gt(0).max(20),
});
export type CreateSimulationBody = z.infer<typeof createSimulationBody>;

/** POST /api/simulations/from-dataset: state points of a density set, mapped to reduced units with trial ε and σ. */
export const simulationsFromDatasetBody = mdSettingsSchema.extend({
  datasetId: z.number().int().positive(),
  version: z.number().int().positive().optional(),
  /** File rows (as shown on the dataset page) to simulate; all rows when absent. */
  rows: z.array(z.number().int().positive()).max(200).optional(),
  epsilonK: z.number().gt(0).max(10000),
  sigmaAngstrom: z.number().gt(0).max(30),
});
export type SimulationsFromDatasetBody = z.infer<typeof simulationsFromDatasetBody>;
