/**
 * Query-key factories that more than one feature invalidates (features import no other feature, so a key that a
 * second feature must reach lives here). Keys run from general to specific, so one prefix invalidates an entity.
 */

/** Substances: their list and details change when a measurement set is uploaded, versioned or withdrawn. */
export const substanceKeys = {
  all: ['substances'] as const,
  list: () => [...substanceKeys.all, 'list'] as const,
  detail: (id: number) => [...substanceKeys.all, 'detail', id] as const,
};
