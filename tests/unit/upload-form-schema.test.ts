import { describe, expect, it } from 'vitest';
import {
  uploadFormPathOf,
  uploadFormSchema,
  type UploadFormValues,
} from '../../src/features/measurement-sets/components/upload-form-schema';

// The upload wizard's fields → the fields stored with the upload, judged by the server's own schema.
const values = (patch: Partial<UploadFormValues> = {}): UploadFormValues => ({
  file: null,
  kind: '',
  detectedKind: 'b2',
  delimiter: '',
  decimal: '',
  relPercent: '1',
  mapping: null,
  name: ' QG-1 B2 ',
  source: 'Fenwick Thermophysics Laboratory, invented run 3',
  doi: '',
  method: '',
  notes: '',
  ...patch,
});

describe('upload form schema', () => {
  it('a new set: trimmed name, the detected kind, the percentage as a fraction, blank optional fields left out', () => {
    const out = uploadFormSchema(4, false).parse(values({ relPercent: '1,5', doi: 'https://doi.org/10.1000/epsigma.3' }));
    expect(out.fields).toEqual({
      defaultRelativeUncertainty: 0.015,
      source: 'Fenwick Thermophysics Laboratory, invented run 3',
      doi: '10.1000/epsigma.3',
      method: undefined,
      notes: undefined,
      name: 'QG-1 B2',
    });
  });

  it('puts the server schema’s complaints on the wizard’s fields', () => {
    const bad = uploadFormSchema(4, false).safeParse(values({ name: '  ', relPercent: '150', doi: 'not a doi', detectedKind: '' }));
    expect(bad.error!.issues.map((i) => [i.path.join('.'), i.message])).toEqual([
      ['doi', 'expected a DOI such as 10.1063/1.1234567'],
      ['relPercent', 'default relative uncertainty must be at most 1 (100 %)'],
      ['kind', expect.any(String)],
      ['name', 'name is required'],
    ]);
  });

  it('a new version needs no name or kind', () => {
    expect(uploadFormSchema(4, true).parse(values({ name: '', detectedKind: '' })).fields).not.toHaveProperty('name');
    expect(uploadFormPathOf('defaultRelativeUncertainty')).toBe('relPercent');
    expect(uploadFormPathOf('property')).toBe('kind');
  });
});
