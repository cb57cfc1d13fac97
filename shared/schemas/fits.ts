import { z } from 'zod';
import { mdSettingsSchema, withinWorkLimit } from './simulations';
import { acceptOldFields } from './old-names';

const range = (name: string, lo: number, hi: number) =>
  z
    .tuple([z.number().gt(0), z.number().gt(0)])
    .refine(([a, b]) => a < b, { message: `${name} bounds must be [lower, upper] with lower < upper` })
    .refine(([a, b]) => a >= lo && b <= hi, { message: `${name} bounds must lie within [${lo}, ${hi}]` });

/** POST /api/fits body. Units are in the names: ε/k_B in K, σ in Å. */
export const createFitBody = z.object({
  substanceId: z.number().int().positive(),
  measurementSets: z
    .array(
      z.object({
        id: z.number().int().positive(),
        /** Pin a version; the newest version is used when absent (and recorded). */
        version: z.number().int().positive().optional(),
        /** Multiplies 1/u of every point of the measurement set (default 1). */
        weight: z.number().gt(0, 'weight must be greater than 0').lte(100, 'weight must be at most 100').optional(),
        /** Row numbers (1-based, as the measurement set page shows them) left out of the fit; predicted, never counted. */
        excludeRows: z
          .array(
            z
              .number({ error: 'row numbers are whole numbers from 1' })
              .int('row numbers are whole numbers from 1')
              .positive('row numbers are whole numbers from 1'),
          )
          .max(10000)
          .refine((rows) => new Set(rows).size === rows.length, { message: 'a row may be left out only once' })
          .optional(),
        /** Why the rows were left out (kept with the fit). */
        excludeReason: z.string().trim().max(500, 'the reason is at most 500 characters').optional(),
      }),
    )
    .min(1, 'choose at least one measurement set')
    .max(20)
    .refine((list) => new Set(list.map((d) => d.id)).size === list.length, { message: 'a measurement set may appear only once' }),
  /** Hold one parameter at a value: exact in the result, no standard error, one degree of freedom more. */
  fixed: z
    .object({ epsilonK: z.number().gt(0).lte(10000).optional(), sigmaAngstrom: z.number().gt(0).lte(30).optional() })
    .strict()
    .refine((f) => f.epsilonK === undefined || f.sigmaAngstrom === undefined, {
      message: 'hold ε or σ, not both: with both held there is nothing to fit',
      path: ['sigmaAngstrom'],
    })
    .optional(),
  options: z
    .object({
      quantumCorrection: z.boolean().optional(),
      /** LJ equation of state behind saturation data (default Thol 2016); JZG 1993 and Kolafa–Nezbeda 1994 for comparison. */
      eosModel: z.enum(['thol2016', 'jzg1993', 'kn1994']).optional(),
      start: z.object({ epsilonK: z.number().gt(0).lte(10000), sigmaAngstrom: z.number().gt(0).lte(30) }).optional(),
      bounds: z.object({ epsilonK: range('epsilonK', 0.1, 20000), sigmaAngstrom: range('sigmaAngstrom', 0.5, 30) }).optional(),
      restarts: z.number().int().min(0).max(10).optional(),
      maxIterations: z.number().int().min(5).max(2000).optional(),
      /** 'lj-12-6' (default) or 'mie': a Mie λr-6 potential with repulsiveExponent held or fitRepulsiveExponent. */
      model: z.enum(['lj-12-6', 'mie']).optional(),
      /** λr of the Mie potential, held (8–36). */
      repulsiveExponent: z
        .number()
        .min(8, 'the repulsive exponent λr is at least 8')
        .max(36, 'the repulsive exponent λr is at most 36')
        .optional(),
      /** Fit λr as a third parameter (by profiling χ² over 8–36). */
      fitRepulsiveExponent: z.boolean().optional(),
      /** Sample the Bayesian posterior of (ε, σ) after the fit (ensemble sampler, fixed seed). */
      posterior: z
        .object({
          samples: z.number().int().min(100, 'at least 100 steps per walker').max(20000, 'at most 20000 steps per walker').optional(),
          seed: z
            .number()
            .int()
            .min(0)
            .max(2 ** 32 - 1)
            .optional(),
          /** A bivariate Gaussian prior on (ε, σ): the values and covariance of a previous approved (or superseded) set of the same model. */
          prior: z
            .object({ parameterSetId: z.number({ error: 'choose a parameter set' }).int().positive() })
            .strict()
            .optional(),
        })
        .strict()
        .optional(),
      /** Engine settings of the simulation stage of a fit with density data (reduced units). */
      density: mdSettingsSchema.strict().superRefine(withinWorkLimit).optional(),
    })
    .strict()
    .superRefine((o, ctx) => {
      const mie = o.model === 'mie';
      if (!mie && (o.repulsiveExponent !== undefined || o.fitRepulsiveExponent))
        ctx.addIssue({ code: 'custom', path: ['model'], message: 'a repulsive exponent needs model "mie"' });
      if (mie && (o.repulsiveExponent === undefined) === !o.fitRepulsiveExponent)
        ctx.addIssue({
          code: 'custom',
          path: ['repulsiveExponent'],
          message: 'a Mie fit needs either repulsiveExponent (held) or fitRepulsiveExponent: true, not both',
        });
      // A Mie fit with density data runs the simulation stage with λr held; fitting λr would need rounds of runs per λr.
      if (mie && o.density && o.fitRepulsiveExponent)
        ctx.addIssue({
          code: 'custom',
          path: ['fitRepulsiveExponent'],
          message: 'the simulation stage of a density fit holds λr: give repulsiveExponent instead of fitting it',
        });
    })
    .optional(),
});
acceptOldFields(createFitBody, [['datasets', 'measurementSets']]); // vocabulary: keep (the old name, still accepted)
export type CreateFitBody = z.infer<typeof createFitBody>;
