import { z } from 'zod';
import { mdSettingsSchema, withinWorkLimit } from './simulations';

const range = (name: string, lo: number, hi: number) =>
  z
    .tuple([z.number().gt(0), z.number().gt(0)])
    .refine(([a, b]) => a < b, { message: `${name} bounds must be [lower, upper] with lower < upper` })
    .refine(([a, b]) => a >= lo && b <= hi, { message: `${name} bounds must lie within [${lo}, ${hi}]` });

/** POST /api/fits body. Units are in the names: ε/k_B in K, σ in Å. */
export const createFitBody = z.object({
  substanceId: z.number().int().positive(),
  datasets: z
    .array(
      z.object({
        id: z.number().int().positive(),
        /** Pin a version; the newest version is used when absent (and recorded). */
        version: z.number().int().positive().optional(),
        /** Multiplies 1/u of every point of the dataset (default 1). */
        weight: z.number().gt(0, 'weight must be greater than 0').lte(100, 'weight must be at most 100').optional(),
      }),
    )
    .min(1, 'choose at least one measurement set')
    .max(20)
    .refine((list) => new Set(list.map((d) => d.id)).size === list.length, { message: 'a measurement set may appear only once' }),
  options: z
    .object({
      quantumCorrection: z.boolean().optional(),
      start: z.object({ epsilonK: z.number().gt(0).lte(10000), sigmaAngstrom: z.number().gt(0).lte(30) }).optional(),
      bounds: z.object({ epsilonK: range('epsilonK', 0.1, 20000), sigmaAngstrom: range('sigmaAngstrom', 0.5, 30) }).optional(),
      restarts: z.number().int().min(0).max(10).optional(),
      maxIterations: z.number().int().min(5).max(2000).optional(),
      /** Engine settings of the simulation stage of a fit with density data (reduced units). */
      density: mdSettingsSchema.strict().superRefine(withinWorkLimit).optional(),
    })
    .strict()
    .optional(),
});
export type CreateFitBody = z.infer<typeof createFitBody>;
