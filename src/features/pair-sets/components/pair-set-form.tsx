import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { Field, Select } from '@/components/ui/field';
import { ErrorState, LoadingState } from '@/components/ui/states';
import { detailsOf, detailText } from '@/lib/api-client';
import { useApprovedSets, useB12MeasurementSets, useCreatePairSet } from '../api/pair-sets';

/** Modeller's form: two approved sets held fixed, one B12 measurement set, fit k_ij (and l_ij) and send to review. */
export function PairSetForm() {
  const sets = useApprovedSets(true);
  const measurementSets = useB12MeasurementSets(true);
  const create = useCreatePairSet();
  const [a, setA] = useState('');
  const [b, setB] = useState('');
  const [measurementSetId, setMeasurementSetId] = useState('');
  const [fitLij, setFitLij] = useState(false);
  if (sets.isPending || measurementSets.isPending) return <LoadingState />;
  if (sets.isError) return <ErrorState error={sets.error} onRetry={() => sets.refetch()} />;
  if (measurementSets.isError) return <ErrorState error={measurementSets.error} onRetry={() => measurementSets.refetch()} />;
  const ready = a && b && a !== b && measurementSetId;
  return (
    <form
      className="grid gap-3"
      aria-label="Fit a pair set"
      onSubmit={(e) => {
        e.preventDefault();
        if (!ready) return;
        create.mutate({ parameterSetIds: [Number(a), Number(b)], measurementSetId: Number(measurementSetId), fitLij });
      }}
    >
      <div className="grid gap-3 sm:grid-cols-2">
        {[
          { id: 'pair-set-a', label: 'First approved set', value: a, set: setA },
          { id: 'pair-set-b', label: 'Second approved set', value: b, set: setB },
        ].map((f) => (
          <Field key={f.id} label={f.label} htmlFor={f.id}>
            <Select id={f.id} value={f.value} onChange={(e) => f.set(e.target.value)}>
              <option value="">Choose…</option>
              {sets.data.map((s) => (
                <option key={s.id} value={s.id}>
                  {s.substanceName} v{s.version} (ε/k_B = {s.epsilonK.toFixed(2)} K, σ = {s.sigmaAngstrom.toFixed(4)} Å)
                </option>
              ))}
            </Select>
          </Field>
        ))}
      </div>
      <Field label="Cross second virial coefficients B12" htmlFor="pair-set-data" hint={measurementSets.data.length === 0 ? 'Upload a B12 table (T, B12, u(B12)) with one of the two substances first.' : undefined}>
        <Select id="pair-set-data" value={measurementSetId} onChange={(e) => setMeasurementSetId(e.target.value)}>
          <option value="">Choose…</option>
          {measurementSets.data.map((d) => (
            <option key={d.id} value={d.id}>
              {d.name} ({d.substanceName}, v{d.version}, {d.rowCount} rows)
            </option>
          ))}
        </Select>
      </Field>
      <label className="flex items-center gap-2 text-sm">
        <input type="checkbox" className="accent-copper" checked={fitLij} onChange={(e) => setFitLij(e.target.checked)} />
        Also fit l_ij in σ12 = (1 − l_ij)(σ1 + σ2)/2
      </label>
      {a && a === b && <p className="text-sm text-changes">Choose two different sets.</p>}
      {create.isError && (
        <div role="alert" className="rounded-md bg-changes-soft px-4 py-2 text-sm text-changes">
          {create.error.message}
          {detailsOf(create.error).map((d, i) => (
            <div key={i}>{detailText(d)}</div>
          ))}
        </div>
      )}
      {create.isSuccess && (
        <p role="status" className="text-sm text-approved">
          Pair set #{create.data.id} fitted: k_ij = {create.data.kij.toFixed(4)} ± {create.data.kijStdErr?.toFixed(4) ?? '?'}; it waits for review.
        </p>
      )}
      <div>
        <Button type="submit" variant="primary" disabled={!ready} busy={create.isPending}>
          Fit k_ij and send to review
        </Button>
      </div>
    </form>
  );
}
