import type { CatalogEntry, ParameterCard } from '../../../shared/contracts/catalog';
import { exportableParameterSetSchema, type ExportableParameterSet } from '../../../shared/contracts/exportable-parameter-set';
import type { PropertyKind } from '../../../shared/measurements/property-kinds';
import { CUTOFF_SCHEME_LABELS } from '../../../shared/physics/cutoff-schemes';
import { STATE_LABELS } from '../../../shared/parameter-sets/transitions';
import { readMeasurementSetRefs, toParameterSetValuesView } from '../parameter-sets/parameter-sets.view';
import type { CatalogRow } from './catalog.repository';

export type Approval = { at: string; actorName: string | null; comment: string | null };

/** The kinds of data behind a set, sorted, from its stored measurement set references. */
export const kindsOf = (row: { measurementSetsJson: string }): PropertyKind[] =>
  [...new Set(readMeasurementSetRefs(row.measurementSetsJson).map((d) => d.kind))].sort();

/** A catalog entry: the set's values (the one parameter-set mapping) with substance, approval, data kinds and older versions. */
export const toCatalogEntryView = (row: CatalogRow, approval: Approval | undefined): CatalogEntry => ({
  ...toParameterSetValuesView(row),
  formula: row.formula,
  schemeLabel: CUTOFF_SCHEME_LABELS[row.scheme],
  kinds: kindsOf(row),
  approvedAt: approval?.at ?? null,
  approvedByName: approval?.actorName ?? null,
  olderVersions: Number(row.olderPublished ?? 0),
});

/** One published version on the card, with its change against the version before it (null for the first). */
export function toParameterCardVersionView(
  v: CatalogRow,
  previous: CatalogRow | null,
  approval: Approval | undefined,
): ParameterCard['versions'][number] {
  return {
    id: v.id,
    version: v.version,
    state: v.state,
    stateLabel: STATE_LABELS[v.state],
    epsilonK: v.epsilonK,
    sigmaAngstrom: v.sigmaAngstrom,
    stdErr: { epsilonK: v.epsilonStdErrK, sigmaAngstrom: v.sigmaStdErrAngstrom },
    validity: { temperatureMinK: v.temperatureMinK, temperatureMaxK: v.temperatureMaxK },
    kinds: kindsOf(v),
    fitId: v.fitId,
    approvedAt: approval?.at ?? null,
    approvedByName: approval?.actorName ?? null,
    change: previous
      ? { fromVersion: previous.version, epsilonK: v.epsilonK - previous.epsilonK, sigmaAngstrom: v.sigmaAngstrom - previous.sigmaAngstrom }
      : null,
  };
}

/** A set as the exporters take it (shared/export/parameter-set-export.ts), with the sources of its data. */
export function toExportableParameterSet(
  row: CatalogRow,
  approval: Approval | undefined,
  sources: ReadonlyArray<{ id: number; source: string | null; doi: string | null }>,
): ExportableParameterSet {
  const values = toParameterSetValuesView(row);
  const sourceOf = (versionId: number) => sources.find((s) => s.id === versionId);
  // Parsed where it is built: every exporter then reads a set that matches its contract.
  return exportableParameterSetSchema.parse({
    id: row.id,
    version: row.version,
    substance: { id: row.substanceId, name: row.substanceName, formula: row.formula, molarMassGPerMol: row.molarMassGramsPerMol },
    model: row.potential,
    repulsiveExponent: row.repulsiveExponent,
    epsilonK: row.epsilonK,
    sigmaAngstrom: row.sigmaAngstrom,
    stdErr: values.stdErr,
    correlation: row.correlation,
    scheme: row.scheme,
    cutoffSigma: row.cutoffSigma,
    validity: values.validity,
    approvedAt: approval?.at ?? null,
    approvedBy: approval?.actorName ?? null,
    state: row.state,
    fitId: row.fitId,
    measurementSets: readMeasurementSetRefs(row.measurementSetsJson).map((r) => ({
      id: r.measurementSetId,
      version: r.version,
      kind: r.kind,
      name: r.name,
      source: sourceOf(r.versionId)?.source ?? null,
      doi: sourceOf(r.versionId)?.doi ?? null,
    })),
  });
}
