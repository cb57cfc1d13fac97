import { useState, type FormEvent } from 'react';
import { useQuery } from '@tanstack/react-query';
import { formatSignificant } from '@shared/format/numbers';
import { ErrorState, LoadingState } from '@/components/ui/states';
import { predictionsQueryOptions } from '../api/catalog';

const KINDS = [
  { kind: 'b2', label: 'B2' },
  { kind: 'viscosity', label: 'Dilute-gas viscosity' },
  { kind: 'density', label: 'Density ρ(T, P)' },
] as const;

/** Predictions of a set at the reader's own states, with the propagated uncertainty and a mark outside the validity range. */
export function PredictionsPanel({ setId, mie }: { setId: number; mie: boolean }) {
  const [kind, setKind] = useState<string>('b2');
  const [temps, setTemps] = useState('');
  const [pressures, setPressures] = useState('');
  const [asked, setAsked] = useState({ kind: 'b2', temps: '', pressures: '' });
  const q = useQuery(predictionsQueryOptions(setId, asked.kind, asked.temps, asked.pressures));
  const submit = (e: FormEvent) => {
    e.preventDefault();
    setAsked({ kind, temps, pressures });
  };
  return (
    <div>
      <form className="flex flex-wrap items-end gap-3 text-sm" aria-label="Predict at my states" onSubmit={submit}>
        <label className="grid gap-1">
          <span className="text-xs text-ink-faint">Property</span>
          <select className="rounded border border-rule bg-paper px-2 py-1" value={kind} onChange={(e) => setKind(e.target.value)}>
            {KINDS.filter((k) => !mie || k.kind !== 'density').map((k) => <option key={k.kind} value={k.kind}>{k.label}</option>)}
          </select>
        </label>
        <label className="grid gap-1">
          <span className="text-xs text-ink-faint">Temperatures (K, comma-separated)</span>
          <input className="rounded border border-rule bg-paper px-2 py-1" value={temps} onChange={(e) => setTemps(e.target.value)} placeholder="150, 300" />
        </label>
        {kind === 'density' && (
          <label className="grid gap-1">
            <span className="text-xs text-ink-faint">Pressures (MPa, one per temperature)</span>
            <input className="rounded border border-rule bg-paper px-2 py-1" value={pressures} onChange={(e) => setPressures(e.target.value)} placeholder="5, 10" />
          </label>
        )}
        <button type="submit" className="rounded-md bg-copper px-3 py-1.5 font-semibold text-paper-raised hover:bg-copper-dark">Predict</button>
      </form>
      {asked.temps.trim() === '' ? (
        <p className="mt-2 text-xs text-ink-faint">Give your own temperatures: the set predicts there with its uncertainty, and says where it would extrapolate.</p>
      ) : q.isPending ? (
        <LoadingState />
      ) : q.isError ? (
        <ErrorState error={q.error} />
      ) : (
        <>
          <table className="mt-3 w-full text-sm" aria-label="Predictions">
            <thead>
              <tr className="text-left text-xs text-ink-faint">
                <th className="py-1 font-semibold">T (K)</th>
                {q.data.kind === 'density' && <th className="py-1 font-semibold">P (MPa)</th>}
                <th className="py-1 text-right font-semibold">Value ({q.data.unit})</th>
                <th className="py-1 text-right font-semibold">95 % interval</th>
                <th className="py-1 font-semibold">Note</th>
              </tr>
            </thead>
            <tbody>
              {q.data.predictions.map((p) => (
                <tr key={`${p.temperatureK}-${p.pressureMPa ?? ''}`} className="border-t border-rule">
                  <td className="num py-1">{p.temperatureK}</td>
                  {q.data.kind === 'density' && <td className="num py-1">{p.pressureMPa}</td>}
                  <td className="num py-1 text-right">{formatSignificant(p.value, 5)} ± {formatSignificant(p.standardError, 2)}</td>
                  <td className="num py-1 text-right">{formatSignificant(p.lower95, 5)} … {formatSignificant(p.upper95, 5)}</td>
                  <td className={`py-1 text-xs ${p.outsideValidity ? 'text-changes' : 'text-ink-faint'}`}>{p.outsideValidity ? p.note : 'within the validity range'}</td>
                </tr>
              ))}
            </tbody>
          </table>
          <p className="mt-1 text-xs text-ink-faint">{q.data.method}.</p>
        </>
      )}
    </div>
  );
}
