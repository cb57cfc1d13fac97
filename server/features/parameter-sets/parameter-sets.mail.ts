/** The texts of the mails a parameter set's moves queue (subject, text and HTML parts); who gets them is the service's. */
import { mailBody } from '../mail/mail.service';
import type { ParameterSetRow } from './parameter-sets.repository';
import { setLabel } from './parameter-sets.view';

const values = (row: ParameterSetRow) => `ε/k_B = ${row.epsilonK.toPrecision(6)} K, σ = ${row.sigmaAngstrom.toPrecision(6)} Å`;

export const submittedMail = (row: ParameterSetRow, actorName: string) => ({
  subject: `In review: ${setLabel(row)}`,
  ...mailBody([
    `${actorName} submitted ${setLabel(row)} for review.`,
    `${values(row)}, from Fit #${row.fitNumber}.`,
    `Rationale: ${row.rationale}`,
    'It waits on the Review desk.',
  ]),
});

export const changesRequestedMail = (row: ParameterSetRow, actorName: string, comment: string) => ({
  subject: `Changes requested: ${setLabel(row)}`,
  ...mailBody([`${actorName} sent ${setLabel(row)} back with this comment:`, comment, 'Draft a revision from the parameter set page.']),
});

export const approvedMail = (row: ParameterSetRow, actorName: string, comment: string) => ({
  subject: `Approved: ${setLabel(row)}`,
  ...mailBody([`${actorName} approved ${setLabel(row)} with this comment:`, comment]),
});

/** To the substance's followers: the new approved values and what they supersede. */
export const versionApprovedMail = (row: ParameterSetRow, superseded: string[]) => ({
  subject: `New approved parameters: ${setLabel(row)}`,
  ...mailBody([
    `${setLabel(row)} was approved: ${values(row)}, valid ${row.temperatureMinK}–${row.temperatureMaxK} K.`,
    superseded.length ? `It supersedes ${superseded.join(', ')}.` : 'It is the first approved version for this scheme.',
    'Fitted model parameters are not validated property data for pressure, safety or process design; defer to local codes and licensed engineering practice.',
  ]),
});

export const retiredMail = (row: ParameterSetRow, actorName: string, reason: string) => ({
  subject: `Retired: ${setLabel(row)}`,
  ...mailBody([`${actorName} retired ${setLabel(row)}. Do not use it for new work.`, `Reason: ${reason}`]),
});
