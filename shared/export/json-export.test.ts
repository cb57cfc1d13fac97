import { describe, expect, it } from 'vitest';
import { mixtureDocument, parameterSetDocument, parameterSetJsonText, mixtureJsonText, PARAMETER_SET_FORMAT_ID } from './json-export';
import { MIXTURE_JSON_SCHEMA, PARAMETER_SET_JSON_SCHEMA, type JsonSchema } from './json-schema';
import { checkJsonSchema } from './json-schema-check';
import { brindleShifted, oskaneShifted, oskaneTail, tarrowFull } from './export-test-sets';
import { combine } from '../mixing/combining-rules';

// The caution text exactly as the product brief words it.
const CAUTION =
  'Fitted model parameters, not validated property data for pressure, safety or process design; defer to local codes and licensed engineering practice.';

describe('parameter set JSON (epsigma.parameter-set/1)', () => {
  it('validates against the published schema for every scheme, with and without optional data', () => {
    for (const set of [brindleShifted, oskaneTail, tarrowFull]) {
      expect(checkJsonSchema(PARAMETER_SET_JSON_SCHEMA, JSON.parse(parameterSetJsonText(set)))).toEqual([]);
    }
  });

  it('carries id, version, approval, format id and the exact caution text', () => {
    const doc = parameterSetDocument(brindleShifted);
    expect(doc.format).toBe('epsigma.parameter-set/1');
    expect(doc.parameterSet).toEqual({
      id: 12,
      version: 3,
      state: 'approved',
      approvedAt: '2026-11-30T10:00:00Z',
      approvedBy: 'R. Ostrova',
    });
    expect(doc.caution).toBe(CAUTION);
    expect(doc.provenance.fitId).toBe(7);
    expect(doc.provenance.datasets[1]).toEqual({
      id: 5,
      version: 1,
      kind: 'viscosity',
      name: 'Brindle gas dilute-gas viscosity',
      source: null,
      doi: '10.0000/quillmoor.example.5',
    });
  });

  it('converts ε and σ with CODATA 2018 values', () => {
    const p = parameterSetDocument(brindleShifted).parameters;
    // R = 8.314462618 J/(mol K) and k_B/e = 8.617333262e-5 eV/K (CODATA 2018, NIST reference on constants,
    // both exact since the 2019 SI); thermochemical calorie 4.184 J (NIST SP 811, B.8).
    expect(p.epsilonKJPerMol).toBeCloseTo((127.5 * 8.314462618) / 1000, 10);
    expect(p.epsilonKcalPerMol).toBeCloseTo((127.5 * 8.314462618) / 4184, 10);
    expect(p.epsilonEV).toBeCloseTo(127.5 * 8.617333262e-5, 12);
    expect(p.sigmaNm).toBe(0.342);
    const u = parameterSetDocument(brindleShifted).uncertainties;
    expect(u.epsilonStdErrKJPerMol).toBeCloseTo((0.4 * 8.314462618) / 1000, 12);
    expect(u.sigmaStdErrNm).toBe(0.0003); // no binary round-off tail in the export
    expect(u.correlationEpsilonSigma).toBe(-0.82);
  });

  it('gives the cutoff in σ, Å and nm, and nulls for the full potential', () => {
    expect(parameterSetDocument(brindleShifted).cutoff).toMatchObject({
      scheme: 'truncated-shifted',
      cutoffSigma: 2.5,
      cutoffAngstrom: 8.55,
      cutoffNm: 0.855,
    });
    expect(parameterSetDocument(tarrowFull).cutoff).toMatchObject({
      scheme: 'full-potential',
      cutoffSigma: null,
      cutoffAngstrom: null,
      cutoffNm: null,
    });
    expect(parameterSetDocument(oskaneTail).validity).toEqual({
      temperatureMinK: 120,
      temperatureMaxK: 400,
      pressureMinMPa: null,
      pressureMaxMPa: null,
    });
    expect(parameterSetDocument(oskaneTail).uncertainties.epsilonStdErrEV).toBeNull();
  });

  it('is plain JSON: text parses back to the document', () => {
    expect(JSON.parse(parameterSetJsonText(brindleShifted))).toEqual(parameterSetDocument(brindleShifted));
  });
});

