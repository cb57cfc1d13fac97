import { useQuery } from '@tanstack/react-query';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { formatDate } from '@shared/format/dates';
import { formatSignificant } from '@shared/format/numbers';
import type { LjFitResult } from '@shared/fitting/lj-fit';
import { ErrorState, LoadingState, PageHeader, Panel } from '@/components/ui/states';
import { substanceFitsQueryOptions, useFit } from '@/features/fits/api/fits';
import { FitEvidence, fitContext, hasEvidence } from '@/features/fits/components/fit-evidence';
import { useParameterSet, type ParameterSetDetail } from '@/features/parameter-sets/api/parameter-sets';
import { ParameterSetActions } from '@/features/parameter-sets/components/actions';
import { ApprovedComparison } from '@/features/parameter-sets/components/approved-comparison';
import { ParameterSetCaution } from '@/features/parameter-sets/components/caution';
import { CommentThread } from '@/features/parameter-sets/components/comment-thread';
import { FrozenValues, schemeText } from '@/features/parameter-sets/components/frozen-values';
import { RevisionDiff } from '@/features/parameter-sets/components/revision-diff';
import { HistoryTimeline } from '@/features/parameter-sets/components/history-timeline';
import { ParameterSetStateBadge } from '@/features/parameter-sets/components/state-badge';
import { MeasurementSetSourcesTable } from '@/features/measurement-sets/components/measurement-set-sources-table';

/** A parameter set: frozen values, state, review actions, the fit behind it and the approved version it would replace. */
export function ParameterSetDetailRoute() {
  const id = Number(useParams().parameterSetId);
  const query = useParameterSet(id);
  const navigate = useNavigate();
  const substanceId = query.data?.substanceId;
  const fits = useQuery({
    ...substanceFitsQueryOptions(substanceId ?? 0),
    enabled: substanceId !== undefined && !!query.data?.allowedMoves.includes('revise'),
  });
  if (query.isPending) return <LoadingState />;
  if (query.isError) return <ErrorState error={query.error} onRetry={() => query.refetch()} />;
  const s = query.data;
  const last = s.history[s.history.length - 1];
  return (
    <>
      <PageHeader
        eyebrow={
          <Link to={`/substances/${s.substanceId}`} className="hover:underline">
            {s.substanceName} · parameter sets
          </Link>
        }
        title={`${s.substanceName} v${s.version}`}
        subtitle={
          <span className="flex flex-wrap items-center gap-2">
            <ParameterSetStateBadge state={s.state} /> {schemeText(s)} · from{' '}
            <Link className="text-copper underline" to={`/fits/${s.fitId}`}>
              Fit #{s.fitNumber}
            </Link>{' '}
            · drafted by {s.createdByName}
          </span>
        }
      />
      <div className="grid gap-6">
        <ParameterSetCaution />
        <Notices set={s} lastComment={last?.comment ?? null} />
        <div className="grid gap-6 lg:grid-cols-[3fr_2fr]">
          <Panel title="Frozen values">
            <FrozenValues set={s} />
          </Panel>
          <Panel title="Actions">
            <ParameterSetActions
              set={s}
              onRevised={(r) => navigate(`/parameter-sets/${r.id}`)}
              fitChoices={(fits.data ?? [])
                .filter((f) => f.status === 'succeeded')
                .map((f) => ({
                  id: f.id,
                  number: f.number,
                  label: `Fit #${f.number} — ${formatDate(f.createdAt)}, ${f.epsilonK !== null ? `ε/k_B ${formatSignificant(f.epsilonK, 5)} K` : ''}${f.sigmaAngstrom !== null ? `, σ ${formatSignificant(f.sigmaAngstrom, 5)} Å` : ''}`,
                }))}
            />
          </Panel>
        </div>
        {s.revisionOf !== null && (
          <Panel title="Changes from the previous version">
            <RevisionDiff parameterSetId={s.id} />
          </Panel>
        )}
        <Panel title="Rationale">
          <p className="whitespace-pre-line">{s.rationale}</p>
        </Panel>
        <FitEvidenceOfSet set={s} />
        <Panel title="Measurement sets behind it">
          <MeasurementSetSourcesTable rows={s.measurementSets} linkToMeasurementSets showSha />
        </Panel>
        <div className="grid gap-6 lg:grid-cols-2">
          <Panel title="History">
            <HistoryTimeline history={s.history} />
          </Panel>
          <Panel title="Comments">
            <CommentThread set={s} />
          </Panel>
        </div>
      </div>
    </>
  );
}

