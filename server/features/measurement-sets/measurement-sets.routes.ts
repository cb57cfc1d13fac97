import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import { z } from 'zod';
import { measurementSetUploadFields, measurementSetVersionFields, withdrawMeasurementSetBody } from '../../../shared/schemas/measurements';
import {
  measurementSetDetailView,
  measurementSetListView,
  measurementSetUploadView,
  measurementSetWithdrawView,
} from '../../../shared/contracts/measurement-set';
import { hasPolicy, mayChangeWorkOf, refusalMessage } from '../../../shared/auth/roles';
import { currentUser, requirePolicy, requireUser } from '../../common/auth-middleware';
import { AppError, badRequest, conflict, forbidden, notFound } from '../../common/errors';
import { sendView } from '../../common/respond';
import { idParams, validBody, validParams, validQuery } from '../../common/validate';
import type { AppContext } from '../../app-context';
import { recordAudit } from '../audit/audit.service';
import { findSubstance } from '../substances/substances.repository';
import {
  findMeasurementSet,
  findVersionRow,
  insertWithdrawal,
  listMeasurementSetsOfSubstance,
  listVersions,
  personName,
  rowsOfVersion,
} from './measurement-sets.repository';
import { parseUpload, storeVersion, type UploadedFile } from './measurement-sets.service';
import { toMeasurementSetDetailView, toMeasurementSetSummaryView } from './measurement-sets.view';

/** Upload limit: 2 MiB is far above any real table of state points (5000 rows ≈ 200 kB). */
export const UPLOAD_LIMIT_BYTES = 2 * 1024 * 1024;

const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: UPLOAD_LIMIT_BYTES, files: 1, fields: 20 },
  fileFilter: (_req, file, cb) => {
    const csvName = /\.(csv|txt|tsv)$/i.test(file.originalname);
    const csvType = [
      'text/csv',
      'text/plain',
      'application/csv',
      'application/vnd.ms-excel',
      'text/tab-separated-values',
      'application/octet-stream',
    ].includes(file.mimetype);
    if (csvName && csvType) return cb(null, true);
    cb(
      new AppError(400, 'not_csv', `Only CSV files are accepted; "${file.originalname}" (${file.mimetype}) is not one.`, [
        { field: 'file', message: 'expected a .csv file' },
      ]),
    );
  },
});

/**
 * Multipart parsing runs after the role check, so nobody without the right can make the server read a file.
 * A body that is not valid multipart (no boundary, cut short, broken part headers) answers 400, never 500.
 */
const parseSingleCsv: RequestHandler = upload.single('file');
const singleCsv: RequestHandler = (req, res, next) => {
  parseSingleCsv(req, res, (err?: unknown) => {
    if (!err || err instanceof AppError || (err as { name?: string }).name === 'MulterError') return next(err);
    next(
      new AppError(
        400,
        'bad_multipart',
        `The upload is not valid multipart/form-data (${err instanceof Error ? err.message : String(err)}); send the CSV in the form field "file".`,
        [{ field: 'file', message: 'unreadable multipart body' }],
      ),
    );
  });
};

function requireFile(file: Express.Multer.File | undefined): UploadedFile {
  if (!file) throw badRequest('Attach the CSV file in the multipart field "file".', [{ field: 'file', message: 'is required' }]);
  return { originalname: file.originalname, buffer: file.buffer };
}

const listQuery = z.object({ substanceId: z.coerce.number().int().positive().optional() });
const versionQuery = z.object({ version: z.coerce.number().int().positive().optional() });
const versionParams = z.object({ id: z.coerce.number().int().positive(), version: z.coerce.number().int().positive() });

/**
 * An upload without a source citation is stored, with a warning: review will need the citation. Possible but
 * unusual values (shared/measurements/plausibility.ts, e.g. a unit slip of 10⁶) are stored and warned about too.
 */
function citationWarnings(source: string | undefined | null): string[] {
  return source && source.trim()
    ? []
    : [
        'No source citation was given. A parameter set fitted to this measurement set cannot be submitted for review until a version that cites its source is uploaded.',
      ];
}

