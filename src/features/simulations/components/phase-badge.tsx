import { Badge } from '@/components/ui/badge';

export function PhaseBadge({ phase }: { phase: 'fluid' | 'solid' | 'two-phase' }) {
  if (phase === 'fluid') return <Badge tone="teal">fluid</Badge>;
  return <Badge tone="changes">{phase === 'solid' ? 'frozen: ordered solid' : 'split: vapour + liquid'}</Badge>;
}
