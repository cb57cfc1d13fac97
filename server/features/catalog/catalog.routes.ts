import { Router, type Response } from 'express';
import { MIXTURE_JSON_SCHEMA, PARAMETER_SET_JSON_SCHEMA } from '../../../shared/export/json-schema';
import type { ExportResult } from '../../../shared/export/parameter-set-export';
import { catalogListView, mixtureView, parameterCardView, predictionsView } from '../../../shared/contracts/catalog';
import { catalogQuery, exportQuery, mixtureQuery, predictionQuery } from '../../../shared/schemas/catalog';
import { predictionsOfSet } from './predictions.service';
import type { AppContext } from '../../app-context';
import { currentUser, requirePolicy } from '../../common/auth-middleware';
import { notFound } from '../../common/errors';
import { sendView } from '../../common/respond';
import { idParams, validParams, validQuery } from '../../common/validate';
import { cachedCatalogSearch, exportableSet, exportMixtureFile, exportSetFile, mixtureJson, parameterCard } from './catalog.service';
import { openApiDocument } from './openapi';
import { approvedPairsFor } from '../pair-sets/pair-sets.service';

/** Published JSON Schemas of the export formats, by file name. */
const SCHEMAS: Record<string, object> = {
  'parameter-set-1.json': PARAMETER_SET_JSON_SCHEMA,
  'mixture-1.json': MIXTURE_JSON_SCHEMA,
};

function sendFile(res: Response, file: ExportResult) {
  res.attachment(file.filename);
  res.set('Content-Type', file.contentType);
  // The set's state can change (superseded, retired): no copy may be kept (like every API answer).
  res.set('Cache-Control', 'no-store');
  res.send(file.body);
}

/**
 * The catalog (approved sets), the parameter card, exports, mixtures, and the published schemas and API
 * description. The read routes here are the only ones personal API tokens reach (server/common/bearer-token.ts).
 */
export function catalogRoutes(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;

  const searchCatalog = cachedCatalogSearch(db, ctx.sqlite);
  router.get('/catalog', requirePolicy('catalog:read'), async (req, res) => {
    const query = validQuery(catalogQuery, req);
    const json = await searchCatalog(query);
    // The entries' JSON text is cached (see cachedCatalogSearch); with response checks on, it is parsed and checked first.
    if (res.app.locals.checkResponses === true) sendView(res, catalogListView, JSON.parse(json));
    else res.type('application/json').send(json);
  });

  router.get('/catalog/:id', requirePolicy('catalog:read'), async (req, res) => {
    const { id } = validParams(idParams, req);
    sendView(res, parameterCardView, await parameterCard(db, id, currentUser(res)));
  });

  router.get('/parameter-sets/:id/export', requirePolicy('catalog:export'), async (req, res) => {
    const { id } = validParams(idParams, req);
    const { format, units } = validQuery(exportQuery, req);
    const set = await exportableSet(db, id, currentUser(res));
    sendFile(res, exportSetFile(set, format, units));
  });

  // Predictions with propagated uncertainty at the reader's own states; readable with an API token.
  router.get('/parameter-sets/:id/predictions', requirePolicy('catalog:read'), async (req, res) => {
    const { id } = validParams(idParams, req);
    const query = validQuery(predictionQuery, req);
    sendView(res, predictionsView, await predictionsOfSet(db, id, currentUser(res), query));
  });

  router.get('/mixtures', requirePolicy('catalog:export'), async (req, res) => {
    const { sets: ids, rule, format, units } = validQuery(mixtureQuery, req);
    const sets = [];
    for (const id of ids) sets.push(await exportableSet(db, id, currentUser(res), 'sets'));
    // Approved pair sets replace the combining rule for their pair; they travel on the sets to every exporter.
    const fitted = await approvedPairsFor(db, ids);
    for (const set of sets) Object.assign(set, { fittedPairs: fitted.filter((f) => f.setIdA === set.id || f.setIdB === set.id) });
    if (format) sendFile(res, exportMixtureFile(sets, rule, format, units));
    else sendView(res, mixtureView, mixtureJson(sets, rule));
  });

  // Public: the schemas and the API description hold no data, and tools fetch them without credentials.
  router.get('/schemas/:name', (req, res) => {
    const schema = Object.prototype.hasOwnProperty.call(SCHEMAS, req.params.name) ? SCHEMAS[req.params.name] : undefined;
    if (!schema) throw notFound(`Schema ${req.params.name}`);
    res.type('application/schema+json').send(JSON.stringify(schema, null, 2));
  });

  router.get('/openapi.json', (_req, res) => {
    res.type('application/json').send(JSON.stringify(openApiDocument(), null, 2));
  });

  return router;
}
