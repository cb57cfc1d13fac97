/**
 * zod schemas of the parameter-set API, shared by the server (request validation) and the client (forms).
 * Units in names: K for ε/k_B and temperatures, Å for σ, MPa for pressures, cutoffs in units of σ.
 */
import { z } from 'zod';
import { CUTOFF_SCHEME_LABELS, CUTOFF_SCHEMES, type CutoffScheme } from '../physics/cutoff-schemes';
import { acceptOldFields } from './old-names';

/** Cutoff radii accepted for the truncated schemes, in units of σ (2.5σ is the common minimum, 4σ a generous maximum). */
export const CUTOFF_SIGMA_RANGE = { min: 2.5, max: 4 } as const;

const cutoffSigma = z
  .number({ error: 'cutoff must be a number (in units of σ)' })
  .min(CUTOFF_SIGMA_RANGE.min, `cutoff must be at least ${CUTOFF_SIGMA_RANGE.min} σ`)
  .max(CUTOFF_SIGMA_RANGE.max, `cutoff must be at most ${CUTOFF_SIGMA_RANGE.max} σ`);

const positive = (what: string) => z.number({ error: `${what} must be a number` }).gt(0, `${what} must be greater than 0`);

export const validitySchema = z
  .object({
    temperatureMinK: positive('temperatureMinK'),
    temperatureMaxK: positive('temperatureMaxK'),
    pressureMinMPa: positive('pressureMinMPa').optional(),
    pressureMaxMPa: positive('pressureMaxMPa').optional(),
  })
  .strict()
  .superRefine((v, ctx) => {
    if (v.temperatureMinK >= v.temperatureMaxK)
      ctx.addIssue({ code: 'custom', path: ['temperatureMaxK'], message: 'the upper temperature must be above the lower one' });
    if ((v.pressureMinMPa === undefined) !== (v.pressureMaxMPa === undefined))
      ctx.addIssue({ code: 'custom', path: ['pressureMaxMPa'], message: 'give both pressure bounds or neither' });
    else if (v.pressureMinMPa !== undefined && v.pressureMaxMPa !== undefined && v.pressureMinMPa >= v.pressureMaxMPa)
      ctx.addIssue({ code: 'custom', path: ['pressureMaxMPa'], message: 'the upper pressure must be above the lower one' });
  });
export type Validity = z.infer<typeof validitySchema>;

const rationale = z
  .string({ error: 'rationale is required' })
  .trim()
  .min(3, 'give a rationale of at least 3 characters')
  .max(5000, 'at most 5000 characters');

/** A truncated scheme needs its cutoff; the full potential has none. */
function schemeNeedsCutoff(v: { scheme?: CutoffScheme; cutoffSigma?: number }, ctx: z.RefinementCtx) {
  const scheme = v.scheme ?? 'full-potential';
  if (scheme === 'full-potential' && v.cutoffSigma !== undefined)
    ctx.addIssue({ code: 'custom', path: ['cutoffSigma'], message: 'the full potential has no cutoff; leave the cutoff empty' });
  if (scheme !== 'full-potential' && v.cutoffSigma === undefined)
    ctx.addIssue({
      code: 'custom',
      path: ['cutoffSigma'],
      message: `the scheme “${CUTOFF_SCHEME_LABELS[scheme]}” needs a cutoff (${CUTOFF_SIGMA_RANGE.min}–${CUTOFF_SIGMA_RANGE.max} σ)`,
    });
}

/** POST /api/parameter-sets */
export const createParameterSetBody = z
  .object({
    fitId: z.number().int().positive(),
    scheme: z.enum(CUTOFF_SCHEMES).optional(),
    cutoffSigma: cutoffSigma.optional(),
    validity: validitySchema.optional(),
    rationale,
  })
  .strict()
  .superRefine(schemeNeedsCutoff);
export type CreateParameterSetBody = z.infer<typeof createParameterSetBody>;

/**
 * POST /api/parameter-sets/:id/revise — a set sent back becomes a new draft (the next version) from the
 * same fit or a newer fit of the same substance. Like a first draft, it takes the fit's scheme and cutoff
 * unless the body names a scheme (under the same rules); a cutoff alone changes the cutoff of a truncated scheme.
 */
export const reviseParameterSetBody = z
  .object({
    fitId: z.number().int().positive().optional(),
    scheme: z.enum(CUTOFF_SCHEMES).optional(),
    cutoffSigma: cutoffSigma.optional(),
    validity: validitySchema.optional(),
    rationale,
  })
  .strict()
  .superRefine((v, ctx) => {
    if (v.scheme !== undefined) schemeNeedsCutoff(v, ctx);
  });
export type ReviseParameterSetBody = z.infer<typeof reviseParameterSetBody>;

/** PATCH /api/parameter-sets/:id — only the rationale and the range of validity, only in draft. */
export const updateParameterSetBody = z
  .object({ rationale: rationale.optional(), validity: validitySchema.optional() })
  .strict()
  .refine((v) => v.rationale !== undefined || v.validity !== undefined, { message: 'give rationale or validity' });
acceptOldFields(updateParameterSetBody, [['datasets', 'measurementSets']]); // vocabulary: keep (a frozen field, refused by its old name too)
export type UpdateParameterSetBody = z.infer<typeof updateParameterSetBody>;

/** Fields a PATCH can never change: they are frozen at creation (answered 409, not 400). */
export const FROZEN_FIELDS = [
  'epsilonK',
  'sigmaAngstrom',
  'stdErr',
  'correlation',
  'scheme',
  'cutoffSigma',
  'version',
  'fitId',
  'substanceId',
  'model',
  'measurementSets',
  'state',
] as const;

/** POST /api/parameter-sets/:id/review */
export const reviewParameterSetBody = z
  .object({
    decision: z.enum(['approve', 'request_changes'], { error: 'decision must be "approve" or "request_changes"' }),
    comment: z.string({ error: 'a review needs a comment' }).trim().min(1, 'a review needs a comment').max(5000, 'at most 5000 characters'),
  })
  .strict();
export type ReviewParameterSetBody = z.infer<typeof reviewParameterSetBody>;

/** POST /api/parameter-sets/:id/retire */
export const retireParameterSetBody = z
  .object({
    reason: z
      .string({ error: 'give a reason' })
      .trim()
      .min(3, 'give a reason of at least 3 characters')
      .max(2000, 'at most 2000 characters'),
  })
  .strict();

/** POST /api/parameter-sets/:id/comments */
export const commentBody = z
  .object({ body: z.string({ error: 'the comment is empty' }).trim().min(1, 'the comment is empty').max(5000, 'at most 5000 characters') })
  .strict();
