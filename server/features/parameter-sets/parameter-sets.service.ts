import { hasPolicy } from '../../../shared/auth/roles';
import { schemeOfFit } from '../../../shared/parameter-sets/scheme';
import { roundValidity } from '../../../shared/parameter-sets/validity';
import {
  availableMoves,
  checkMove,
  isVisibleTo,
  STATE_LABELS,
  type Move,
  type MoveActor,
  type MoveSubject,
  type ParameterSetState,
} from '../../../shared/parameter-sets/transitions';
import { CUTOFF_SCHEME_LABELS, type CutoffScheme } from '../../../shared/physics/cutoff-schemes';
import {
  CUTOFF_SIGMA_RANGE,
  type CreateParameterSetBody,
  type ReviseParameterSetBody,
  type UpdateParameterSetBody,
  type Validity,
} from '../../../shared/schemas/parameter-sets';
import type { LjFitResult } from '../../../shared/fitting/lj-fit';
import type { MeasurementSetRef } from '../../../shared/contracts/measurement-set-ref';
import type { ParameterSetComment, ParameterSetDetail, ParameterSetSummary } from '../../../shared/contracts/parameter-set';
import type { CurrentUser } from '../../common/auth-middleware';
import { AppError, notFound } from '../../common/errors';
import type { Db, Tx } from '../../db/database';
import { recordAudit } from '../audit/audit.service';
import { findFit, toFitView } from '../fits/fits.service';
import { emailsOfFollowers, emailsOfRole } from '../mail/mail.repository';
import { queueMail } from '../mail/mail.service';
import { pressureSpanOfVersions, versionSources } from '../measurement-sets/measurement-sets.repository';
import { findSubstance } from '../substances/substances.repository';
import { approvedMail, changesRequestedMail, retiredMail, submittedMail, versionApprovedMail } from './parameter-sets.mail';
import {
  approvedOf,
  commentsOf,
  emailOf,
  findParameterSet,
  historyOf,
  insertComment,
  insertParameterSet,
  insertTransition,
  listParameterSets,
  nextVersion,
  updateParameterSet,
  type ParameterSetRow,
} from './parameter-sets.repository';
import { readMeasurementSetRefs, setLabel, toParameterSetDetailView, toParameterSetView } from './parameter-sets.view';

const SYSTEM: MoveActor = { id: 'system', roles: [], system: true };

/** Audit action per move (`parameterSet.<action>`). */
const AUDIT_ACTION: Record<Move, string> = {
  submit: 'submitted',
  approve: 'approved',
  request_changes: 'changes_requested',
  revise: 'revised',
  retire: 'retired',
  supersede: 'superseded',
  edit: 'edited',
};

const moveActor = (user: CurrentUser): MoveActor => ({ id: user.id, roles: user.roles });

async function subjectOf(db: Db | Tx, row: ParameterSetRow): Promise<MoveSubject> {
  const approved = await approvedOf(db, row.substanceId, row.scheme, row.potential);
  return {
    state: row.state,
    version: row.version,
    authorId: row.createdBy,
    fitAuthorId: row.fitCreatedBy,
    approvedVersion: approved.length ? approved[0].version : null,
    revised: row.revisedBy != null,
  };
}

export async function requireVisibleSet(db: Db | Tx, id: number, viewer: CurrentUser): Promise<ParameterSetRow> {
  const row = await findParameterSet(db, id);
  // A consumer asking for an unpublished set learns nothing about it, not even that it exists.
  if (!row || !isVisibleTo(row.state, viewer.roles)) throw notFound(`Parameter set ${id}`);
  return row;
}

/**
 * Makes one move through the state machine: refuses with its status and code, or writes the transition
 * row, the new state and the audit row. Runs inside the caller's transaction.
 */
