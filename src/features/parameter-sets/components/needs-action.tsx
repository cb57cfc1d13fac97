import { Link } from 'react-router-dom';
import { formatDate } from '@shared/format/dates';
import { Badge } from '@/components/ui/badge';
import { ErrorState, LoadingState } from '@/components/ui/states';
import { useNeedsAction, type NeedsActionItem } from '../api/parameter-sets';

const KIND: Record<NeedsActionItem['kind'], { label: string; tone: 'changes' | 'neutral' | 'review'; what: string }> = {
  'changes-requested': { label: 'Sent back', tone: 'changes', what: 'read the review and draft a revision' },
  draft: { label: 'Draft', tone: 'neutral', what: 'finish and submit it for review' },
  'awaiting-my-review': { label: 'Awaiting your review', tone: 'review', what: 'approve it or send it back' },
};

/** The Workbench's "Needs my action": sets sent back to me, my drafts, sets awaiting my review. */
export function NeedsActionList() {
  const items = useNeedsAction();
  if (items.isPending) return <LoadingState label="Looking for work waiting on you…" />;
  if (items.isError) return <ErrorState error={items.error} onRetry={() => items.refetch()} />;
  if (!items.data.length)
    return <p className="text-ink-soft">Nothing waits on you: no set sent back, no draft of yours, nothing to review.</p>;
  return (
    <ul className="divide-y divide-rule/70" aria-label="Needs my action">
      {items.data.map((i) => {
        const k = KIND[i.kind];
        return (
          <li key={`${i.kind}-${i.parameterSetId}`} className="flex flex-wrap items-center justify-between gap-x-3 gap-y-1 py-2">
            <span className="min-w-0">
              <Link
                to={`/parameter-sets/${i.parameterSetId}`}
                className="font-semibold underline decoration-rule underline-offset-4 hover:decoration-copper"
              >
                {i.substanceName} v{i.version}
              </Link>
              <span className="text-sm text-ink-soft"> — {k.what}</span>
            </span>
            <span className="flex items-center gap-2 text-xs text-ink-faint">
              <Badge tone={k.tone}>{k.label}</Badge>
              since {formatDate(i.since)}
            </span>
          </li>
        );
      })}
    </ul>
  );
}
