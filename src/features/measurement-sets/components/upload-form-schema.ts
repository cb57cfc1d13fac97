import { z } from 'zod';
import type { ColumnMapping } from '@shared/measurements/headers';
import { PROPERTY_KIND_IDS, type PropertyKind } from '@shared/measurements/property-kinds';
import { measurementSetUploadFields, measurementSetVersionFields } from '@shared/schemas/measurements';

export type Delimiter = '' | ',' | ';' | '\t';
export type DecimalSeparator = '' | '.' | ',';

/** What the upload wizard holds: the file, how to read it (detect or fixed), and the fields stored with the version. */
export interface UploadFormValues {
  file: File | null;
  kind: PropertyKind | '';
  /** The kind the preview read from the headers (set by the wizard, not typed). */
  detectedKind: PropertyKind | '';
  delimiter: Delimiter;
  decimal: DecimalSeparator;
  /** In percent, as typed (a decimal comma is accepted). */
  relPercent: string;
  /** Columns mapped by hand; null: as the headers say. */
  mapping: ColumnMapping | null;
  name: string;
  source: string;
  doi: string;
  method: string;
  notes: string;
}

/** The fields the server stores with an upload, judged by its own schema. */
export type UploadFields = {
  defaultRelativeUncertainty?: number;
  source?: string;
  doi?: string;
  method?: string;
  notes?: string;
  name?: string;
};

/** A percentage as typed ('1,5' is 1.5) as a fraction; NaN for empty or non-numeric text. */
export const relativeFromPercent = (s: string) => (s.trim() === '' ? Number.NaN : Number(s.trim().replace(',', '.')) / 100);

const formShape = z.object({
  file: z.custom<File | null>((v) => v === null || (typeof File !== 'undefined' && v instanceof File)),
  kind: z.enum(['', ...PROPERTY_KIND_IDS] as ['', ...PropertyKind[]]),
  detectedKind: z.enum(['', ...PROPERTY_KIND_IDS] as ['', ...PropertyKind[]]),
  delimiter: z.enum(['', ',', ';', '\t']),
  decimal: z.enum(['', '.', ',']),
  relPercent: z.string(),
  mapping: z.custom<ColumnMapping | null>(),
  name: z.string(),
  source: z.string(),
  doi: z.string(),
  method: z.string(),
  notes: z.string(),
});

/** Request field → form field, where they differ. */
const FORM_FIELD: Record<string, string> = { defaultRelativeUncertainty: 'relPercent', property: 'kind' };
export const uploadFormPathOf = (field: string) => FORM_FIELD[field.split('.')[0]] ?? field.split('.')[0];

/**
 * The wizard's schema: the form values become the stored fields, which the server's schema (new set or new version)
 * judges; a complaint lands on the field it names. The file, delimiter, decimal and mapping are judged by the
 * preview, which runs the server's parser.
 */
export function uploadFormSchema(substanceId: number, existing: boolean) {
  return formShape.transform((v, ctx) => {
    const fields = {
      source: v.source,
      doi: v.doi,
      method: v.method,
      notes: v.notes,
      defaultRelativeUncertainty: relativeFromPercent(v.relPercent),
      ...(existing ? {} : { substanceId, kind: v.kind || v.detectedKind || undefined, name: v.name }),
    };
    const judged = (existing ? measurementSetVersionFields : measurementSetUploadFields).safeParse(fields);
    if (!judged.success) {
      for (const issue of judged.error.issues) {
        const field = uploadFormPathOf(issue.path.map(String).join('.') || 'root');
        ctx.addIssue({ code: 'custom', path: field === 'root' ? ['root', 'request'] : [field], message: issue.message });
      }
      return z.NEVER;
    }
    const d = judged.data as UploadFields;
    return {
      ...v,
      fields: {
        defaultRelativeUncertainty: d.defaultRelativeUncertainty,
        source: d.source,
        doi: d.doi,
        method: d.method,
        notes: d.notes,
        ...(existing ? {} : { name: d.name }),
      },
    };
  });
}
