import { Badge } from '@/components/ui/badge';
import type { FitStatus } from '../api/fits';

const TONE = { queued: 'neutral', running: 'review', succeeded: 'approved', failed: 'changes', cancelled: 'slate' } as const;
const LABEL = { queued: 'Queued', running: 'Running', succeeded: 'Succeeded', failed: 'Failed', cancelled: 'Cancelled' };

export function FitStatusBadge({ status }: { status: FitStatus }) {
  return <Badge tone={TONE[status]}>{LABEL[status]}</Badge>;
}
