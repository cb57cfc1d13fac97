/**
 * JSON Schemas (draft 2020-12) of Epsigma's export formats, published by the server so that consumers can
 * validate what they download. json-schema-check.ts checks documents against them with Ajv (draft 2020-12, strict);
 * they use the keywords type, required, properties, additionalProperties, items, enum, const, minimum, maximum.
 * The $id values are URNs: they name the format version, they are not addresses to fetch.
 */
import { COMBINING_RULES } from '../mixing/combining-rules';
import { CUTOFF_SCHEMES } from '../physics/cutoff-schemes';
import { CAUTION_TEXT } from './export-common';
import { MIXTURE_FORMAT_ID, PARAMETER_SET_FORMAT_ID } from './json-export';

export type JsonSchema = { [keyword: string]: unknown };

const DRAFT = 'https://json-schema.org/draft/2020-12/schema';

const num = (description: string, extra: JsonSchema = {}): JsonSchema => ({ type: 'number', description, ...extra });
const numOrNull = (description: string, extra: JsonSchema = {}): JsonSchema => ({ type: ['number', 'null'], description, ...extra });
const int = (description: string, minimum = 1): JsonSchema => ({ type: 'integer', minimum, description });
const str = (description: string): JsonSchema => ({ type: 'string', description });
const strOrNull = (description: string): JsonSchema => ({ type: ['string', 'null'], description });

/** A closed object: every listed property required, nothing else allowed. */
function closed(properties: Record<string, JsonSchema>, description?: string): JsonSchema {
  return {
    type: 'object',
    ...(description ? { description } : {}),
    required: Object.keys(properties),
    properties,
    additionalProperties: false,
  };
}

const energyFields = (what: string): Record<string, JsonSchema> => ({
  epsilonK: num(`${what}: well depth ε/k_B in K`, { minimum: 0 }),
  epsilonKJPerMol: num(`${what}: ε in kJ/mol (ε/k_B · R, CODATA 2018)`, { minimum: 0 }),
  epsilonKcalPerMol: num(`${what}: ε in kcal/mol (thermochemical calorie, 4.184 J)`, { minimum: 0 }),
  epsilonEV: num(`${what}: ε in eV per particle (ε/k_B · k_B/e)`, { minimum: 0 }),
});

const lengthFields = (what: string): Record<string, JsonSchema> => ({
  sigmaAngstrom: num(`${what}: σ (zero crossing of the potential) in Å`, { minimum: 0 }),
  sigmaNm: num(`${what}: σ in nm`, { minimum: 0 }),
});

const validity = closed(
  {
    temperatureMinK: num('lowest temperature of the fitted data the set is meant for, K', { minimum: 0 }),
    temperatureMaxK: num('highest temperature, K', { minimum: 0 }),
    pressureMinMPa: numOrNull('lowest pressure, MPa; null when not stated', { minimum: 0 }),
    pressureMaxMPa: numOrNull('highest pressure, MPa; null when not stated', { minimum: 0 }),
  },
  'range of states the parameters were fitted for',
);

const caution = { const: CAUTION_TEXT, description: 'fixed caution text carried by every export' };
const scheme = { enum: [...CUTOFF_SCHEMES], description: 'cutoff treatment the parameters were fitted for' };