async function applyMove(
  tx: Tx,
  row: ParameterSetRow,
  move: Move,
  actor: CurrentUser | null,
  text: string | null,
  extra: { summary?: string } = {},
): Promise<ParameterSetState> {
  const decision = checkMove(move, await subjectOf(tx, row), actor ? moveActor(actor) : SYSTEM, { text });
  if (!decision.ok) throw new AppError(decision.status, decision.code, decision.message);
  const at = new Date().toISOString();
  await insertTransition(tx, {
    parameterSetId: row.id,
    move,
    fromState: row.state,
    toState: decision.to,
    actorId: actor?.id ?? null,
    comment: text,
    at,
  });
  if (decision.to !== row.state) await updateParameterSet(tx, row.id, { state: decision.to, updatedAt: at });
  const who = actor?.email ?? 'Epsigma';
  await recordAudit(tx, {
    actor,
    action: `parameterSet.${AUDIT_ACTION[move]}`,
    targetType: 'parameterSet',
    targetId: row.id,
    // A move that keeps the state (a revision leaves the set sent back as it is) says what happened, not "X → X".
    summary:
      extra.summary ??
      (decision.to === row.state
        ? `${who}: ${setLabel(row)} — ${text ?? move}`
        : `${who}: ${setLabel(row)} ${STATE_LABELS[row.state]} → ${STATE_LABELS[decision.to]}${text ? ` — ${text}` : ''}`),
    before: { state: row.state },
    after: { state: decision.to, ...(text ? { comment: text } : {}) },
  });
  return decision.to;
}

/** The fit's result when it can back a parameter set: the fit succeeded and its least squares converged. */
async function usableFit(db: Db | Tx, fitId: number, field = 'fitId') {
  const row = await findFit(db, fitId);
  if (!row) throw new AppError(422, 'unknown_fit', `Fit ${fitId} does not exist.`, [{ field, message: 'no such fit' }]);
  const fit = toFitView(row);
  if (fit.status !== 'succeeded' || !fit.result || fit.result.status !== 'succeeded') {
    throw new AppError(
      409,
      'fit_not_succeeded',
      `Fit #${fit.number} of ${fit.substanceName} is ${fit.status}; only a succeeded fit can back a parameter set.`,
      [{ field, message: `fit is ${fit.status}` }],
    );
  }
  if (fit.model !== 'lj-12-6' && fit.model !== 'mie')
    throw new AppError(
      409,
      'unsupported_model',
      `Fit #${fit.number} used model ${fit.model}; parameter sets hold LJ 12-6 or Mie λr-6 parameters.`,
    );
  return { fit, result: fit.result as LjFitResult };
}

/** Temperature span of the fitted points, and the pressure span of any density rows among the fit's measurement set versions. */
async function dataSpan(db: Db | Tx, fit: Awaited<ReturnType<typeof usableFit>>['fit']): Promise<Validity> {
  const temps = (fit.result as LjFitResult).residuals.map((r) => r.temperatureK);
  const span: Validity = { temperatureMinK: Math.min(...temps), temperatureMaxK: Math.max(...temps) };
  // Rounded where it is made (0.01 K, 0.001 MPa), outward, so the range still holds every point.
  const densityVersions = fit.measurementSets.filter((d) => d.kind === 'density').map((d) => d.versionId);
  const p = await pressureSpanOfVersions(db, densityVersions);
  if (p.lo !== null && p.hi !== null && p.lo < p.hi) Object.assign(span, { pressureMinMPa: p.lo, pressureMaxMPa: p.hi });
  return roundValidity(span);
}

