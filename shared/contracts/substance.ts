/**
 * Contract of a substance: the answers of /api/substances (list, detail, create, edit).
 * Built in server/features/substances/substances.view.ts; the row's molarMassGramsPerMol is molarMassGPerMol here.
 */
import { z } from 'zod';
import { propertyKindSchema } from '../schemas/measurements';
import { measurementSetSummaryView } from './measurement-set';

export const substanceView = z.strictObject({
  id: z.number().int(),
  name: z.string(),
  formula: z.string().nullable(),
  description: z.string().nullable(),
  molarMassGPerMol: z.number(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Substance = z.infer<typeof substanceView>;

/** A list entry; counts of measurement sets only for roles that may read them. */
export const substanceListItemView = substanceView.extend({
  measurementSetCount: z.number().int().optional(),
  kinds: z.array(propertyKindSchema).optional(),
});
export type SubstanceListItem = z.infer<typeof substanceListItemView>;
export const substanceListView = z.strictObject({ substances: z.array(substanceListItemView) });

/** GET /api/substances/:id: measurement sets only for roles that may read them. */
export const substanceDetailView = substanceView.extend({
  createdByName: z.string(),
  measurementSets: z.array(measurementSetSummaryView).optional(),
});
export type SubstanceDetail = z.infer<typeof substanceDetailView>;

/** 201/200 of a create or an edit, with plausibility warnings on the molar mass. */
export const substanceWriteView = substanceView.extend({ warnings: z.array(z.string()) });
export type SubstanceWrite = z.infer<typeof substanceWriteView>;
