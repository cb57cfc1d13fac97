/**
 * zod schemas of the catalog, export, mixture and prediction API, shared by the server (request
 * validation, OpenAPI document) and the client. Units in names: K for ε/k_B and temperatures, Å for σ.
 */
import { z } from 'zod';
import { COMBINING_RULES } from '../mixing/combining-rules';
import { PROPERTY_KIND_IDS } from '../measurements/property-kinds';
import { EXPORT_FORMATS } from '../export/parameter-set-export';
import { CUTOFF_SCHEMES } from '../physics/cutoff-schemes';

const temperature = (name: string) =>
  z.coerce
    .number({ error: `${name} must be a temperature in K` })
    .gt(0, `${name} must be above 0 K`)
    .max(100000, `${name} must be at most 100000 K`);

/** GET /api/catalog — every filter optional; a temperature range keeps the sets whose validity overlaps it. */
export const catalogQuery = z
  .object({
    q: z.string().trim().max(120, 'at most 120 characters').optional(),
    scheme: z.enum(CUTOFF_SCHEMES, { error: `scheme must be one of ${CUTOFF_SCHEMES.join(', ')}` }).optional(),
    kind: z
      .string()
      .transform((s) =>
        s
          .split(',')
          .map((x) => x.trim())
          .filter(Boolean),
      )
      .pipe(z.array(z.enum(PROPERTY_KIND_IDS as [string, ...string[]], { error: `kind must be among ${PROPERTY_KIND_IDS.join(', ')}` })))
      .optional(),
    tMinK: temperature('tMinK').optional(),
    tMaxK: temperature('tMaxK').optional(),
  })
  .strict()
  .superRefine((v, ctx) => {
    if (v.tMinK !== undefined && v.tMaxK !== undefined && v.tMinK > v.tMaxK)
      ctx.addIssue({ code: 'custom', path: ['tMaxK'], message: 'tMaxK must not be below tMinK' });
  });
export type CatalogQuery = z.infer<typeof catalogQuery>;

/** GET /api/parameter-sets/:id/export */
export const exportQuery = z
  .object({
    format: z.enum(EXPORT_FORMATS, { error: `format must be one of ${EXPORT_FORMATS.join(', ')}` }),
    units: z.string().max(40).optional(),
  })
  .strict();

const numberList = (name: string, unit: string) =>
  z
    .string({ error: `give ${name} as comma-separated numbers in ${unit}` })
    .transform((s) =>
      s
        .split(',')
        .map((x) => x.trim())
        .filter(Boolean),
    )
    .pipe(
      z
        .array(
          z.coerce
            .number<string>({ error: `each of ${name} must be a number` })
            .positive(`each of ${name} must be above 0`)
            .finite(),
        )
        .min(1, `give at least one of ${name}`)
        .max(200, `at most 200 ${name}`),
    );

/** GET /api/parameter-sets/:id/predictions — a property at the consumer's own states (pressures for densities, one per temperature). */
export const predictionQuery = z
  .object({
    kind: z.enum(['b2', 'viscosity', 'density'], { error: 'kind must be one of b2, viscosity, density' }),
    temperaturesK: numberList('temperaturesK', 'K'),
    pressuresMPa: numberList('pressuresMPa', 'MPa').optional(),
  })
  .strict()
  .superRefine((v, ctx) => {
    if (v.kind === 'density' && v.pressuresMPa?.length !== v.temperaturesK.length)
      ctx.addIssue({ code: 'custom', path: ['pressuresMPa'], message: 'densities need one pressure per temperature (pressuresMPa)' });
    if (v.kind !== 'density' && v.pressuresMPa !== undefined)
      ctx.addIssue({ code: 'custom', path: ['pressuresMPa'], message: `pressures are only used for densities, not for ${v.kind}` });
  });

export type PredictionQuery = z.infer<typeof predictionQuery>;

/** GET /api/mixtures — two or more distinct set ids, a combining rule, and a format for a file. */
export const mixtureQuery = z
  .object({
    sets: z
      .string({ error: 'give sets as comma-separated parameter set ids' })
      .transform((s) =>
        s
          .split(',')
          .map((x) => x.trim())
          .filter(Boolean),
      )
      .pipe(
        z
          .array(
            z.coerce
              .number<string>({ error: 'each set id must be a number' })
              .int('each set id must be an integer')
              .positive('each set id must be positive'),
          )
          .min(2, 'a mixture needs at least two parameter sets')
          .max(12, 'at most 12 parameter sets')
          .refine((ids) => new Set(ids).size === ids.length, 'each parameter set may appear once'),
      ),
    rule: z.enum(COMBINING_RULES, { error: `rule must be one of ${COMBINING_RULES.join(', ')}` }),
    format: z.enum(EXPORT_FORMATS, { error: `format must be one of ${EXPORT_FORMATS.join(', ')}` }).optional(),
    units: z.string().max(40).optional(),
  })
  .strict();
export type MixtureQuery = z.infer<typeof mixtureQuery>;
