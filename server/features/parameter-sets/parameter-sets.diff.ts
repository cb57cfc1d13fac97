import { isVisibleTo } from '../../../shared/parameter-sets/transitions';
import { CUTOFF_SCHEME_LABELS } from '../../../shared/physics/cutoff-schemes';
import { FIELD_LABELS } from '../../../shared/schemas/field-labels';
import type { CurrentUser } from '../../common/auth-middleware';
import type { Db } from '../../db/database';
import type { ParameterSetChange, ParameterSetDiff } from '../../../shared/contracts/parameter-set';
import { findParameterSet, type ParameterSetRow } from './parameter-sets.repository';
import { requireVisibleSet } from './parameter-sets.service';
import { readMeasurementSetRefs } from './parameter-sets.view';

const measurementSetsText = (row: ParameterSetRow) =>
  readMeasurementSetRefs(row.measurementSetsJson)
    .map((d) => `${d.name} v${d.version}${d.excludeRows?.length ? ` (rows ${d.excludeRows.join(', ')} left out)` : ''}`)
    .join('; ');

/** What a reviewer compares between two versions, in the order the review page shows it. */
const FIELDS: Array<{ field: string; label: string; value: (r: ParameterSetRow) => string | number | null }> = [
  { field: 'version', label: 'Version', value: (r) => r.version },
  { field: 'epsilonK', label: 'ε/k_B (K)', value: (r) => r.epsilonK },
  { field: 'stdErr.epsilonK', label: 'Standard error of ε/k_B (K)', value: (r) => r.epsilonStdErrK },
  { field: 'sigmaAngstrom', label: 'σ (Å)', value: (r) => r.sigmaAngstrom },
  { field: 'stdErr.sigmaAngstrom', label: 'Standard error of σ (Å)', value: (r) => r.sigmaStdErrAngstrom },
  { field: 'correlation', label: 'Correlation of ε and σ', value: (r) => r.correlation },
  { field: 'scheme', label: FIELD_LABELS.scheme, value: (r) => CUTOFF_SCHEME_LABELS[r.scheme] },
  { field: 'cutoffSigma', label: FIELD_LABELS.cutoffSigma, value: (r) => r.cutoffSigma },
  { field: 'validity.temperatureMinK', label: FIELD_LABELS['validity.temperatureMinK'], value: (r) => r.temperatureMinK },
  { field: 'validity.temperatureMaxK', label: FIELD_LABELS['validity.temperatureMaxK'], value: (r) => r.temperatureMaxK },
  { field: 'validity.pressureMinMPa', label: FIELD_LABELS['validity.pressureMinMPa'], value: (r) => r.pressureMinMpa },
  { field: 'validity.pressureMaxMPa', label: FIELD_LABELS['validity.pressureMaxMPa'], value: (r) => r.pressureMaxMpa },
  { field: 'fit', label: 'Fit', value: (r) => `Fit #${r.fitNumber}` },
  { field: 'measurementSets', label: 'Measurement sets', value: measurementSetsText },
  { field: 'rationale', label: 'Rationale', value: (r) => r.rationale },
];

/** GET /api/parameter-sets/:id/diff: what changed from the version this set revises (same read rule as the set). */
export async function diffWithPrevious(db: Db, id: number, viewer: CurrentUser): Promise<ParameterSetDiff> {
  const row = await requireVisibleSet(db, id, viewer);
  const previous = row.revisionOf ? await findParameterSet(db, row.revisionOf) : undefined;
  if (!previous || !isVisibleTo(previous.state, viewer.roles)) return { previous: null, changes: [] };
  const changes: ParameterSetChange[] = [];
  for (const f of FIELDS) {
    const before = f.value(previous);
    const after = f.value(row);
    if (before !== after) changes.push({ field: f.field, label: f.label, before, after });
  }
  return { previous: { id: previous.id, version: previous.version }, changes };
}