describe('mixture JSON (epsigma.mixture/1)', () => {
  it('validates against its schema and lists every pair with its kind', () => {
    const doc = JSON.parse(mixtureJsonText([brindleShifted, oskaneShifted, tarrowFull], 'waldman-hagler'));
    expect(checkJsonSchema(MIXTURE_JSON_SCHEMA, doc)).toEqual([]);
    expect(doc.pairs).toHaveLength(6);
    expect(doc.pairs.map((p: { i: number; j: number; kind: string }) => `${p.i}-${p.j}:${p.kind}`)).toEqual([
      '1-1:pure',
      '1-2:combining-rule-estimate',
      '1-3:combining-rule-estimate',
      '2-2:pure',
      '2-3:combining-rule-estimate',
      '3-3:pure',
    ]);
    expect(doc.pairs[1].epsilonK).toBeCloseTo(combine('waldman-hagler', brindleShifted, oskaneShifted).epsilonK, 12);
    expect(doc.note).toContain('not fitted');
    expect(doc.caution).toBe(CAUTION);
  });

  it('reports the common validity range and whether the cutoff treatments agree', () => {
    const same = mixtureDocument([brindleShifted, oskaneShifted], 'kong');
    expect(same.commonValidity).toEqual({ temperatureMinK: 120, temperatureMaxK: 300, pressureMinMPa: 0.5, pressureMaxMPa: 10 });
    expect(same.cutoff).toEqual({ scheme: 'truncated-shifted', cutoffSigma: 2.5, consistent: true, warning: null });
    const mixed = mixtureDocument([brindleShifted, tarrowFull], 'kong');
    expect(mixed.commonValidity).toEqual({ temperatureMinK: 200, temperatureMaxK: 300, pressureMinMPa: null, pressureMaxMPa: null });
    expect(mixed.cutoff.consistent).toBe(false);
    expect(mixed.cutoff.warning).toContain('different cutoff treatments');
    expect(checkJsonSchema(MIXTURE_JSON_SCHEMA, mixed)).toEqual([]);
  });

  it('gives null common validity when the temperature ranges do not overlap', () => {
    const hot = { ...oskaneShifted, id: 30, validity: { temperatureMinK: 400, temperatureMaxK: 600 } };
    const doc = mixtureDocument([brindleShifted, hot], 'lorentz-berthelot');
    expect(doc.commonValidity).toBeNull();
    expect(checkJsonSchema(MIXTURE_JSON_SCHEMA, doc)).toEqual([]);
  });
});

