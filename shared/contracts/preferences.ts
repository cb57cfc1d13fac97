/**
 * Contract of a person's preferences: the answer of GET/PUT /api/me/preferences, and the stored JSON column
 * person.preferences_json (an object that may also hold keys of other features, kept as they are).
 * Built in server/features/preferences/preferences.view.ts, which reads the column leniently (a bad key gets its default).
 */
import { z } from 'zod';
import { CUTOFF_SCHEMES } from '../physics/cutoff-schemes';
import { ENERGY_UNITS, LENGTH_UNITS } from '../physics/parameter-units';

export const preferencesView = z.strictObject({
  energyUnit: z.enum(ENERGY_UNITS),
  lengthUnit: z.enum(LENGTH_UNITS),
  /** The cutoff scheme the person's simulations use; absent when not said. */
  scheme: z.enum(CUTOFF_SCHEMES).optional(),
});
export type PreferencesView = z.infer<typeof preferencesView>;

/** The stored column: any JSON object (other features' keys included); its known keys are read one by one. */
export const storedPreferences = z.record(z.string(), z.unknown());
export type StoredPreferences = z.infer<typeof storedPreferences>;
