import { preferencesView, storedPreferences, type PreferencesView, type StoredPreferences } from '../../../shared/contracts/preferences';
import { DEFAULT_PREFERENCES } from '../../../shared/schemas/preferences';

/** The stored column as an object; anything that is not a JSON object reads as empty. */
export function readStoredPreferences(json: string | null | undefined): StoredPreferences {
  try {
    const parsed = storedPreferences.safeParse(JSON.parse(json ?? '{}'));
    return parsed.success ? parsed.data : {};
  } catch {
    return {};
  }
}

/**
 * The stored preferences, read leniently: the JSON column may hold keys of older or other features, so
 * each known key is kept when valid and replaced by its default when not.
 */
export function toPreferencesView(row: { preferencesJson: string } | undefined): PreferencesView {
  const raw = readStoredPreferences(row?.preferencesJson);
  const shape = preferencesView.shape;
  const energy = shape.energyUnit.safeParse(raw.energyUnit);
  const length = shape.lengthUnit.safeParse(raw.lengthUnit);
  const scheme = shape.scheme.safeParse(raw.scheme);
  return {
    energyUnit: energy.success ? energy.data : DEFAULT_PREFERENCES.energyUnit,
    lengthUnit: length.success ? length.data : DEFAULT_PREFERENCES.lengthUnit,
    ...(scheme.success && scheme.data ? { scheme: scheme.data } : {}),
  };
}