export const PARAMETER_SET_JSON_SCHEMA: JsonSchema = {
  $schema: DRAFT,
  $id: 'urn:epsigma:schema:parameter-set:1',
  title: 'Epsigma parameter set export, version 1',
  description: 'One Lennard-Jones 12-6 parameter set; units are part of every field name.',
  ...closed({
    format: { const: PARAMETER_SET_FORMAT_ID, description: 'format id and version' },
    parameterSet: closed({
      id: int('parameter set id'),
      version: int('version of the set (v1, v2 …)'),
      state: str('review state at export time, e.g. "approved"'),
      approvedAt: strOrNull('approval time, ISO 8601; null when never approved'),
      approvedBy: strOrNull('approving reviewer; null when never approved'),
    }),
    substance: closed({
      id: int('substance id'),
      name: str('substance name'),
      formula: strOrNull('chemical formula, if known'),
      molarMassGPerMol: num('molar mass, g/mol', { minimum: 0 }),
    }),
    model: { enum: ['lj-12-6', 'mie'], description: 'potential model: LJ 12-6 or Mie λr-6' },
    repulsiveExponent: num('repulsive exponent λr of the potential (12 for LJ 12-6)', { minimum: 8, maximum: 36 }),
    potentialForm: str('the potential the parameters belong to'),
    parameters: closed({ ...energyFields('fitted'), ...lengthFields('fitted') }),
    uncertainties: closed({
      kind: { const: 'standard-error', description: 'one standard error from the fit covariance' },
      epsilonStdErrK: numOrNull('standard error of ε/k_B, K', { minimum: 0 }),
      epsilonStdErrKJPerMol: numOrNull('standard error of ε, kJ/mol', { minimum: 0 }),
      epsilonStdErrKcalPerMol: numOrNull('standard error of ε, kcal/mol', { minimum: 0 }),
      epsilonStdErrEV: numOrNull('standard error of ε, eV', { minimum: 0 }),
      sigmaStdErrAngstrom: numOrNull('standard error of σ, Å', { minimum: 0 }),
      sigmaStdErrNm: numOrNull('standard error of σ, nm', { minimum: 0 }),
      correlationEpsilonSigma: numOrNull('correlation coefficient of the ε and σ estimates', { minimum: -1, maximum: 1 }),
    }),
    cutoff: closed({
      scheme,
      description: str('the scheme in words'),
      cutoffSigma: numOrNull('cutoff radius rc/σ for truncated schemes; null for the full potential', { minimum: 0 }),
      cutoffAngstrom: numOrNull('rc in Å', { minimum: 0 }),
      cutoffNm: numOrNull('rc in nm', { minimum: 0 }),
    }),
    validity,
    provenance: closed({
      fitId: int('fit the parameters were frozen from'),
      datasets: {
        type: 'array',
        description: 'measurement sets (with version) the fit used',
        items: closed({
          id: int('measurement set id'),
          version: int('measurement set version'),
          kind: str('property measured, e.g. "b2", "density", "viscosity"'),
          name: str('measurement set name'),
          source: strOrNull('where the values come from'),
          doi: strOrNull('DOI of the source'),
        }),
      },
    }),
    caution,
  }),
};

export const MIXTURE_JSON_SCHEMA: JsonSchema = {
  $schema: DRAFT,
  $id: 'urn:epsigma:schema:mixture:1',
  title: 'Epsigma mixture export, version 1',
  description: 'Pure-species LJ 12-6 parameters from approved sets and cross parameters from a combining rule.',
  ...closed({
    format: { const: MIXTURE_FORMAT_ID, description: 'format id and version' },
    combiningRule: closed({
      id: { enum: [...COMBINING_RULES], description: 'combining rule id' },
      name: str('rule name'),
      formulas: str('the formulas in plain text'),
      reference: str('published source of the rule'),
    }),
    note: str('cross parameters are combining-rule estimates, not fitted'),
    components: {
      type: 'array',
      description: 'the parameter sets, in atom-type order',
      items: closed({
        index: int('1-based component index (engine atom type)'),
        parameterSetId: int('parameter set id'),
        version: int('parameter set version'),
        state: str('review state at export time'),
        approvedAt: strOrNull('approval time, ISO 8601'),
        substanceName: str('substance name'),
        formula: strOrNull('chemical formula'),
        molarMassGPerMol: num('molar mass, g/mol', { minimum: 0 }),
        epsilonK: num('ε/k_B, K', { minimum: 0 }),
        sigmaAngstrom: num('σ, Å', { minimum: 0 }),
        scheme,
        cutoffSigma: numOrNull('rc/σ the set was fitted for', { minimum: 0 }),
      }),
    },
    pairs: {
      type: 'array',
      description: 'every pair i ≤ j',
      items: closed({
        i: int('first component index (1-based)'),
        j: int('second component index (1-based), j ≥ i'),
        parameterSetIdI: int('parameter set of component i'),
        parameterSetIdJ: int('parameter set of component j'),
        kind: {
          enum: ['pure', 'combining-rule-estimate', 'fitted-pair-set'],
          description: 'pure pair from a fit, a cross-pair estimate, or a cross pair from an approved pair set (k_ij fitted to B12 data)',
        },
        ...energyFields('pair'),
        ...lengthFields('pair'),
      }),
    },
    commonValidity: {
      type: ['object', 'null'],
      description: 'intersection of the components’ validity ranges; null when they do not overlap',
      required: ['temperatureMinK', 'temperatureMaxK', 'pressureMinMPa', 'pressureMaxMPa'],
      properties: validity.properties,
      additionalProperties: false,
    },
    cutoff: closed({
      scheme,
      cutoffSigma: num('rc/σ_ij used for every pair in the engine fragments', { minimum: 0 }),
      consistent: { type: 'boolean', description: 'false when the components were fitted for different cutoff treatments' },
      warning: strOrNull('explanation when not consistent'),
    }),
    caution,
  }),
};
