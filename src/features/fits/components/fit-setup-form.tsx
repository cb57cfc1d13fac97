import { useState } from 'react';
import { FIT_KINDS } from '@shared/fitting/property-models';
import type { CreateFitBody } from '@shared/schemas/fits';
import { KindBadge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Field, Input, Select } from '@/components/ui/field';
import { Panel } from '@/components/ui/states';
import { ApiError } from '@/lib/api-client';
import type { DatasetSummary } from '@/features/datasets/api/datasets';

type Choice = { checked: boolean; weight: string };

const num = (s: string) => Number(s.replace(',', '.'));

/** Measurement sets with weights, options, bounds and starting values; the server validates again. */
export function FitSetupForm({ substanceId, datasets, busy, error, onSubmit }: { substanceId: number; datasets: DatasetSummary[]; busy: boolean; error: Error | null; onSubmit: (body: CreateFitBody) => void }) {
  const usable = datasets.filter((d) => !d.withdrawn);
  const fittable = (d: DatasetSummary) => (FIT_KINDS as string[]).includes(d.property);
  // Gas-phase sets are ticked by default; densities add a simulation stage of minutes, so they are opt-in.
  const [choices, setChoices] = useState<Record<number, Choice>>(() => Object.fromEntries(usable.map((d) => [d.id, { checked: fittable(d) && d.property !== 'density', weight: '1' }])));
  const [mdAtoms, setMdAtoms] = useState('256');
  const [mdSteps, setMdSteps] = useState('10000');
  const [mdCutoff, setMdCutoff] = useState('2.5');
  const [mdScheme, setMdScheme] = useState<'truncated-tail' | 'truncated-shifted'>('truncated-tail');
  const densityChosen = usable.some((d) => d.property === 'density' && choices[d.id]?.checked);
  const [quantum, setQuantum] = useState(false);
  const [manualStart, setManualStart] = useState(false);
  const [startEps, setStartEps] = useState('');
  const [startSigma, setStartSigma] = useState('');
  const [epsBounds, setEpsBounds] = useState(['1', '5000']);
  const [sigmaBounds, setSigmaBounds] = useState(['1', '15']);
  const [restarts, setRestarts] = useState('2');
  const [localError, setLocalError] = useState<string | null>(null);
  const serverDetails = error instanceof ApiError ? error.details ?? [] : [];

  const submit = () => {
    const chosen = usable.filter((d) => choices[d.id]?.checked && fittable(d));
    if (!chosen.length) return setLocalError('Choose at least one measurement set.');
    const weights = chosen.map((d) => num(choices[d.id].weight));
    if (weights.some((w) => !(w > 0))) return setLocalError('Weights must be positive numbers.');
    const body: CreateFitBody = {
      substanceId,
      datasets: chosen.map((d, i) => ({ id: d.id, weight: weights[i] })),
      options: {
        quantumCorrection: quantum,
        bounds: { epsilonK: [num(epsBounds[0]), num(epsBounds[1])], sigmaAngstrom: [num(sigmaBounds[0]), num(sigmaBounds[1])] },
        restarts: Math.round(num(restarts)),
        ...(manualStart ? { start: { epsilonK: num(startEps), sigmaAngstrom: num(startSigma) } } : {}),
        ...(chosen.some((d) => d.property === 'density') ? { density: { atoms: Math.round(num(mdAtoms)), steps: Math.round(num(mdSteps)), cutoff: num(mdCutoff), scheme: mdScheme } } : {}),
      },
    };
    setLocalError(null);
    onSubmit(body);
  };

  return (
    <form
      className="grid gap-6"
      onSubmit={(e) => {
        e.preventDefault();
        submit();
      }}
    >
      <Panel title="Measurement sets">
        {usable.length === 0 ? (
          <p className="text-ink-soft">This substance has no measurement sets in use. Upload one first.</p>
        ) : (
          <table className="w-full text-left text-sm">
            <thead className="border-b border-rule text-xs tracking-wide text-ink-faint">
              <tr><th className="py-1.5">Use</th><th>Set</th><th>Kind</th><th className="text-right">Points</th><th className="w-28 pl-4">Weight</th></tr>
            </thead>
            <tbody>
              {usable.map((d) => {
                const c = choices[d.id];
                const ok = fittable(d);
                return (
                  <tr key={d.id} className="border-b border-rule/60">
                    <td className="py-1.5">
                      <input type="checkbox" className="accent-copper" aria-label={`Use ${d.name}`} disabled={!ok} checked={c.checked && ok} onChange={(e) => setChoices({ ...choices, [d.id]: { ...c, checked: e.target.checked } })} />
                    </td>
                    <td>
                      <span className="font-semibold">{d.name}</span> <span className="text-ink-faint">v{d.version}</span>
                      {d.property === 'density' && <div className="text-xs text-ink-faint">Adds a simulation stage: NPT runs at every state point, a few rounds of them.</div>}
                    </td>
                    <td><KindBadge kind={d.property} /></td>
                    <td className="num text-right">{d.rowCount}</td>
                    <td className="pl-4">
                      <Input aria-label={`Weight of ${d.name}`} inputMode="decimal" value={c.weight} disabled={!ok || !c.checked} onChange={(e) => setChoices({ ...choices, [d.id]: { ...c, weight: e.target.value } })} />
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        )}
        <p className="mt-3 text-xs text-ink-faint">A weight multiplies 1/u for every point of its set: residuals are weight·(model − measured)/u.</p>
      </Panel>
      <Panel title="Options">
        <div className="grid gap-4 md:grid-cols-2">
          <label className="flex items-start gap-2 text-sm md:col-span-2">
            <input type="checkbox" className="mt-1 accent-copper" checked={quantum} onChange={(e) => setQuantum(e.target.checked)} />
            <span>
              <span className="font-semibold">Quantum correction to B2</span> — first-order Wigner–Kirkwood term, for light gases (He, H₂, Ne). Uses the substance's molar mass.
            </span>
          </label>
          <Field label="ε/k_B bounds (K)" htmlFor="eps-lo">
            <div className="flex gap-2">
              <Input id="eps-lo" aria-label="ε/k_B lower bound (K)" inputMode="decimal" value={epsBounds[0]} onChange={(e) => setEpsBounds([e.target.value, epsBounds[1]])} />
              <Input aria-label="ε/k_B upper bound (K)" inputMode="decimal" value={epsBounds[1]} onChange={(e) => setEpsBounds([epsBounds[0], e.target.value])} />
            </div>
          </Field>
          <Field label="σ bounds (Å)" htmlFor="sigma-lo">
            <div className="flex gap-2">
              <Input id="sigma-lo" aria-label="σ lower bound (Å)" inputMode="decimal" value={sigmaBounds[0]} onChange={(e) => setSigmaBounds([e.target.value, sigmaBounds[1]])} />
              <Input aria-label="σ upper bound (Å)" inputMode="decimal" value={sigmaBounds[1]} onChange={(e) => setSigmaBounds([sigmaBounds[0], e.target.value])} />
            </div>
          </Field>
          <Field label="Restarts from perturbed starts" htmlFor="restarts" hint="Guards against a poor local minimum; the lowest χ² wins.">
            <Input id="restarts" inputMode="numeric" value={restarts} onChange={(e) => setRestarts(e.target.value)} />
          </Field>
          <div className="grid gap-2">
            <label className="flex items-center gap-2 text-sm font-semibold">
              <input type="checkbox" className="accent-copper" checked={manualStart} onChange={(e) => setManualStart(e.target.checked)} />
              Set starting values myself
            </label>
            {manualStart ? (
              <div className="flex gap-2">
                <Input aria-label="Starting ε/k_B (K)" placeholder="ε/k_B (K)" inputMode="decimal" value={startEps} onChange={(e) => setStartEps(e.target.value)} />
                <Input aria-label="Starting σ (Å)" placeholder="σ (Å)" inputMode="decimal" value={startSigma} onChange={(e) => setStartSigma(e.target.value)} />
              </div>
            ) : (
              <p className="text-xs text-ink-faint">Automatic: from the Boyle temperature where B2 changes sign and the B2 magnitude, or a scan in ε for viscosity alone.</p>
            )}
          </div>
        </div>
      </Panel>
      {densityChosen && (
        <Panel title="Simulation stage (densities)">
          <p className="mb-3 text-sm text-ink-soft">The equation of state (Johnson, Zollweg & Gubbins 1993) fits first; its parameters start rounds of NPT simulations at the measured state points. Runs are cached by reduced state and settings and shared between fits.</p>
          <div className="grid gap-4 md:grid-cols-4">
            <Field label="Atoms" htmlFor="md-atoms"><Input id="md-atoms" inputMode="numeric" value={mdAtoms} onChange={(e) => setMdAtoms(e.target.value)} /></Field>
            <Field label="MD steps per run" htmlFor="md-steps"><Input id="md-steps" inputMode="numeric" value={mdSteps} onChange={(e) => setMdSteps(e.target.value)} /></Field>
            <Field label="Cutoff rc/σ" htmlFor="md-cutoff"><Input id="md-cutoff" inputMode="decimal" value={mdCutoff} onChange={(e) => setMdCutoff(e.target.value)} /></Field>
            <Field label="Scheme" htmlFor="md-scheme">
              <Select id="md-scheme" value={mdScheme} onChange={(e) => setMdScheme(e.target.value as typeof mdScheme)}>
                <option value="truncated-tail">truncated + tail corrections</option>
                <option value="truncated-shifted">truncated and shifted</option>
              </Select>
            </Field>
          </div>
        </Panel>
      )}
      {(localError || error) && (
        <div role="alert" className="rounded-md bg-changes-soft px-3 py-2 text-sm text-changes">
          <p className="font-semibold">{localError ?? error?.message}</p>
          {serverDetails.length > 0 && <ul className="mt-1 list-disc pl-5">{serverDetails.map((d, i) => <li key={i}>{d.field ? `${d.field}: ` : ''}{d.message}</li>)}</ul>}
        </div>
      )}
      <div>
        <Button type="submit" variant="primary" busy={busy}>Run fit</Button>
      </div>
    </form>
  );
}
