/**
 * OpenAPI 3.1 description of the read routes that personal API tokens reach, written by hand as a typed
 * object. Query parameters come from the zod schemas the routes validate with (z.toJSONSchema, input side),
 * and the export documents reference the published JSON Schemas, so the description cannot drift from them.
 */
import { z } from 'zod';
import { COMBINING_RULES } from '../../../shared/mixing/combining-rules';
import { EXPORT_FORMATS } from '../../../shared/export/parameter-set-export';
import { MIXTURE_JSON_SCHEMA, PARAMETER_SET_JSON_SCHEMA } from '../../../shared/export/json-schema';
import { PROPERTY_KIND_IDS } from '../../../shared/measurements/property-kinds';
import { ENERGY_UNITS, LENGTH_UNITS } from '../../../shared/physics/parameter-units';
import { CUTOFF_SCHEMES } from '../../../shared/physics/cutoff-schemes';
import { catalogQuery, mixtureQuery } from '../../../shared/schemas/catalog';

type Json = { [key: string]: unknown };

interface OpenApiParameter {
  name: string;
  in: 'query' | 'path';
  required?: boolean;
  description: string;
  schema: Json;
}

interface OpenApiOperation {
  operationId: string;
  summary: string;
  description?: string;
  security?: Array<Record<string, string[]>>;
  parameters?: OpenApiParameter[];
  responses: Record<string, { description: string; content?: Record<string, { schema: Json }>; headers?: Record<string, Json> }>;
}

export interface OpenApiDocument {
  openapi: '3.1.0';
  info: { title: string; version: string; description: string };
  servers: Array<{ url: string }>;
  security: Array<Record<string, string[]>>;
  paths: Record<string, { get: OpenApiOperation }>;
  components: { securitySchemes: Record<string, Json>; schemas: Record<string, Json> };
}

/** A query parameter's schema, from the route's own zod object (input side: what the client sends). */
function queryParameter(shape: z.ZodObject, name: string, description: string, required = false): OpenApiParameter {
  const field = (shape.shape as Record<string, z.ZodType>)[name];
  const schema = z.toJSONSchema(field, { io: 'input', unrepresentable: 'any' }) as Json;
  delete schema.$schema;
  return { name, in: 'query', required, description, schema };
}

const errorResponse = (description: string) => ({
  description,
  content: { 'application/json': { schema: { $ref: '#/components/schemas/Error' } } },
});
const idParameter: OpenApiParameter = {
  name: 'id',
  in: 'path',
  required: true,
  description: 'parameter set id',
  schema: { type: 'integer', minimum: 1 },
};
const fileResponse = (what: string) => ({
  description: `${what} as a file (Content-Disposition: attachment). JSON follows the published schema; CSV is RFC 4180 with units in the headers; the LAMMPS and GROMACS fragments are plain text.`,
  headers: { 'Content-Disposition': { schema: { type: 'string' }, description: 'attachment; filename="…"' } },
  content: {
    'application/json': { schema: { type: 'object' } },
    'text/csv': { schema: { type: 'string' } },
    'text/plain': { schema: { type: 'string' } },
  },
});
const num = (description: string) => ({ type: 'number', description });
const numOrNull = (description: string) => ({ type: ['number', 'null'], description });
const str = (description: string) => ({ type: 'string', description });
const strOrNull = (description: string) => ({ type: ['string', 'null'], description });

const secured: Array<Record<string, string[]>> = [{ bearerToken: [] }, { sessionCookie: [] }];

