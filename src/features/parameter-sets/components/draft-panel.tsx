import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import type { LjFitResult } from '@shared/fitting/lj-fit';
import { schemeOfFit } from '@shared/parameter-sets/scheme';
import { roundValidity } from '@shared/parameter-sets/validity';
import type { Validity } from '@shared/schemas/parameter-sets';
import { Button } from '@/components/ui/button';
import { Panel } from '@/components/ui/states';
import { DraftParameterSetForm } from './draft-form';

/** On a succeeded fit's page: opens the draft form (defaults from the fit's data and settings) and goes to the new set once stored. */
export function DraftParameterSetPanel({ fitId, result }: { fitId: number; result: LjFitResult }) {
  const [open, setOpen] = useState(false);
  const navigate = useNavigate();
  const temperaturesK = result.residuals.map((p) => p.temperatureK);
  const pressuresMPa = result.residuals.flatMap((p) => (typeof p.pressureMPa === 'number' ? [p.pressureMPa] : []));
  // Rounded where they are made (0.01 K, 0.001 MPa, outward): °C and bar conversions leave float tails like 243.14999999999998.
  const span: Validity = { temperatureMinK: Math.min(...temperaturesK), temperatureMaxK: Math.max(...temperaturesK) };
  if (pressuresMPa.length && Math.min(...pressuresMPa) < Math.max(...pressuresMPa))
    Object.assign(span, { pressureMinMPa: Math.min(...pressuresMPa), pressureMaxMPa: Math.max(...pressuresMPa) });
  const validity = roundValidity(span);
  const { scheme, cutoffSigma } = schemeOfFit(result as LjFitResult & { mdSettings?: { scheme?: string; cutoff?: number } });
  return (
    <Panel
      title="Parameter set"
      actions={
        !open && (
          <Button variant="primary" onClick={() => setOpen(true)}>
            Draft a parameter set
          </Button>
        )
      }
    >
      {open ? (
        <DraftParameterSetForm
          fitId={fitId}
          defaults={{ scheme, cutoffSigma, validity }}
          onDrafted={(s) => navigate(`/parameter-sets/${s.id}`)}
        />
      ) : (
        <p className="text-sm text-ink-soft">
          Freeze these ε/k_B and σ, with their uncertainties and the exact data versions, as a parameter set for review.
        </p>
      )}
    </Panel>
  );
}
