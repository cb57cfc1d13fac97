/**
 * zod schemas of a person's preferences (GET/PUT /api/me/preferences), shared by the server and the client.
 */
import { z } from 'zod';
import { CUTOFF_SCHEMES } from '../physics/cutoff-schemes';
import { ENERGY_UNITS, LENGTH_UNITS } from '../physics/parameter-units';

/** What the user last picked on the parameter card; remembered per user on the server. */
export const preferencesSchema = z
  .object({
    energyUnit: z.enum(ENERGY_UNITS, { error: `energyUnit must be one of ${ENERGY_UNITS.join(', ')}` }),
    lengthUnit: z.enum(LENGTH_UNITS, { error: `lengthUnit must be one of ${LENGTH_UNITS.join(', ')}` }),
    /** The cutoff scheme the user's simulations use ("my simulation uses"); absent when not said. */
    scheme: z.enum(CUTOFF_SCHEMES, { error: `scheme must be one of ${CUTOFF_SCHEMES.join(', ')}` }).optional(),
  })
  .strict();
export type Preferences = z.infer<typeof preferencesSchema>;
export const DEFAULT_PREFERENCES: Preferences = { energyUnit: 'K', lengthUnit: 'Å' };

/** PUT /api/me/preferences — any subset; `scheme: null` forgets the scheme. */
export const updatePreferencesBody = z
  .object({
    energyUnit: preferencesSchema.shape.energyUnit.optional(),
    lengthUnit: preferencesSchema.shape.lengthUnit.optional(),
    scheme: preferencesSchema.shape.scheme.unwrap().nullable().optional(),
  })
  .strict()
  .refine((v) => Object.keys(v).length > 0, { message: 'give at least one of energyUnit, lengthUnit, scheme' });
export type UpdatePreferencesBody = z.infer<typeof updatePreferencesBody>;
