import { useState } from 'react';
import { Badge, type BadgeTone } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { useCan } from '@/lib/authorization';
import { usePairSets, useReviewPairSet, type PairSetView } from '../api/pair-sets';

const STATE: Record<PairSetView['state'], { label: string; tone: BadgeTone }> = {
  in_review: { label: 'In review', tone: 'review' },
  approved: { label: 'Approved', tone: 'approved' },
  changes_requested: { label: 'Changes requested', tone: 'changes' },
};

const pm = (value: number, err: number | null, digits: number) => `${value.toFixed(digits)} ± ${err === null ? '?' : err.toFixed(digits)}`;

/** Every pair set with its fitted values; reviewers decide the ones in review (never their own: the server checks). */
export function PairSetTable() {
  const list = usePairSets();
  const canReview = useCan('parameterSet:review');
  const review = useReviewPairSet();
  const [comment, setComment] = useState<Record<number, string>>({});
  if (list.isPending) return <LoadingState />;
  if (list.isError) return <ErrorState error={list.error} onRetry={() => list.refetch()} />;
  if (list.data.length === 0)
    return <EmptyState title="No pair sets yet">A modeller fits k_ij to measured B12 of two approved sets.</EmptyState>;
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm" aria-label="Pair sets">
        <thead className="border-b border-rule text-xs tracking-wide text-ink-faint">
          <tr>
            <th className="py-1.5 text-left">#</th>
            <th className="text-left">Pair</th>
            <th className="text-right">k_ij</th>
            <th className="text-right">l_ij</th>
            <th className="text-right normal-case">ε12/k_B (K)</th>
            <th className="text-right normal-case">σ12 (Å)</th>
            <th className="pl-4 text-left">State</th>
            <th className="text-left">By</th>
            {canReview && <th className="text-left">Decision</th>}
          </tr>
        </thead>
        <tbody>
          {list.data.map((p) => (
            <tr key={p.id} className="border-b border-rule/60 align-top">
              <td className="num py-1.5">{p.id}</td>
              <td>
                {p.setA.substanceName} v{p.setA.version} + {p.setB.substanceName} v{p.setB.version}
                <div className="text-xs text-ink-faint">
                  {p.measurementSet.name} v{p.measurementSet.version}
                </div>
              </td>
              <td className="num text-right">{pm(p.kij, p.kijStdErr, 4)}</td>
              <td className="num text-right">{p.lij === null ? '—' : pm(p.lij, p.lijStdErr, 4)}</td>
              <td className="num text-right">{pm(p.epsilon12K, p.epsilon12StdErrK, 2)}</td>
              <td className="num text-right">{pm(p.sigma12Angstrom, p.sigma12StdErrAngstrom, 4)}</td>
              <td className="pl-4">
                <Badge tone={STATE[p.state].tone}>{STATE[p.state].label}</Badge>
                {p.reviewComment && <div className="text-xs text-ink-faint">“{p.reviewComment}”</div>}
              </td>
              <td>{p.createdBy.name}</td>
              {canReview && (
                <td>
                  {p.state === 'in_review' && (
                    <div className="grid gap-1">
                      <label className="sr-only" htmlFor={`pair-set-comment-${p.id}`}>
                        Comment on pair set {p.id}
                      </label>
                      <input
                        id={`pair-set-comment-${p.id}`}
                        className="rounded border border-rule bg-paper-raised px-2 py-1 text-sm"
                        placeholder="Comment"
                        value={comment[p.id] ?? ''}
                        onChange={(e) => setComment({ ...comment, [p.id]: e.target.value })}
                      />
                      <div className="flex gap-1">
                        <Button
                          variant="primary"
                          busy={review.isPending}
                          onClick={() => review.mutate({ id: p.id, decision: 'approve', comment: comment[p.id] })}
                        >
                          Approve pair set {p.id}
                        </Button>
                        <Button
                          variant="danger"
                          disabled={!comment[p.id]}
                          onClick={() => review.mutate({ id: p.id, decision: 'request-changes', comment: comment[p.id] })}
                        >
                          Request changes
                        </Button>
                      </div>
                    </div>
                  )}
                </td>
              )}
            </tr>
          ))}
        </tbody>
      </table>
      {review.isError && (
        <p role="alert" className="mt-2 rounded-md bg-changes-soft px-4 py-2 text-sm text-changes">
          {review.error.message}
        </p>
      )}
    </div>
  );
}
