import { z } from 'zod';
import { acceptOldFields } from './old-names';
import { SIMULATION_CUTOFF_SCHEMES } from '../physics/cutoff-schemes';

/**
 * Per-request limits of one NPT run. A density fit needs 256 atoms × 10 000 steps (seconds); the caps keep one
 * request from holding a worker for hours: at most 4 000 atoms, 500 000 steps, and 250 000 000 atom-steps
 * together (about 50 times the engine's default run, minutes on one core).
 */
export const SIMULATION_LIMITS = { minAtoms: 108, maxAtoms: 4000, minSteps: 1000, maxSteps: 500_000, maxAtomSteps: 250_000_000 } as const;

/** Engine settings of an NPT run in reduced units (σ = ε = m = k_B = 1). Defaults are the engine's. */
export const mdSettingsSchema = z.object({
  atoms: z.number().int().min(SIMULATION_LIMITS.minAtoms).max(SIMULATION_LIMITS.maxAtoms).optional(),
  steps: z.number().int().min(SIMULATION_LIMITS.minSteps).max(SIMULATION_LIMITS.maxSteps).optional(),
  cutoff: z.number().min(2).max(4).optional(),
  scheme: z.enum(SIMULATION_CUTOFF_SCHEMES).optional(),
  seed: z
    .number()
    .int()
    .min(0)
    .max(2 ** 32 - 1)
    .optional(),
});
export type MdSettings = z.infer<typeof mdSettingsSchema>;

/** atoms × steps within SIMULATION_LIMITS.maxAtomSteps (defaults: the engine's 500 atoms, 10 000 steps). */
export function withinWorkLimit(settings: { atoms?: number; steps?: number }, ctx: z.RefinementCtx) {
  const atoms = settings.atoms ?? 500;
  const steps = settings.steps ?? 10000;
  if (atoms * steps > SIMULATION_LIMITS.maxAtomSteps) {
    ctx.addIssue({
      code: 'custom',
      path: ['steps'],
      message: `atoms × steps must be at most ${SIMULATION_LIMITS.maxAtomSteps.toLocaleString('en-GB')} (asked ${atoms} × ${steps}); use fewer atoms or steps`,
    });
  }
}

/** POST /api/simulations: one reduced state point. */
export const createSimulationBody = mdSettingsSchema
  .extend({
    reducedTemperature: z.number().min(0.3).max(10),
    reducedPressure: z.number().gt(0).max(20),
  })
  .superRefine(withinWorkLimit);
export type CreateSimulationBody = z.infer<typeof createSimulationBody>;

/** POST /api/simulations/from-measurement-set: state points of a density set, mapped to reduced units with trial ε and σ. */
export const simulationsFromMeasurementSetBody = mdSettingsSchema
  .extend({
    measurementSetId: z.number().int().positive(),
    version: z.number().int().positive().optional(),
    /** File rows (as shown on the measurement set page) to simulate; all rows when absent. */
    rows: z.array(z.number().int().positive()).max(200).optional(),
    epsilonK: z.number().gt(0).max(10000),
    sigmaAngstrom: z.number().gt(0).max(30),
  })
  .superRefine(withinWorkLimit);
acceptOldFields(simulationsFromMeasurementSetBody, [['datasetId', 'measurementSetId']]); // vocabulary: keep (the old name, still accepted)
export type SimulationsFromMeasurementSetBody = z.infer<typeof simulationsFromMeasurementSetBody>;