async function insertSet(
  tx: Tx,
  actor: CurrentUser,
  input: {
    fit: Awaited<ReturnType<typeof usableFit>>;
    scheme: CutoffScheme;
    cutoffSigma: number | null;
    validity: Validity;
    rationale: string;
    revisionOf: ParameterSetRow | null;
  },
) {
  const { fit, result } = input.fit;
  const version = await nextVersion(tx, fit.substanceId, input.scheme);
  const validity = roundValidity(input.validity);
  const now = new Date().toISOString();
  const id = await insertParameterSet(tx, {
    substanceId: fit.substanceId,
    scheme: input.scheme,
    cutoffSigma: input.cutoffSigma,
    version,
    fitId: fit.id,
    revisionOf: input.revisionOf?.id ?? null,
    model: 'lj-12-6',
    potential: result.model === 'mie' ? 'mie' : 'lj-12-6',
    repulsiveExponent: result.repulsiveExponent ?? 12,
    epsilonK: result.epsilonK,
    sigmaAngstrom: result.sigmaAngstrom,
    epsilonStdErrK: result.stdErr.epsilonK,
    sigmaStdErrAngstrom: result.stdErr.sigmaAngstrom,
    correlation: result.correlation,
    measurementSetsJson: JSON.stringify(fit.measurementSets),
    temperatureMinK: validity.temperatureMinK,
    temperatureMaxK: validity.temperatureMaxK,
    pressureMinMpa: validity.pressureMinMPa ?? null,
    pressureMaxMpa: validity.pressureMaxMPa ?? null,
    rationale: input.rationale,
    state: 'draft',
    createdBy: actor.id,
    createdAt: now,
    updatedAt: now,
  });
  const comment = input.revisionOf ? `Revision of v${input.revisionOf.version} after changes were requested` : null;
  await insertTransition(tx, {
    parameterSetId: id,
    move: 'create',
    fromState: null,
    toState: 'draft',
    actorId: actor.id,
    comment,
    at: now,
  });
  const row = (await findParameterSet(tx, id))!;
  await recordAudit(tx, {
    actor,
    action: 'parameterSet.drafted',
    targetType: 'parameterSet',
    targetId: id,
    summary: `${actor.email} drafted ${setLabel(row)} from Fit #${fit.number}${input.revisionOf ? ` as a revision of v${input.revisionOf.version}` : ''}`,
    after: { ...toParameterSetView(row), measurementSets: fit.measurementSets },
  });
  return row;
}

/** The scheme of a draft that names none (see schemeOfFit); a simulation cutoff out of range is the modeller's to settle. */
function defaultScheme(result: LjFitResult): { scheme: CutoffScheme; cutoffSigma: number | null } {
  const d = schemeOfFit(result as LjFitResult & { mdSettings?: { scheme?: string; cutoff?: number } });
  if (d.cutoffOutOfRange) {
    throw new AppError(
      422,
      'cutoff_out_of_range',
      `The fit's simulations used r_c = ${d.cutoffSigma} σ, outside the ${CUTOFF_SIGMA_RANGE.min}–${CUTOFF_SIGMA_RANGE.max} σ a parameter set accepts; name the scheme and cutoff yourself.`,
      [{ field: 'cutoffSigma', message: `simulation cutoff ${d.cutoffSigma} σ out of range` }],
    );
  }
  return { scheme: d.scheme, cutoffSigma: d.cutoffSigma };
}

/** POST /api/parameter-sets: a draft from a succeeded fit, values frozen from its result. */
export async function createParameterSet(db: Db, actor: CurrentUser, body: CreateParameterSetBody): Promise<ParameterSetSummary> {
  const fit = await usableFit(db, body.fitId);
  const validity = body.validity ?? (await dataSpan(db, fit.fit));
  const { scheme, cutoffSigma } = body.scheme ? { scheme: body.scheme, cutoffSigma: body.cutoffSigma ?? null } : defaultScheme(fit.result);
  const row = await db
    .transaction()
    .execute((tx) => insertSet(tx, actor, { fit, scheme, cutoffSigma, validity, rationale: body.rationale, revisionOf: null }));
  return toParameterSetView(row);
}

