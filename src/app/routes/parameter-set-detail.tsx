import { Link, useNavigate, useParams } from 'react-router-dom';
import type { LjFitResult } from '@shared/fitting/lj-fit';
import { ErrorState, LoadingState, PageHeader, Panel } from '@/components/ui/states';
import { useFit } from '@/features/fits/api/fits';
import { EllipseChart } from '@/features/fits/components/ellipse-chart';
import { FitCurves } from '@/features/fits/components/fit-curves';
import { DatasetStatsTable, ParameterTable } from '@/features/fits/components/parameter-table';
import { useParameterSet, type ParameterSetDetail } from '@/features/parameter-sets/api/parameter-sets';
import { ParameterSetActions } from '@/features/parameter-sets/components/actions';
import { ApprovedComparison } from '@/features/parameter-sets/components/approved-comparison';
import { ParameterSetCaution } from '@/features/parameter-sets/components/caution';
import { CommentThread } from '@/features/parameter-sets/components/comment-thread';
import { FrozenValues, schemeText } from '@/features/parameter-sets/components/frozen-values';
import { HistoryTimeline } from '@/features/parameter-sets/components/history-timeline';
import { ParameterSetStateBadge } from '@/features/parameter-sets/components/state-badge';
import { DatasetSourcesTable } from '@/features/datasets/components/dataset-sources-table';

/** A parameter set: frozen values, state, review actions, the fit behind it and the approved version it would replace. */
export function ParameterSetDetailRoute() {
  const id = Number(useParams().parameterSetId);
  const query = useParameterSet(id);
  const navigate = useNavigate();
  if (query.isPending) return <LoadingState />;
  if (query.isError) return <ErrorState error={query.error} onRetry={() => query.refetch()} />;
  const s = query.data;
  const last = s.history[s.history.length - 1];
  return (
    <>
      <PageHeader
        eyebrow={<Link to={`/substances/${s.substanceId}`} className="hover:underline">{s.substanceName} · parameter sets</Link>}
        title={`${s.substanceName} v${s.version}`}
        subtitle={
          <span className="flex flex-wrap items-center gap-2">
            <ParameterSetStateBadge state={s.state} /> {schemeText(s)} · from <Link className="text-copper underline" to={`/fits/${s.fitId}`}>Fit #{s.fitNumber}</Link> · drafted by {s.createdByName}
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
            <ParameterSetActions set={s} onRevised={(r) => navigate(`/parameter-sets/${r.id}`)} />
          </Panel>
        </div>
        <Panel title="Rationale">
          <p className="whitespace-pre-line">{s.rationale}</p>
        </Panel>
        <FitEvidence set={s} />
        <Panel title="Measurement sets behind it">
          <DatasetSourcesTable rows={s.datasets} linkToDatasets showSha />
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
  if (set.state === 'retired') notes.push({ tone: 'changes', text: <>Retired: do not use for new work. {lastComment && <span className="text-ink-soft">Reason: {lastComment}</span>}</> });
  if (set.state === 'superseded' && set.currentApproved) notes.push({ tone: 'slate', text: <>Superseded by <Link className="underline" to={`/parameter-sets/${set.currentApproved.id}`}>v{set.currentApproved.version}</Link>.</> });
  if (set.revisedBy) notes.push({ tone: 'neutral', text: <>Revised as <Link className="underline" to={`/parameter-sets/${set.revisedBy}`}>a new draft</Link>.</> });
  if (set.revisionOf) notes.push({ tone: 'neutral', text: <>Revision of <Link className="underline" to={`/parameter-sets/${set.revisionOf}`}>the set sent back</Link>.</> });
  if (set.fit.dataSpan && (set.validity.temperatureMinK < set.fit.dataSpan.temperatureMinK || set.validity.temperatureMaxK > set.fit.dataSpan.temperatureMaxK)) {
    notes.push({ tone: 'changes', text: <>The validity range reaches beyond the fitted data ({set.fit.dataSpan.temperatureMinK}–{set.fit.dataSpan.temperatureMaxK} K): outside it the values are an extrapolation.</> });
  }
  if (!notes.length) return null;
  return (
    <div className="grid gap-2">
      {notes.map((n, i) => (
        <p key={i} role="status" className={`rounded-md px-4 py-2 text-sm ${n.tone === 'changes' ? 'bg-changes-soft text-changes' : n.tone === 'slate' ? 'bg-slate-soft text-slate' : 'bg-paper-deep'}`}>{n.text}</p>
      ))}
    </div>
  );
}

/** The fit's plots and statistics, and — when another version is approved — the comparison with it. */
function FitEvidence({ set }: { set: ParameterSetDetail }) {
  const fit = useFit(set.fitId);
  if (fit.isPending) return <LoadingState label="Loading the fit…" />;
  if (fit.isError) return <ErrorState error={fit.error} onRetry={() => fit.refetch()} />;
  const result = fit.data.result as LjFitResult | null;
  if (!result || result.status !== 'succeeded') return null;
  const names = Object.fromEntries(set.datasets.map((d) => [String(d.datasetId), `${d.name} v${d.version}`]));
  const context = { molarMassGPerMol: fit.data.options.molarMassGPerMol, quantumCorrection: !!fit.data.options.quantumCorrection };
  const approved = set.currentApproved;
  const curves = [{ label: `This set v${set.version}`, epsilonK: set.epsilonK, sigmaAngstrom: set.sigmaAngstrom }, ...(approved ? [{ label: `Approved v${approved.version}`, epsilonK: approved.epsilonK, sigmaAngstrom: approved.sigmaAngstrom }] : [])];
  return (
    <>
      {approved && (
        <Panel title={`Against the approved v${approved.version}`}>
          <ApprovedComparison set={set} approved={approved} points={result.residuals} context={context} datasetNames={names} />
        </Panel>
      )}
      {result.warnings.length > 0 && (
        <div role="status" className="rounded-lg border border-review/40 bg-review-soft/70 px-5 py-3">
          <p className="font-semibold text-review">Warnings of Fit #{fit.data.number}</p>
          <ul className="mt-1 list-disc pl-5 text-sm">{result.warnings.map((w) => <li key={w}>{w}</li>)}</ul>
        </div>
      )}
      <div className="grid gap-6 lg:grid-cols-[3fr_2fr]">
        <Panel title={`Fit #${fit.data.number}: parameters and statistics`}>
          <ParameterTable result={result} energy="K" length="Å" />
        </Panel>
        <Panel title="95 % joint confidence region">
          <EllipseChart result={result} />
        </Panel>
      </div>
      <Panel title={approved ? 'Data with both models' : 'Data and model'}>
        <FitCurves result={result} datasetNames={names} context={context} curves={curves} />
        {approved && <p className="mt-2 text-xs text-ink-faint">Residuals underneath are those of this set’s fit.</p>}
      </Panel>
      <Panel title="Per measurement set">
        <DatasetStatsTable result={result} names={names} />
      </Panel>
    </>
  );
}