export function measurementSetRoutes(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;

  router.get('/measurement-sets', requirePolicy('measurement-set:read'), async (req, res) => {
    const { substanceId } = validQuery(listQuery, req);
    sendView(res, measurementSetListView, {
      measurementSets: (await listMeasurementSetsOfSubstance(db, substanceId)).map(toMeasurementSetSummaryView),
    });
  });

  router.post('/measurement-sets', requirePolicy('measurement-set:upload'), singleCsv, async (req, res) => {
    const fields = validBody(measurementSetUploadFields, req);
    const file = requireFile(req.file);
    const actor = currentUser(res);
    const substance = await findSubstance(db, fields.substanceId);
    if (!substance)
      throw new AppError(422, 'unknown_substance', `Substance ${fields.substanceId} does not exist.`, [
        { field: 'substanceId', message: 'no such substance' },
      ]);
    const parsed = parseUpload(file, fields.kind, fields, substance.molarMassGramsPerMol);
    const stored = await db.transaction().execute((tx) =>
      storeVersion(tx, {
        newMeasurementSet: { substanceId: substance.id, kind: fields.kind, name: fields.name },
        file,
        fields,
        parsed,
        actor,
      }),
    );
    sendView(
      res,
      measurementSetUploadView,
      { ...stored, warnings: [...parsed.warnings.map((w) => w.message), ...citationWarnings(fields.source)] },
      201,
    );
  });

  /**
   * Ownership rule (shared/auth/roles.ts mayChangeWorkOf): a new version or a withdrawal is for the author of
   * the measurement set (who uploaded version 1) or an admin. Checked before any file is read.
   */
  const requireMeasurementSetAuthorOrAdmin: RequestHandler = async (req, res, next) => {
    const { id } = validParams(idParams, req);
    const actor = currentUser(res);
    if (!hasPolicy(actor.roles, 'measurement-set:upload') && !actor.roles.includes('admin'))
      throw forbidden(refusalMessage(actor.roles, 'measurement-set:upload', ['admin']));
    const measurementSet = await findMeasurementSet(db, id);
    if (!measurementSet) throw notFound(`Measurement set ${id}`);
    if (!mayChangeWorkOf(actor, measurementSet.createdBy, 'measurement-set:upload')) {
      const author = await personName(db, measurementSet.createdBy);
      throw new AppError(
        403,
        'not_author',
        `Only the author of measurement set "${measurementSet.name}" (${author ?? 'unknown'}) or an admin may change it.`,
      );
    }
    next();
  };

  router.post('/measurement-sets/:id/versions', requireUser, requireMeasurementSetAuthorOrAdmin, singleCsv, async (req, res) => {
    const { id } = validParams(idParams, req);
    const fields = validBody(measurementSetVersionFields, req);
    const file = requireFile(req.file);
    const actor = currentUser(res);
    const measurementSet = await findMeasurementSet(db, id);
    if (!measurementSet) throw notFound(`Measurement set ${id}`);
    if (measurementSet.withdrawnAt) throw conflict(`Measurement set ${id} was withdrawn; upload a new measurement set instead.`);
    const substance = await findSubstance(db, measurementSet.substanceId);
    const parsed = parseUpload(file, measurementSet.kind, fields, substance!.molarMassGramsPerMol);
    const stored = await db.transaction().execute((tx) => storeVersion(tx, { measurementSetId: id, file, fields, parsed, actor }));
    sendView(
      res,
      measurementSetUploadView,
      { ...stored, warnings: [...parsed.warnings.map((w) => w.message), ...citationWarnings(fields.source)] },
      201,
    );
  });

  router.get('/measurement-sets/:id', requirePolicy('measurement-set:read'), async (req, res) => {
    const { id } = validParams(idParams, req);
    const { version: wanted } = validQuery(versionQuery, req);
    const measurementSet = await findMeasurementSet(db, id);
    if (!measurementSet) throw notFound(`Measurement set ${id}`);
    const versions = await listVersions(db, id);
    const chosen = wanted === undefined ? versions[0] : versions.find((v) => v.version === wanted);
    if (!chosen) throw notFound(`Version ${wanted} of measurement set ${id}`);
    const rows = await rowsOfVersion(db, chosen.id);
    const substance = await findSubstance(db, measurementSet.substanceId);
    sendView(
      res,
      measurementSetDetailView,
      toMeasurementSetDetailView({ set: measurementSet, substanceName: substance!.name, versions, chosen, rows }),
    );
  });

  router.get('/measurement-sets/:id/versions/:version/original', requirePolicy('measurement-set:read'), async (req, res) => {
    const { id, version } = validParams(versionParams, req);
    const row = await findVersionRow(db, id, version);
    if (!row) throw notFound(`Version ${version} of measurement set ${id}`);
    const safeName = row.originalFilename.replace(/[^\w.\- ]+/g, '_');
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    res.setHeader('Content-Disposition', `attachment; filename="${safeName}"`);
    res.setHeader('X-Content-SHA256', row.sha256);
    res.send(row.originalBytes);
  });

  router.post('/measurement-sets/:id/withdraw', requireUser, requireMeasurementSetAuthorOrAdmin, async (req, res) => {
    const { id } = validParams(idParams, req);
    const { reason } = validBody(withdrawMeasurementSetBody, req);
    const actor = currentUser(res);
    await db.transaction().execute(async (tx) => {
      const measurementSet = await findMeasurementSet(tx, id);
      if (!measurementSet) throw notFound(`Measurement set ${id}`);
      if (measurementSet.withdrawnAt) throw conflict(`Measurement set ${id} is already withdrawn.`);
      await insertWithdrawal(tx, { measurementSetId: id, withdrawnBy: actor.id, withdrawnAt: new Date().toISOString(), reason });
      await recordAudit(tx, {
        actor,
        action: 'dataset.withdrawn',
        targetType: 'dataset',
        targetId: id,
        summary: `${actor.email} withdrew measurement set ${measurementSet.name}${measurementSet.createdBy === actor.id ? '' : ' (as admin; not the author)'}: ${reason}`,
      });
    });
    sendView(res, measurementSetWithdrawView, { id, withdrawn: true });
  });

  return router;
}
