import { Link, useParams } from 'react-router-dom';
import { formatDateTime } from '@shared/format/dates';
import type { LjFitResult } from '@shared/fitting/lj-fit';
import type { EnergyUnit, LengthUnit } from '@shared/physics/parameter-units';
import { ErrorState, LoadingState, PageHeader, Panel } from '@/components/ui/states';
import { UnitSwitch } from '@/components/ui/unit-switch';
import { exportHref, useParameterCard, usePreferences, useUpdatePreferences, type ParameterCard } from '@/features/catalog/api/catalog';
import { ExportLinks } from '@/features/catalog/components/export-links';
import { PredictionsPanel } from '@/features/catalog/components/predictions-panel';
import { ParameterValues } from '@/features/catalog/components/parameter-values';
import { SchemeCheck } from '@/features/catalog/components/scheme-check';
import { VersionHistory } from '@/features/catalog/components/version-history';
import { useFit } from '@/features/fits/api/fits';
import { FitEvidence, hasEvidence } from '@/features/fits/components/fit-evidence';
import { FollowButton } from '@/features/follows/components/follow-button';
import { ParameterSetCaution } from '@/features/parameter-sets/components/caution';
import { ParameterSetStateBadge } from '@/features/parameter-sets/components/state-badge';
import { MeasurementSetSourcesTable } from '@/features/measurement-sets/components/measurement-set-sources-table';

/** The parameter card: what a consumer needs to use one published set, in their own units. */
export function CatalogCardRoute() {
  const id = Number(useParams().parameterSetId);
  const card = useParameterCard(id);
  const prefs = usePreferences();
  const update = useUpdatePreferences();
  if (card.isPending || prefs.isPending) return <LoadingState />;
  if (card.isError) return <ErrorState error={card.error} onRetry={() => card.refetch()} />;
  const c = card.data;
  const energy: EnergyUnit = prefs.data?.energyUnit ?? 'K';
  const length: LengthUnit = prefs.data?.lengthUnit ?? 'Å';
  const csvUnits = [energy, length === 'Å' ? 'A' : length].join(',');
  return (
    <>
      <PageHeader
        eyebrow={
          <Link to="/catalog" className="hover:underline">
            Catalog
          </Link>
        }
        title={`${c.substanceName} v${c.version}`}
        subtitle={
          <span className="flex flex-wrap items-center gap-2">
            <ParameterSetStateBadge state={c.state} /> {c.schemeLabel}
            {c.cutoffSigma !== null && `, r_c = ${c.cutoffSigma} σ`}
            {c.potential === 'mie' && <span data-testid="card-potential">· {c.potentialLabel}</span>}
            {c.formula && <span className="text-ink-faint">· {c.formula}</span>}
          </span>
        }
        action={<FollowButton substanceId={c.substanceId} substanceName={c.substanceName} />}
      />
      <div className="grid gap-6">
        <ParameterSetCaution />
        {c.state === 'superseded' && c.currentApprovedId && (
          <p role="status" className="rounded-md bg-slate-soft px-4 py-2 text-sm text-slate">
            Superseded: the current approved version is{' '}
            <Link className="underline" to={`/catalog/${c.currentApprovedId}`}>
              v{c.versions.find((v) => v.id === c.currentApprovedId)?.version}
            </Link>
            . This version stays here and in exports for reproducing earlier work.
          </p>
        )}
        {c.state === 'retired' && (
          <p role="status" className="rounded-md bg-changes-soft px-4 py-2 text-sm text-changes">
            Retired: do not use for new work. Retired sets are not exported.
          </p>
        )}
        <div className="grid gap-6 lg:grid-cols-[3fr_2fr]">
          <Panel
            title="Parameters"
            actions={
              <UnitSwitch energy={energy} length={length} onChange={(u) => update.mutate({ energyUnit: u.energy, lengthUnit: u.length })} />
            }
          >
            <ParameterValues card={c} energy={energy} length={length} />
          </Panel>
          <Panel title="Use it">
            <div className="grid gap-5">
              <SchemeCheck
                fitted={c.scheme}
                cutoffSigma={c.cutoffSigma}
                used={prefs.data?.scheme}
                onChange={(scheme) => update.mutate({ scheme })}
              />
              {c.exportable ? (
                <ExportLinks
                  hrefOf={(f) => exportHref(c.id, f, f === 'csv' ? csvUnits : undefined)}
                  omit={c.potential === 'mie' ? ['gromacs'] : []}
                  note={`CSV adds columns in ${energy} and ${length}; the engine files use the engines' own units.${c.potential === 'mie' ? ` A ${c.potentialLabel} set goes to LAMMPS as pair_style mie/cut; GROMACS has no Mie pair function, so it is not offered.` : ''}`}
                />
              ) : (
                <p className="text-sm text-ink-faint">Only approved and superseded sets are exported.</p>
              )}
            </div>
          </Panel>
        </div>
        {c.exportable && (
          <Panel title="Predictions at your states">
            <PredictionsPanel setId={c.id} mie={c.potential === 'mie'} />
          </Panel>
        )}
        <Panel title="Approval">
          <p className="text-sm">
            {c.approvedAt ? (
              <>
                Approved by <span className="font-semibold">{c.approvedByName ?? 'a reviewer'}</span> on{' '}
                <time dateTime={c.approvedAt}>{formatDateTime(c.approvedAt)}</time>.
              </>
            ) : (
              'No approval recorded.'
            )}{' '}
            <Link className="text-copper underline" to={`/parameter-sets/${c.id}`}>
              Full review record
            </Link>
          </p>
          {c.approvalComment && (
            <blockquote className="mt-2 border-l-2 border-rule pl-3 text-sm text-ink-soft">{c.approvalComment}</blockquote>
          )}
          <p className="mt-3 whitespace-pre-line text-sm">
            <span className="text-ink-faint">Rationale: </span>
            {c.rationale}
          </p>
        </Panel>
        <FitEvidenceOfCard card={c} energy={energy} length={length} />
        <Panel title="Measurement sets and their sources">
          <MeasurementSetSourcesTable rows={c.measurementSets} />
        </Panel>
        <Panel title="Versions">
          <VersionHistory card={c} energy={energy} length={length} />
        </Panel>
      </div>
    </>
  );
}

/** Everything behind the fit (GET /api/fits/:id), shown as on the fit page and the review page, in the reader's units. */
function FitEvidenceOfCard({ card, energy, length }: { card: ParameterCard; energy: EnergyUnit; length: LengthUnit }) {
  const fit = useFit(card.fitId);
  if (fit.isPending) return <LoadingState label="Loading the fit…" />;
  if (fit.isError) return <ErrorState error={fit.error} onRetry={() => fit.refetch()} />;
  const result = fit.data.result as LjFitResult | null;
  if (!hasEvidence(result)) return null;
  return (
    <FitEvidence
      fit={fit.data}
      result={result}
      curves={[{ label: `v${card.version}`, epsilonK: card.epsilonK, sigmaAngstrom: card.sigmaAngstrom }]}
      energy={energy}
      length={length}
      parametersTitle={`Fit #${fit.data.number}: parameters and statistics`}
    />
  );
}