/** POST /api/parameter-sets/:id/revise: the set sent back stays as it is; its revision is the next version, a new draft. */
export async function reviseParameterSet(
  db: Db,
  actor: CurrentUser,
  id: number,
  body: ReviseParameterSetBody,
): Promise<ParameterSetSummary> {
  const before = await requireVisibleSet(db, id, actor);
  // Role and state first, so a refused move answers 403/409 whatever the body holds.
  const allowed = checkMove('revise', await subjectOf(db, before), moveActor(actor));
  if (!allowed.ok) throw new AppError(allowed.status, allowed.code, allowed.message);
  const fitId = body.fitId ?? before.fitId;
  const fit = await usableFit(db, fitId);
  if (fit.fit.substanceId !== before.substanceId)
    throw new AppError(
      422,
      'wrong_substance',
      `Fit #${fit.fit.number} is a fit of ${fit.fit.substanceName}, not of ${before.substanceName}.`,
      [{ field: 'fitId', message: 'fit of another substance' }],
    );
  if (fit.fit.id < before.fitId)
    throw new AppError(422, 'older_fit', `A revision is drafted from the same fit (#${before.fitNumber}) or a newer one.`, [
      { field: 'fitId', message: 'older than the fit of the set sent back' },
    ]);
  // Like a first draft: the scheme and cutoff the fit was made for, unless the author names them.
  const inherited = body.scheme ? { scheme: body.scheme, cutoffSigma: body.cutoffSigma ?? null } : defaultScheme(fit.result);
  if (!body.scheme && body.cutoffSigma !== undefined) {
    if (inherited.scheme === 'full-potential')
      throw new AppError(
        400,
        'validation_failed',
        'Cutoff r_c (σ): the full potential has no cutoff; leave the cutoff empty or choose a truncated scheme.',
        [{ field: 'cutoffSigma', message: 'the full potential has no cutoff; leave the cutoff empty' }],
      );
    inherited.cutoffSigma = body.cutoffSigma;
  }
  const sameFit = fit.fit.id === before.fitId;
  const validity: Validity =
    body.validity ??
    (sameFit
      ? {
          temperatureMinK: before.temperatureMinK,
          temperatureMaxK: before.temperatureMaxK,
          ...(before.pressureMinMpa !== null ? { pressureMinMPa: before.pressureMinMpa, pressureMaxMPa: before.pressureMaxMpa! } : {}),
        }
      : await dataSpan(db, fit.fit));
  const row = await db.transaction().execute(async (tx) => {
    const current = (await findParameterSet(tx, id))!;
    const version = await nextVersion(tx, current.substanceId, inherited.scheme);
    const schemeChange = inherited.scheme !== current.scheme ? ` (${CUTOFF_SCHEME_LABELS[inherited.scheme]})` : '';
    await applyMove(tx, current, 'revise', actor, `Revised as v${version}${schemeChange}`);
    return insertSet(tx, actor, {
      fit,
      scheme: inherited.scheme,
      cutoffSigma: inherited.cutoffSigma,
      validity,
      rationale: body.rationale,
      revisionOf: current,
    });
  });
  return toParameterSetView(row);
}

const link = (id: number) => `/parameter-sets/${id}`;

/** 422 naming every measurement set (name and version) whose version behind the set has no source citation. */
async function requireCitations(tx: Tx, refs: MeasurementSetRef[]) {
  if (!refs.length) return;
  const versions = await versionSources(
    tx,
    refs.map((r) => r.versionId),
  );
  const missing = refs.filter((r) => !(versions.find((v) => v.id === r.versionId)?.source ?? '').trim());
  if (!missing.length) return;
  const names = missing.map((r) => `"${r.name}" v${r.version}`);
  throw new AppError(
    422,
    'citation_missing',
    `A parameter set goes to review only when every measurement set behind it cites its source. ${names.length === 1 ? `${names[0]} has` : `${names.join(', ')} have`} no source citation: upload a new version with the citation and draft a revision from a fit that uses it.`,
    missing.map((r) => ({
      field: 'measurementSets',
      measurementSetId: r.measurementSetId,
      version: r.version,
      message: `measurement set "${r.name}" v${r.version} has no source citation`,
    })),
  );
}

/** POST /api/parameter-sets/:id/submit: the author hands the draft to the reviewers. */
export async function submitParameterSet(db: Db, actor: CurrentUser, id: number): Promise<ParameterSetDetail> {
  await requireVisibleSet(db, id, actor);
  await db.transaction().execute(async (tx) => {
    const row = (await findParameterSet(tx, id))!;
    await applyMove(tx, row, 'submit', actor, null);
    // Reviewers judge the evidence by its source: every measurement set behind the values needs a citation.
    // (Checked after the move's own rules, so a refused move still answers 403/409; the throw rolls the move back.)
    await requireCitations(tx, readMeasurementSetRefs(row.measurementSetsJson));
    // Everyone who may decide on it; the author and the fit's author may not, so they are left out.
    const excluded = new Set([row.createdByEmail.toLowerCase(), ((await emailOf(tx, row.fitCreatedBy)) ?? '').toLowerCase()]);
    const reviewers = (await emailsOfRole(tx, 'reviewer')).filter((e) => !excluded.has(e.toLowerCase()));
    await queueMail(tx, {
      to: reviewers,
      ...submittedMail(row, actor.name),
      link: link(id),
      reason: 'parameterSet.submitted',
    });
  });
  return getParameterSetDetail(db, id, actor);
}

