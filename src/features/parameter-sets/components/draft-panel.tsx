import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { Panel } from '@/components/ui/states';
import { DraftParameterSetForm } from './draft-form';

/** On a succeeded fit's page: opens the draft form and goes to the new set once it is stored. */
export function DraftParameterSetPanel({ fitId, temperaturesK }: { fitId: number; temperaturesK: number[] }) {
  const [open, setOpen] = useState(false);
  const navigate = useNavigate();
  const dataSpan = { temperatureMinK: Math.min(...temperaturesK), temperatureMaxK: Math.max(...temperaturesK) };
  return (
    <Panel title="Parameter set" actions={!open && <Button variant="primary" onClick={() => setOpen(true)}>Draft a parameter set</Button>}>
      {open ? (
        <DraftParameterSetForm fitId={fitId} dataSpan={dataSpan} onDrafted={(s) => navigate(`/parameter-sets/${s.id}`)} />
      ) : (
        <p className="text-sm text-ink-soft">Freeze these ε/k_B and σ, with their uncertainties and the exact data versions, as a parameter set for review.</p>
      )}
    </Panel>
  );
}