function Notices({ set, lastComment }: { set: ParameterSetDetail; lastComment: string | null }) {
  const notes: Array<{ tone: 'changes' | 'slate' | 'neutral'; text: React.ReactNode }> = [];
  if (set.state === 'retired')
    notes.push({
      tone: 'changes',
      text: <>Retired: do not use for new work. {lastComment && <span className="text-ink-soft">Reason: {lastComment}</span>}</>,
    });
  if (set.state === 'superseded' && set.currentApproved)
    notes.push({
      tone: 'slate',
      text: (
        <>
          Superseded by{' '}
          <Link className="underline" to={`/parameter-sets/${set.currentApproved.id}`}>
            v{set.currentApproved.version}
          </Link>
          .
        </>
      ),
    });
  if (set.revisedBy)
    notes.push({
      tone: 'neutral',
      text: (
        <>
          Revised as{' '}
          <Link className="underline" to={`/parameter-sets/${set.revisedBy}`}>
            a new draft
          </Link>
          .
        </>
      ),
    });
  if (set.revisionOf)
    notes.push({
      tone: 'neutral',
      text: (
        <>
          Revision of{' '}
          <Link className="underline" to={`/parameter-sets/${set.revisionOf}`}>
            the set sent back
          </Link>
          .
        </>
      ),
    });
  if (
    set.fit.dataSpan &&
    (set.validity.temperatureMinK < set.fit.dataSpan.temperatureMinK || set.validity.temperatureMaxK > set.fit.dataSpan.temperatureMaxK)
  ) {
    notes.push({
      tone: 'changes',
      text: (
        <>
          The validity range reaches beyond the fitted data ({set.fit.dataSpan.temperatureMinK}–{set.fit.dataSpan.temperatureMaxK} K):
          outside it the values are an extrapolation.
        </>
      ),
    });
  }
  if (!notes.length) return null;
  return (
    <div className="grid gap-2">
      {notes.map((n, i) => (
        <p
          key={i}
          role="status"
          className={`rounded-md px-4 py-2 text-sm ${n.tone === 'changes' ? 'bg-changes-soft text-changes' : n.tone === 'slate' ? 'bg-slate-soft text-slate' : 'bg-paper-deep'}`}
        >
          {n.text}
        </p>
      ))}
    </div>
  );
}

/** Everything behind the fit, shown as on the fit page, and — when another version is approved — the comparison with it. */
function FitEvidenceOfSet({ set }: { set: ParameterSetDetail }) {
  const fit = useFit(set.fitId);
  if (fit.isPending) return <LoadingState label="Loading the fit…" />;
  if (fit.isError) return <ErrorState error={fit.error} onRetry={() => fit.refetch()} />;
  const result = fit.data.result as LjFitResult | null;
  if (!hasEvidence(result)) return null;
  const { names, context } = fitContext(fit.data);
  const approved = set.currentApproved;
  const curves = [
    { label: `This set v${set.version}`, epsilonK: set.epsilonK, sigmaAngstrom: set.sigmaAngstrom },
    ...(approved && approved.id !== set.id
      ? [{ label: `Approved v${approved.version}`, epsilonK: approved.epsilonK, sigmaAngstrom: approved.sigmaAngstrom }]
      : []),
  ];
  return (
    <FitEvidence
      fit={fit.data}
      result={result}
      curves={curves}
      parametersTitle={`Fit #${fit.data.number}: parameters and statistics`}
      dataTitle={curves.length > 1 ? 'Data with both models' : 'Data and model'}
      comparison={
        approved && approved.id !== set.id ? (
          <Panel title={`Against the approved v${approved.version}`}>
            <ApprovedComparison set={set} approved={approved} points={result.residuals} context={context} measurementSetNames={names} />
          </Panel>
        ) : undefined
      }
    />
  );
}