/** POST /api/parameter-sets/:id/review: approve (superseding the approved older version) or send back. */
export async function reviewParameterSet(
  db: Db,
  actor: CurrentUser,
  id: number,
  decision: 'approve' | 'request_changes',
  comment: string,
): Promise<ParameterSetDetail> {
  await requireVisibleSet(db, id, actor);
  await db.transaction().execute(async (tx) => {
    const row = (await findParameterSet(tx, id))!;
    await applyMove(tx, row, decision, actor, comment);
    // The author is told only while their account is active (emailOf skips deactivated people).
    const author = [(await emailOf(tx, row.createdBy)) ?? ''];
    if (decision === 'request_changes') {
      await queueMail(tx, {
        to: author,
        ...changesRequestedMail(row, actor.name, comment),
        link: link(id),
        reason: 'parameterSet.changes_requested',
      });
      return;
    }
    const superseded: string[] = [];
    for (const older of await approvedOf(tx, row.substanceId, row.scheme, row.potential)) {
      if (older.id === row.id) continue;
      await applyMove(tx, older, 'supersede', null, `Superseded by v${row.version}`, {
        summary: `${setLabel(older)} superseded by v${row.version}, approved by ${actor.email}`,
      });
      superseded.push(`v${older.version}`);
    }
    await queueMail(tx, {
      to: author,
      ...approvedMail(row, actor.name, comment),
      link: link(id),
      reason: 'parameterSet.approved',
    });
    await queueMail(tx, {
      to: await emailsOfFollowers(tx, row.substanceId),
      ...versionApprovedMail(row, superseded),
      link: link(id),
      reason: 'parameterSet.version_approved',
    });
  });
  return getParameterSetDetail(db, id, actor);
}

/** POST /api/parameter-sets/:id/retire: an approved set is withdrawn with a reason. */
export async function retireParameterSet(db: Db, actor: CurrentUser, id: number, reason: string): Promise<ParameterSetDetail> {
  await requireVisibleSet(db, id, actor);
  await db.transaction().execute(async (tx) => {
    const row = (await findParameterSet(tx, id))!;
    await applyMove(tx, row, 'retire', actor, reason);
    await queueMail(tx, {
      to: [...(await emailsOfFollowers(tx, row.substanceId)), (await emailOf(tx, row.createdBy)) ?? ''],
      ...retiredMail(row, actor.name, reason),
      link: link(id),
      reason: 'parameterSet.retired',
    });
  });
  return getParameterSetDetail(db, id, actor);
}

/**
 * Refuses a PATCH before its body is read: 404/403 as for any move, 409 when the set is not a draft
 * or when the body tries to change a frozen value (the values never change; draft a new set).
 */
export async function refuseUnlessEditable(db: Db, actor: CurrentUser, id: number, frozenFieldsInBody: string[]) {
  const row = await requireVisibleSet(db, id, actor);
  const decision = checkMove('edit', await subjectOf(db, row), moveActor(actor));
  if (!decision.ok) throw new AppError(decision.status, decision.code, decision.message);
  if (frozenFieldsInBody.length) {
    throw new AppError(
      409,
      'values_frozen',
      `The values of a parameter set are frozen at creation (${frozenFieldsInBody.join(', ')}); draft a new parameter set from a fit instead.`,
      frozenFieldsInBody.map((field) => ({ field, message: 'frozen at creation' })),
    );
  }
}

/** PATCH /api/parameter-sets/:id: rationale and validity of a draft. */
export async function editDraft(db: Db, actor: CurrentUser, id: number, body: UpdateParameterSetBody): Promise<ParameterSetDetail> {
  await db.transaction().execute(async (tx) => {
    const row = (await requireVisibleSet(tx, id, actor))!;
    const changed = [body.rationale !== undefined ? 'rationale' : null, body.validity ? 'validity' : null].filter(Boolean).join(' and ');
    const validity = body.validity ? roundValidity(body.validity) : null;
    await applyMove(tx, row, 'edit', actor, `Changed the ${changed}`, {
      summary: `${actor.email} edited the ${changed} of ${setLabel(row)}`,
    });
    await updateParameterSet(tx, id, {
      ...(body.rationale !== undefined ? { rationale: body.rationale } : {}),
      ...(validity
        ? {
            temperatureMinK: validity.temperatureMinK,
            temperatureMaxK: validity.temperatureMaxK,
            pressureMinMpa: validity.pressureMinMPa ?? null,
            pressureMaxMpa: validity.pressureMaxMPa ?? null,
          }
        : {}),
      updatedAt: new Date().toISOString(),
    });
  });
  return getParameterSetDetail(db, id, actor);
}

