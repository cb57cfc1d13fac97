import { Fragment, useState, type ReactNode } from 'react';
import { FIT_KINDS } from '@shared/fitting/property-models';
import type { CreateFitBody } from '@shared/schemas/fits';
import { KindBadge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Field, Input, Select } from '@/components/ui/field';
import { Panel } from '@/components/ui/states';
import { detailsOf, detailText } from '@/lib/api-client';
import type { DatasetSummary } from '@/features/datasets/api/datasets';

type Choice = { checked: boolean; weight: string; excludeRows: number[]; excludeReason: string; picking: boolean };

/** Shows a set's rows with a tick box each (the page supplies it: rows belong to the datasets feature). */
export type RowPickerRenderer = (dataset: DatasetSummary, excluded: number[], onChange: (rows: number[]) => void) => ReactNode;

const num = (s: string) => Number(s.replace(',', '.'));

/** Measurement sets with weights, options, bounds and starting values; the server validates again. */
export function FitSetupForm({ substanceId, datasets, busy, error, onSubmit, renderRowPicker }: { substanceId: number; datasets: DatasetSummary[]; busy: boolean; error: Error | null; onSubmit: (body: CreateFitBody) => void; renderRowPicker?: RowPickerRenderer }) {
  const usable = datasets.filter((d) => !d.withdrawn);
  const fittable = (d: DatasetSummary) => (FIT_KINDS as string[]).includes(d.property);
  // Gas-phase sets (B2, B3, viscosity) are ticked by default; densities add a simulation stage of minutes and
  // saturation data (VLE) probe the liquid, so both are opt-in.
  const gasPhase = (d: DatasetSummary) => d.property === 'b2' || d.property === 'b3' || d.property === 'viscosity';
  const [choices, setChoices] = useState<Record<number, Choice>>(() => Object.fromEntries(usable.map((d) => [d.id, { checked: fittable(d) && gasPhase(d), weight: '1', excludeRows: [], excludeReason: '', picking: false }])));
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
  const [hold, setHold] = useState<'none' | 'epsilonK' | 'sigmaAngstrom'>('none');
  const [heldEps, setHeldEps] = useState('');
  const [heldSigma, setHeldSigma] = useState('');
  const update = (id: number, change: Partial<Choice>) => setChoices((all) => ({ ...all, [id]: { ...all[id], ...change } }));
  const [localError, setLocalError] = useState<string | null>(null);
  const serverDetails = detailsOf(error);

  const submit = () => {
    const chosen = usable.filter((d) => choices[d.id]?.checked && fittable(d));
    if (!chosen.length) return setLocalError('Choose at least one measurement set.');
    const weights = chosen.map((d) => num(choices[d.id].weight));
    if (weights.some((w) => !(w > 0))) return setLocalError('Weights must be positive numbers.');
    const heldValue = hold === 'epsilonK' ? num(heldEps) : hold === 'sigmaAngstrom' ? num(heldSigma) : null;
    if (heldValue !== null && !(heldValue > 0)) return setLocalError(`Give the value to hold ${hold === 'epsilonK' ? 'ε/k_B at, in K' : 'σ at, in Å'} (a positive number).`);
    for (const d of chosen) if (choices[d.id].excludeRows.length >= d.rowCount) return setLocalError(`Every row of ${d.name} is left out: untick it instead.`);
    const body: CreateFitBody = {
      substanceId,
      datasets: chosen.map((d, i) => {
        const c = choices[d.id];
        return { id: d.id, weight: weights[i], ...(c.excludeRows.length ? { excludeRows: c.excludeRows, ...(c.excludeReason.trim() ? { excludeReason: c.excludeReason.trim() } : {}) } : {}) };
      }),
      ...(heldValue !== null ? { fixed: { [hold]: heldValue } } : {}),
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
          <div className="overflow-x-auto">
          <table className="w-full text-left text-sm">
            <thead className="border-b border-rule text-xs tracking-wide text-ink-faint">
              <tr><th className="py-1.5">Use</th><th>Set</th><th>Kind</th><th className="text-right">Points</th><th className="w-28 pl-4">Weight</th>{renderRowPicker && <th>Rows left out</th>}</tr>
            </thead>
            <tbody>
              {usable.map((d) => {
                const c = choices[d.id];
                const ok = fittable(d);
                return (
                  <Fragment key={d.id}>
                  <tr className="border-b border-rule/60">
                    <td className="py-1.5">
                      <input type="checkbox" className="accent-copper" aria-label={`Use ${d.name}`} disabled={!ok} checked={c.checked && ok} onChange={(e) => update(d.id, { checked: e.target.checked })} />
                    </td>
                    <td>
                      <span className="font-semibold">{d.name}</span> <span className="text-ink-faint">v{d.version}</span>
                      {d.property === 'density' && <div className="text-xs text-ink-faint">Adds a simulation stage: NPT runs at every state point, a few rounds of them.</div>}
                    </td>
                    <td><KindBadge kind={d.property} /></td>
                    <td className="num text-right">{d.rowCount}</td>
                    <td className="pl-4">
                      <Input aria-label={`Weight of ${d.name}`} inputMode="decimal" value={c.weight} disabled={!ok || !c.checked} onChange={(e) => update(d.id, { weight: e.target.value })} />
                    </td>
                    {renderRowPicker && (
                      <td className="whitespace-nowrap">
                        <Button variant="quiet" aria-expanded={c.picking} disabled={!ok || !c.checked} onClick={() => update(d.id, { picking: !c.picking })}>
                          {c.excludeRows.length ? `${c.excludeRows.length} left out` : 'None'} · {c.picking ? 'hide rows' : 'choose'}
                        </Button>
                      </td>
                    )}
                  </tr>
                  {renderRowPicker && c.picking && ok && c.checked && (
                    <tr className="border-b border-rule/60">
                      <td />
                      <td colSpan={5} className="pb-3 pt-1">
                        <p className="mb-2 text-xs text-ink-faint">Tick the rows to leave out of this fit. They stay in the set, are predicted at the fitted values and drawn hollow, but never count in χ².</p>
                        {renderRowPicker(d, c.excludeRows, (rows) => update(d.id, { excludeRows: rows }))}
                        {c.excludeRows.length > 0 && (
                          <div className="mt-2">
                            <Field label={`Why rows ${c.excludeRows.join(', ')} are left out (optional)`} htmlFor={`exclude-reason-${d.id}`}>
                              <Input id={`exclude-reason-${d.id}`} maxLength={500} value={c.excludeReason} onChange={(e) => update(d.id, { excludeReason: e.target.value })} />
                            </Field>
                          </div>
                        )}
                      </td>
                    </tr>
                  )}
                  </Fragment>
                );
              })}
            </tbody>
          </table>
          </div>
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
          <fieldset className="grid gap-2 md:col-span-2">
            <legend className="text-sm font-semibold">Hold a parameter</legend>
            <p className="text-xs text-ink-faint">A held parameter is exact in the result: no standard error, and one degree of freedom more. Only one of the two can be held.</p>
            <div className="flex flex-wrap items-center gap-x-6 gap-y-2">
              <label className="flex items-center gap-2 text-sm">
                <input type="checkbox" role="switch" className="accent-copper" aria-label="Hold ε/k_B" checked={hold === 'epsilonK'} onChange={(e) => setHold(e.target.checked ? 'epsilonK' : 'none')} />
                <span className="w-24">Hold ε/k_B at</span>
                <Input aria-label="Held ε/k_B (K)" className="!w-24" inputMode="decimal" disabled={hold !== 'epsilonK'} value={heldEps} onChange={(e) => setHeldEps(e.target.value)} /> K
              </label>
              <label className="flex items-center gap-2 text-sm">
                <input type="checkbox" role="switch" className="accent-copper" aria-label="Hold σ" checked={hold === 'sigmaAngstrom'} onChange={(e) => setHold(e.target.checked ? 'sigmaAngstrom' : 'none')} />
                <span className="w-24">Hold σ at</span>
                <Input aria-label="Held σ (Å)" className="!w-24" inputMode="decimal" disabled={hold !== 'sigmaAngstrom'} value={heldSigma} onChange={(e) => setHeldSigma(e.target.value)} /> Å
              </label>
            </div>
          </fieldset>
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
          {serverDetails.length > 0 && <ul className="mt-1 list-disc pl-5">{serverDetails.map((d, i) => <li key={i}>{detailText(d)}</li>)}</ul>}
        </div>
      )}
      <div>
        <Button type="submit" variant="primary" busy={busy}>Run fit</Button>
      </div>
    </form>
  );
}
