import { useState } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { Field, Input } from '@/components/ui/field';
import { useStartSimulationsFromMeasurementSet } from '../api/simulations';

/** Run NPT simulations at the measured state points of a density set, mapped with trial ε and σ. */
export function SimulateRowsPanel({ measurementSetId, version }: { measurementSetId: number; version: number }) {
  const start = useStartSimulationsFromMeasurementSet();
  const [eps, setEps] = useState('');
  const [sigma, setSigma] = useState('');
  const [rows, setRows] = useState('');
  const parsedRows = rows.trim() ? rows.split(/[\s,;]+/).filter(Boolean).map(Number) : undefined;
  return (
    <form
      className="grid gap-3"
      onSubmit={(e) => {
        e.preventDefault();
        start.mutate({ measurementSetId, version, epsilonK: Number(eps.replace(',', '.')), sigmaAngstrom: Number(sigma.replace(',', '.')), rows: parsedRows });
      }}
    >
      <p className="text-sm text-ink-soft">Each measured (T, P) maps to T* = T/(ε/k_B), P* = Pσ³/ε; one NPT run per row. Runs at a reduced state already simulated are reused.</p>
      <div className="grid grid-cols-2 gap-3">
        <Field label="ε/k_B (K)" htmlFor="sim-eps"><Input id="sim-eps" inputMode="decimal" value={eps} onChange={(e) => setEps(e.target.value)} /></Field>
        <Field label="σ (Å)" htmlFor="sim-sigma"><Input id="sim-sigma" inputMode="decimal" value={sigma} onChange={(e) => setSigma(e.target.value)} /></Field>
      </div>
      <Field label="File rows (optional)" htmlFor="sim-rows" hint="e.g. 3, 4, 7 — all rows when empty">
        <Input id="sim-rows" value={rows} onChange={(e) => setRows(e.target.value)} />
      </Field>
      {start.isError && <p role="alert" className="text-sm text-changes">{start.error.message}</p>}
      {start.isSuccess && (
        <p role="status" className="text-sm text-approved">
          {start.data.runs.length} run(s): {start.data.runs.filter((r) => r.reused).length} reused. <Link className="underline" to="/simulations">Follow them on the Simulations page</Link>.
        </p>
      )}
      <div><Button type="submit" busy={start.isPending} disabled={!(Number(eps) > 0 && Number(sigma) > 0)}>Simulate state points</Button></div>
    </form>
  );
}