describe('the published schemas', () => {
  it('are draft 2020-12 documents with URN ids', () => {
    expect(PARAMETER_SET_JSON_SCHEMA.$schema).toBe('https://json-schema.org/draft/2020-12/schema');
    expect(PARAMETER_SET_JSON_SCHEMA.$id).toBe('urn:epsigma:schema:parameter-set:1');
    expect(MIXTURE_JSON_SCHEMA.$id).toBe('urn:epsigma:schema:mixture:1');
    expect((PARAMETER_SET_JSON_SCHEMA.properties as Record<string, JsonSchema>).format.const).toBe(PARAMETER_SET_FORMAT_ID);
  });

  it('close every object: any property the schema does not list makes a document invalid', () => {
    const doc = JSON.parse(parameterSetJsonText(brindleShifted));
    doc.parameters.epsilon = 1; // a unit-less name must never slip in
    expect(checkJsonSchema(PARAMETER_SET_JSON_SCHEMA, doc)).toEqual([{ path: '/parameters/epsilon', message: 'no value is allowed here' }]);
  });

  it('reject documents that break it, each with a pointer to the value', () => {
    const base = () => JSON.parse(parameterSetJsonText(brindleShifted));
    const cases: Array<[string, (d: ReturnType<typeof base>) => void, { path: string; message: string }]> = [
      ['missing field', (d) => delete d.caution, { path: '', message: 'missing required property "caution"' }],
      ['changed caution', (d) => (d.caution = 'use freely'), { path: '/caution', message: `must equal ${JSON.stringify(CAUTION)}` }],
      [
        'other format version',
        (d) => (d.format = 'epsigma.parameter-set/2'),
        { path: '/format', message: 'must equal "epsigma.parameter-set/1"' },
      ],
      [
        'unknown scheme',
        (d) => (d.cutoff.scheme = 'cut'),
        { path: '/cutoff/scheme', message: 'must be one of "full-potential", "truncated-tail", "truncated-shifted"' },
      ],
      ['negative ε', (d) => (d.parameters.epsilonK = -1), { path: '/parameters/epsilonK', message: 'must be ≥ 0' }],
      [
        'correlation above 1',
        (d) => (d.uncertainties.correlationEpsilonSigma = 1.2),
        { path: '/uncertainties/correlationEpsilonSigma', message: 'must be ≤ 1' },
      ],
      [
        'string for number',
        (d) => (d.parameters.sigmaAngstrom = '3.4'),
        { path: '/parameters/sigmaAngstrom', message: 'expected number, got string' },
      ],
      [
        'null where required number',
        (d) => (d.parameters.sigmaNm = null),
        { path: '/parameters/sigmaNm', message: 'expected number, got null' },
      ],
      ['fractional id', (d) => (d.parameterSet.id = 1.5), { path: '/parameterSet/id', message: 'expected integer, got number' }],
      [
        'bad item in list',
        (d) => delete d.provenance.datasets[1].doi,
        { path: '/provenance/datasets/1', message: 'missing required property "doi"' },
      ],
      [
        'list replaced by object',
        (d) => (d.provenance.datasets = {}),
        { path: '/provenance/datasets', message: 'expected array, got object' },
      ],
    ];
    for (const [name, breakIt, problem] of cases) {
      const d = base();
      breakIt(d);
      expect(checkJsonSchema(PARAMETER_SET_JSON_SCHEMA, d), name).toEqual([problem]);
    }
  });
});

describe('checkJsonSchema (Ajv, draft 2020-12) follows JSON Schema 2020-12 semantics', () => {
  it('"integer" accepts any number with a zero fractional part (Validation 2020-12 §6.1.1)', () => {
    expect(checkJsonSchema({ type: 'integer' }, 1.0)).toEqual([]);
    expect(checkJsonSchema({ type: 'integer' }, 1.25)).toHaveLength(1);
  });

  it('"minimum" is inclusive and numeric keywords ignore other types (Validation 2020-12 §6.2.4, §6.2)', () => {
    expect(checkJsonSchema({ minimum: 0 }, 0)).toEqual([]);
    expect(checkJsonSchema({ minimum: 0 }, -1e-300)).toHaveLength(1);
    expect(checkJsonSchema({ minimum: 0 }, 'text')).toEqual([]);
  });

  it('"const" and "enum" compare in the JSON data model (Core 2020-12 §4.2.2)', () => {
    expect(checkJsonSchema({ const: { a: 1, b: [1, 2] } }, { b: [1, 2], a: 1 })).toEqual([]);
    expect(checkJsonSchema({ const: [1, 2] }, [2, 1])).toHaveLength(1);
    expect(checkJsonSchema({ enum: [null, 'x'] }, null)).toEqual([]);
    expect(checkJsonSchema({ enum: [1] }, '1')).toHaveLength(1);
  });

  it('"additionalProperties" only sees members "properties" does not name (Core 2020-12 §10.3.2.3)', () => {
    const schema = { type: 'object', properties: { a: { type: 'number' } }, additionalProperties: { type: 'string' } };
    expect(checkJsonSchema(schema, { a: 1, b: 'x' })).toEqual([]);
    expect(checkJsonSchema(schema, { a: 1, b: 2 })).toEqual([{ path: '/b', message: 'expected string, got number' }]);
  });

  it('escapes "/" and "~" in JSON Pointers (RFC 6901 §3)', () => {
    expect(checkJsonSchema({ type: 'object', additionalProperties: false }, { 'a/b~c': 1 })).toEqual([
      { path: '/a~1b~0c', message: 'no value is allowed here' },
    ]);
  });

  it('refuses schemas with a keyword JSON Schema 2020-12 does not define (Ajv strictSchema), so no typo is silently skipped', () => {
    expect(() => checkJsonSchema({ type: 'string', patern: '^a' }, 'a')).toThrow('unknown keyword: "patern"');
  });
});