/** POST /api/parameter-sets/:id/comments */
export async function addComment(db: Db, actor: CurrentUser, id: number, body: string): Promise<ParameterSetComment> {
  return db.transaction().execute(async (tx) => {
    const row = await requireVisibleSet(tx, id, actor);
    const createdAt = new Date().toISOString();
    const commentId = await insertComment(tx, { parameterSetId: id, authorId: actor.id, body, createdAt });
    await recordAudit(tx, {
      actor,
      action: 'parameterSet.commented',
      targetType: 'parameterSet',
      targetId: id,
      summary: `${actor.email} commented on ${setLabel(row)}`,
      after: { commentId },
    });
    return { id: commentId, authorId: actor.id, authorName: actor.name, body, createdAt };
  });
}

/** GET /api/parameter-sets/:id: the set, its history and comments, its fit and data, the approved version it would replace. */
export async function getParameterSetDetail(db: Db, id: number, viewer: CurrentUser): Promise<ParameterSetDetail> {
  const row = await requireVisibleSet(db, id, viewer);
  const [history, comments, approved, fitRow, subject, versions] = await Promise.all([
    historyOf(db, id),
    commentsOf(db, id),
    approvedOf(db, row.substanceId, row.scheme, row.potential),
    findFit(db, row.fitId),
    subjectOf(db, row),
    versionSources(
      db,
      readMeasurementSetRefs(row.measurementSetsJson).map((r) => r.versionId),
    ),
  ]);
  const current = approved.find((a) => a.id !== row.id) ?? null;
  return toParameterSetDetailView({
    row,
    fit: fitOfSet(toFitView(fitRow!)),
    versions,
    history,
    comments,
    currentApproved: current && isVisibleTo(current.state, viewer.roles) ? current : null,
    allowedMoves: availableMoves(subject, moveActor(viewer)),
    canComment: hasPolicy(viewer.roles, 'parameterSet:comment'),
  });
}

/** The fit behind a set as its page shows it: who, when, which code, and the goodness of fit. */
function fitOfSet(fit: ReturnType<typeof toFitView>): ParameterSetDetail['fit'] {
  const result = fit.result as LjFitResult | null;
  const temps = result?.residuals.map((r) => r.temperatureK) ?? [];
  return {
    id: fit.id,
    number: fit.number,
    createdBy: fit.createdBy,
    createdByName: fit.createdByName,
    createdAt: fit.createdAt,
    codeVersion: fit.codeVersion,
    quantumCorrection: !!fit.options.quantumCorrection,
    molarMassGPerMol: fit.options.molarMassGPerMol ?? null,
    chi2: result?.chi2 ?? null,
    dof: result?.dof ?? null,
    reducedChi2: result?.reducedChi2 ?? null,
    warnings: [...(result?.warnings ?? []), ...(result?.hitBounds ?? []).map((b) => `The fit ended on the bound of ${b}.`)],
    dataSpan: temps.length ? { temperatureMinK: Math.min(...temps), temperatureMaxK: Math.max(...temps) } : null,
  };
}

/** Sets a viewer may see, by substance and/or state (consumers: published sets only). */
export async function listVisible(
  db: Db,
  viewer: CurrentUser,
  filter: { substanceId?: number; states?: ParameterSetState[] },
): Promise<ParameterSetSummary[]> {
  const rows = await listParameterSets(db, filter);
  return rows.filter((r) => isVisibleTo(r.state, viewer.roles)).map(toParameterSetView);
}

export async function requireSubstanceExists(db: Db, substanceId: number) {
  if (!(await findSubstance(db, substanceId))) throw notFound(`Substance ${substanceId}`);
}
