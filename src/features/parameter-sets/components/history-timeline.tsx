import type { ParameterSetDetail } from '../api/parameter-sets';
import { formatDateTime } from '@shared/format/dates';
import { ParameterSetStateBadge } from './state-badge';

const MOVE_TEXT: Record<ParameterSetDetail['history'][number]['move'], string> = {
  create: 'drafted it',
  edit: 'edited the rationale or validity',
  submit: 'submitted it for review',
  approve: 'approved it',
  request_changes: 'requested changes',
  revise: 'drafted a revision',
  retire: 'retired it',
  supersede: 'marked it superseded',
};

/** Every recorded move, oldest first, with who, when and the comment given. */
export function HistoryTimeline({ history }: { history: ParameterSetDetail['history'] }) {
  return (
    <ol className="relative ml-2 border-l border-rule" aria-label="History">
      {history.map((h) => (
        <li key={h.id} className="mb-4 ml-4">
          <span className="absolute -left-1.5 mt-1.5 h-3 w-3 rounded-full border border-paper-raised bg-ink-faint" aria-hidden="true" />
          <div className="flex flex-wrap items-center gap-2 text-sm">
            <span className="font-semibold">{h.actorName ?? 'Someone'}</span>
            <span>{MOVE_TEXT[h.move]}</span>
            <ParameterSetStateBadge state={h.toState} />
            <time className="text-xs text-ink-faint" dateTime={h.at}>
              {formatDateTime(h.at)}
            </time>
          </div>
          {h.comment && <p className="mt-1 whitespace-pre-line text-sm text-ink-soft">{h.comment}</p>}
        </li>
      ))}
    </ol>
  );
}
