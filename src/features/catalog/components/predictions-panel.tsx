import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { formatSignificant } from '@shared/format/numbers';
import { predictionQuery } from '@shared/schemas/catalog';
import { ErrorState, LoadingState } from '@/components/ui/states';
import { invalidProps, sameNames, useServerFieldErrors } from '@/lib/forms';
import { predictionsQueryOptions } from '../api/catalog';

const KINDS = [
  { kind: 'b2', label: 'B2' },
  { kind: 'viscosity', label: 'Dilute-gas viscosity' },
  { kind: 'density', label: 'Density ρ(T, P)' },
] as const;

const formShape = z.object({ kind: z.enum(['b2', 'viscosity', 'density']), temperaturesK: z.string(), pressuresMPa: z.string() });
type FormValues = z.input<typeof formShape>;

/** The boxes as the query asks them (pressures only for densities), judged by predictionQuery (the server's schema). */
const formSchema = formShape
  .transform((v): z.input<typeof predictionQuery> => ({
    kind: v.kind,
    temperaturesK: v.temperaturesK,
    ...(v.kind === 'density' ? { pressuresMPa: v.pressuresMPa } : {}),
  }))
  .pipe(predictionQuery);

/** Predictions of a set at the reader's own states, with the propagated uncertainty and a mark outside the validity range. */
export function PredictionsPanel({ setId, mie }: { setId: number; mie: boolean }) {
  const form = useForm<FormValues, unknown, z.output<typeof predictionQuery>>({
    resolver: zodResolver(formSchema),
    defaultValues: { kind: 'b2', temperaturesK: '', pressuresMPa: '' },
  });
  const errors = form.formState.errors;
  const kind = useWatch({ control: form.control, name: 'kind' });
  const [asked, setAsked] = useState({ kind: 'b2', temps: '', pressures: '' });
  const q = useQuery(predictionsQueryOptions(setId, asked.kind, asked.temps, asked.pressures));
  useServerFieldErrors(q.error, form.setError, sameNames(['kind', 'temperaturesK', 'pressuresMPa']));
  // The query takes the text as typed; the schema only judged it.
  const submit = form.handleSubmit(() => {
    const v = form.getValues();
    setAsked({ kind: v.kind, temps: v.temperaturesK, pressures: v.pressuresMPa });
  });
  const problem = (id: string, message: string | undefined) =>
    message ? (
      <span id={`${id}-error`} className="text-xs text-changes">
        {message}
      </span>
    ) : null;
  return (
    <div>
      <form noValidate className="flex flex-wrap items-end gap-3 text-sm" aria-label="Predict at my states" onSubmit={submit}>
        <label className="grid gap-1">
          <span className="text-xs text-ink-faint">Property</span>
          <select className="rounded border border-rule bg-paper px-2 py-1" {...form.register('kind')}>
            {KINDS.filter((k) => !mie || k.kind !== 'density').map((k) => (
              <option key={k.kind} value={k.kind}>
                {k.label}
              </option>
            ))}
          </select>
        </label>
        <label className="grid gap-1">
          <span className="text-xs text-ink-faint">Temperatures (K, comma-separated)</span>
          <input
            className="rounded border border-rule bg-paper px-2 py-1 aria-[invalid=true]:border-changes"
            placeholder="150, 300"
            {...invalidProps('predict-temperatures', errors.temperaturesK?.message)}
            {...form.register('temperaturesK')}
          />
          {problem('predict-temperatures', errors.temperaturesK?.message)}
        </label>
        {kind === 'density' && (
          <label className="grid gap-1">
            <span className="text-xs text-ink-faint">Pressures (MPa, one per temperature)</span>
            <input
              className="rounded border border-rule bg-paper px-2 py-1 aria-[invalid=true]:border-changes"
              placeholder="5, 10"
              {...invalidProps('predict-pressures', errors.pressuresMPa?.message)}
              {...form.register('pressuresMPa')}
            />
            {problem('predict-pressures', errors.pressuresMPa?.message)}
          </label>
        )}
        <button type="submit" className="rounded-md bg-copper px-3 py-1.5 font-semibold text-paper-raised hover:bg-copper-dark">
          Predict
        </button>
      </form>
      {asked.temps.trim() === '' ? (
        <p className="mt-2 text-xs text-ink-faint">
          Give your own temperatures: the set predicts there with its uncertainty, and says where it would extrapolate.
        </p>
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
                  <td className="num py-1 text-right">
                    {formatSignificant(p.value, 5)} ± {formatSignificant(p.standardError, 2)}
                  </td>
                  <td className="num py-1 text-right">
                    {formatSignificant(p.lower95, 5)} … {formatSignificant(p.upper95, 5)}
                  </td>
                  <td className={`py-1 text-xs ${p.outsideValidity ? 'text-changes' : 'text-ink-faint'}`}>
                    {p.outsideValidity ? p.note : 'within the validity range'}
                  </td>
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