export function openApiDocument(): OpenApiDocument {
  const catalogShape = catalogQuery as unknown as z.ZodObject;
  return {
    openapi: '3.1.0',
    info: {
      title: 'Epsigma catalog and export API',
      version: '1',
      description:
        'Read-only access to approved Lennard-Jones 12-6 parameter sets: the catalog, exports, combining-rule mixtures and the JSON Schemas of the export formats. ' +
        'Authenticate with a personal API token (`Authorization: Bearer …`, created on the Tokens page) or a signed-in session. Tokens reach only the operations listed here and only with GET; ' +
        'any other route or method answers 403. ε is ε/k_B in K and σ in Å unless a field name says otherwise. ' +
        'Names follow one vocabulary: a measurement set (not dataset) has a kind (not property), people (not users), units in field names ' + // vocabulary: keep
        '(molarMassGPerMol, pressureMinMPa). Requests written with the earlier names are still accepted and answered with the new ones: ' +
        'the routes /api/datasets/…, /api/users/… and /api/simulations/from-dataset, ' + // vocabulary: keep
        'and the request fields datasets, datasetId, property and molarMass. ' + // vocabulary: keep
        'Fitted model parameters are not validated property data for pressure, safety or process design; defer to local codes and licensed engineering practice.',
    },
    servers: [{ url: '/api' }],
    security: secured,
    paths: {
      '/catalog': {
        get: {
          operationId: 'searchCatalog',
          summary: 'Approved parameter sets, one row per current approved version',
          parameters: [
            queryParameter(catalogShape, 'q', 'substance name or formula contains this text (case-insensitive)'),
            queryParameter(catalogShape, 'scheme', 'cutoff scheme the set was fitted for'),
            {
              name: 'kind',
              in: 'query',
              description: `comma-separated data kinds that must all be behind the set (${PROPERTY_KIND_IDS.join(', ')})`,
              schema: { type: 'string' },
            },
            queryParameter(catalogShape, 'tMinK', 'keep sets whose validity reaches up to at least this temperature (K)'),
            queryParameter(catalogShape, 'tMaxK', 'keep sets whose validity starts at or below this temperature (K)'),
          ],
          responses: {
            '200': {
              description: 'matching sets',
              content: {
                'application/json': {
                  schema: {
                    type: 'object',
                    required: ['sets'],
                    properties: { sets: { type: 'array', items: { $ref: '#/components/schemas/CatalogEntry' } } },
                  },
                },
              },
            },
            '400': errorResponse('a query parameter is invalid (details name each field)'),
            '401': errorResponse('no session and no valid token'),
          },
        },
      },
      '/catalog/{id}': {
        get: {
          operationId: 'parameterCard',
          summary: 'One published parameter set with its approval, measurement sets, fit statistics and versions',
          parameters: [idParameter],
          responses: {
            '200': {
              description: 'the parameter card',
              content: { 'application/json': { schema: { $ref: '#/components/schemas/CatalogEntry' } } },
            },
            '401': errorResponse('no session and no valid token'),
            '404': errorResponse('no published set with this id'),
          },
        },
      },
      '/parameter-sets/{id}/export': {
        get: {
          operationId: 'exportParameterSet',
          summary: 'One approved or superseded parameter set as a file',
          parameters: [
            idParameter,
            {
              name: 'format',
              in: 'query',
              required: true,
              description: 'file format',
              schema: { type: 'string', enum: [...EXPORT_FORMATS] },
            },
            {
              name: 'units',
              in: 'query',
              description: `extra CSV columns: at most one of ${ENERGY_UNITS.join(', ')} and one of ${LENGTH_UNITS.join(', ')} (A for Å), comma-separated`,
              schema: { type: 'string' },
            },
          ],
          responses: {
            '200': fileResponse('the set'),
            '400': errorResponse('bad format or units'),
            '401': errorResponse('no session and no valid token'),
            '404': errorResponse('no such set (or not visible to you)'),
            '409': errorResponse('the set is not approved or superseded'),
          },
        },
      },
      '/parameter-sets/{id}/predictions': {
        get: {
          operationId: 'predictParameterSet',
          summary:
            'B2, dilute-gas viscosity or density predicted by an approved or superseded set at your own states, with the propagated uncertainty and a mark outside the validity range',
          parameters: [
            idParameter,
            {
              name: 'kind',
              in: 'query',
              required: true,
              description: 'kind of the predicted quantity',
              schema: { type: 'string', enum: ['b2', 'viscosity', 'density'] },
            },
            {
              name: 'temperaturesK',
              in: 'query',
              required: true,
              description: 'comma-separated temperatures in K (1–200)',
              schema: { type: 'string', examples: ['150,200,300'] },
            },
            {
              name: 'pressuresMPa',
              in: 'query',
              description: 'for densities: one pressure in MPa per temperature, comma-separated',
              schema: { type: 'string' },
            },
          ],
          responses: {
            '200': {
              description:
                'one prediction per state: value, standardError, lower95, upper95 (in unit), intervalMethod, outsideValidity and a note when outside',
              content: {
                'application/json': {
                  schema: {
                    type: 'object',
                    required: ['parameterSetId', 'kind', 'unit', 'predictions'],
                    properties: {
                      parameterSetId: { type: 'integer' },
                      kind: { type: 'string' },
                      unit: { type: 'string' },
                      method: { type: 'string' },
                      predictions: { type: 'array', items: { type: 'object' } },
                    },
                  },
                },
              },
            },
            '400': errorResponse('bad query'),
            '401': errorResponse('no session and no valid token'),
            '404': errorResponse('no such set (or not visible to you)'),
            '409': errorResponse('the set is not approved or superseded'),
            '422': errorResponse('the property has no model for this set (e.g. viscosity of a Mie set) or cannot be evaluated at a state'),
          },
        },
      },
      '/mixtures': {
        get: {
          operationId: 'mixture',
          summary: 'Pure and cross pairs of several sets under a combining rule; cross pairs are estimates, not fitted values',
          parameters: [
            {
              name: 'sets',
              in: 'query',
              required: true,
              description: 'comma-separated ids of 2–12 approved or superseded sets, in component order',
              schema: { type: 'string', examples: ['3,7'] },
            },
            queryParameter(mixtureQuery as unknown as z.ZodObject, 'rule', 'combining rule', true),
            {
              name: 'format',
              in: 'query',
              description: 'omit for the JSON table; give a format for a file',
              schema: { type: 'string', enum: [...EXPORT_FORMATS] },
            },
            { name: 'units', in: 'query', description: 'extra CSV columns, as for the set export', schema: { type: 'string' } },
          ],
          responses: {
            '200': {
              description: 'the pair table (no format) or the file (with format)',
              content: {
                'application/json': { schema: { $ref: '#/components/schemas/Mixture' } },
                'text/csv': { schema: { type: 'string' } },
                'text/plain': { schema: { type: 'string' } },
              },
            },
            '400': errorResponse('bad query (fewer than two sets, a set twice, unknown rule or format)'),
            '401': errorResponse('no session and no valid token'),
            '404': errorResponse('a set does not exist (or is not visible to you)'),
            '409': errorResponse('a set is not approved or superseded'),
          },
        },
      },
      '/schemas/{name}': {
        get: {
          operationId: 'exportSchema',
          summary: 'JSON Schema (draft 2020-12) of an export format; public',
          security: [],
          parameters: [
            {
              name: 'name',
              in: 'path',
              required: true,
              description: 'schema file',
              schema: { type: 'string', enum: ['parameter-set-1.json', 'mixture-1.json'] },
            },
          ],
          responses: {
            '200': { description: 'the schema', content: { 'application/schema+json': { schema: { type: 'object' } } } },
            '404': errorResponse('no such schema'),
          },
        },
      },
      '/openapi.json': {
        get: {
          operationId: 'openApi',
          summary: 'This document; public',
          security: [],
          responses: { '200': { description: 'OpenAPI 3.1 document', content: { 'application/json': { schema: { type: 'object' } } } } },
        },
      },
    },
    components: {
      securitySchemes: {
        bearerToken: {
          type: 'http',
          scheme: 'bearer',
          description:
            'personal read-only API token (43 characters, base64url); only its SHA-256 is stored, so a lost token cannot be shown again: revoke it and create another',
        },
        sessionCookie: { type: 'apiKey', in: 'cookie', name: 'epsigma_session', description: 'the session of a signed-in browser' },
      },
      schemas: {
        Error: {
          type: 'object',
          required: ['error'],
          properties: {
            error: {
              type: 'object',
              required: ['code', 'message'],
              properties: {
                code: str('machine-readable code'),
                message: str('what went wrong, for people'),
                details: {
                  type: 'array',
                  items: { type: 'object', properties: { field: str('offending field'), message: str('what is wrong with it') } },
                },
              },
            },
          },
        },
        CatalogEntry: {
          type: 'object',
          required: [
            'id',
            'substanceId',
            'substanceName',
            'version',
            'state',
            'scheme',
            'epsilonK',
            'sigmaAngstrom',
            'stdErr',
            'validity',
            'kinds',
          ],
          properties: {
            id: { type: 'integer' },
            substanceId: { type: 'integer' },
            substanceName: str('substance'),
            formula: strOrNull('formula, when recorded'),
            version: { type: 'integer', description: 'v1, v2 … per substance and scheme' },
            state: { type: 'string', enum: ['approved', 'superseded', 'retired'] },
            scheme: { type: 'string', enum: [...CUTOFF_SCHEMES] },
            cutoffSigma: numOrNull('rc/σ for the truncated schemes; null for the full potential'),
            epsilonK: num('ε/k_B in K'),
            sigmaAngstrom: num('σ in Å'),
            stdErr: {
              type: 'object',
              properties: { epsilonK: numOrNull('standard error of ε/k_B, K'), sigmaAngstrom: numOrNull('standard error of σ, Å') },
            },
            correlation: numOrNull('correlation of the ε and σ estimates'),
            validity: {
              type: 'object',
              properties: {
                temperatureMinK: num('K'),
                temperatureMaxK: num('K'),
                pressureMinMPa: numOrNull('MPa'),
                pressureMaxMPa: numOrNull('MPa'),
              },
            },
            kinds: {
              type: 'array',
              items: { type: 'string', enum: [...PROPERTY_KIND_IDS] },
              description: 'kinds of measurement behind the fit',
            },
            approvedAt: strOrNull('ISO 8601 time of approval'),
            approvedByName: strOrNull('reviewer who approved'),
            olderVersions: { type: 'integer', description: 'superseded or retired earlier versions of the same substance and scheme' },
          },
        },
        Mixture: {
          type: 'object',
          required: ['rule', 'pairs', 'note'],
          properties: {
            rule: { type: 'string', enum: [...COMBINING_RULES] },
            ruleName: str('name of the rule'),
            reference: str('published source of the rule'),
            pairs: {
              type: 'array',
              items: {
                type: 'object',
                required: ['i', 'j', 'setIdI', 'setIdJ', 'epsilonK', 'sigmaAngstrom', 'kind'],
                properties: {
                  i: { type: 'integer', description: '0-based component index' },
                  j: { type: 'integer', description: '0-based component index, j ≥ i' },
                  setIdI: { type: 'integer' },
                  setIdJ: { type: 'integer' },
                  epsilonK: num('ε_ij/k_B in K'),
                  sigmaAngstrom: num('σ_ij in Å'),
                  kind: { type: 'string', enum: ['pure', 'combining-rule-estimate'] },
                },
              },
            },
            note: str('says that cross pairs are combining-rule estimates, not fitted'),
          },
        },
        ParameterSetExport: PARAMETER_SET_JSON_SCHEMA,
        MixtureExport: MIXTURE_JSON_SCHEMA,
      },
    },
  };
}
