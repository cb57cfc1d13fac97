import { STATE_LABELS, type ParameterSetState } from '@shared/parameter-sets/transitions';
import { Badge, type BadgeTone } from '@/components/ui/badge';

/** DESIGN.md: approved deep green, in review amber, changes requested brick red, superseded and retired slate. */
const TONE: Record<ParameterSetState, BadgeTone> = {
  draft: 'neutral',
  in_review: 'review',
  approved: 'approved',
  changes_requested: 'changes',
  superseded: 'slate',
  retired: 'slate',
};

export function ParameterSetStateBadge({ state }: { state: ParameterSetState }) {
  return <Badge tone={TONE[state]}>{STATE_LABELS[state]}</Badge>;
}
