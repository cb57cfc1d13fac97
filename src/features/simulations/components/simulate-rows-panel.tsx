import { zodResolver } from '@hookform/resolvers/zod';
import { useForm, useWatch } from 'react-hook-form';
import { Link } from 'react-router-dom';
import { z } from 'zod';
import { FIELD_LABELS } from '@shared/schemas/field-labels';
import { simulationsFromMeasurementSetBody } from '@shared/schemas/simulations';
import { Button } from '@/components/ui/button';
import { Field, Input } from '@/components/ui/field';
import { decimalOf, firstMessage, invalidProps, useServerFieldErrors } from '@/lib/forms';
import { useStartSimulationsFromMeasurementSet } from '../api/simulations';

const formShape = z.object({ epsilonK: z.string(), sigmaAngstrom: z.string(), rows: z.string() });
type FormValues = z.input<typeof formShape>;

/** The boxes as typed become the request ("3, 4 7" is rows [3, 4, 7]), judged by the server's schema. */
const formSchema = (measurementSetId: number, version: number) =>
  formShape
    .transform((v): z.input<typeof simulationsFromMeasurementSetBody> => ({
      measurementSetId,
      version,
      epsilonK: decimalOf(v.epsilonK) ?? Number.NaN,
      sigmaAngstrom: decimalOf(v.sigmaAngstrom) ?? Number.NaN,
      ...(v.rows.trim()
        ? {
            rows: v.rows
              .split(/[\s,;]+/)
              .filter(Boolean)
              .map(Number),
          }
        : {}),
    }))
    .pipe(simulationsFromMeasurementSetBody);

/** A refusal's field as this form's box (`rows.2` is the rows box). */
const placeOf = (field: string): keyof FormValues | null =>
  field === 'epsilonK' || field === 'sigmaAngstrom' ? field : field === 'rows' || field.startsWith('rows.') ? 'rows' : null;

/** Run NPT simulations at the measured state points of a density set, mapped with trial ε and σ. */
export function SimulateRowsPanel({ measurementSetId, version }: { measurementSetId: number; version: number }) {
  const start = useStartSimulationsFromMeasurementSet();
  const form = useForm<FormValues, unknown, z.output<typeof simulationsFromMeasurementSetBody>>({
    resolver: zodResolver(formSchema(measurementSetId, version)),
    defaultValues: { epsilonK: '', sigmaAngstrom: '', rows: '' },
  });
  const errors = form.formState.errors;
  const [eps, sigma] = useWatch({ control: form.control, name: ['epsilonK', 'sigmaAngstrom'] });
  useServerFieldErrors(start.error, form.setError, placeOf);
  const rowsError = firstMessage(errors.rows);
  return (
    <form noValidate className="grid gap-3" onSubmit={form.handleSubmit((body) => start.mutate(body))}>
      <p className="text-sm text-ink-soft">
        Each measured (T, P) maps to T* = T/(ε/k_B), P* = Pσ³/ε; one NPT run per row. Runs at a reduced state already simulated are reused.
      </p>
      <div className="grid grid-cols-2 gap-3">
        <Field label={FIELD_LABELS.epsilonK} htmlFor="sim-eps" error={errors.epsilonK?.message}>
          <Input id="sim-eps" inputMode="decimal" {...invalidProps('sim-eps', errors.epsilonK?.message)} {...form.register('epsilonK')} />
        </Field>
        <Field label={FIELD_LABELS.sigmaAngstrom} htmlFor="sim-sigma" error={errors.sigmaAngstrom?.message}>
          <Input
            id="sim-sigma"
            inputMode="decimal"
            {...invalidProps('sim-sigma', errors.sigmaAngstrom?.message)}
            {...form.register('sigmaAngstrom')}
          />
        </Field>
      </div>
      <Field label="File rows (optional)" htmlFor="sim-rows" hint="e.g. 3, 4, 7 — all rows when empty" error={rowsError}>
        <Input id="sim-rows" {...invalidProps('sim-rows', rowsError)} {...form.register('rows')} />
      </Field>
      {start.isError && (
        <p role="alert" className="text-sm text-changes">
          {start.error.message}
        </p>
      )}
      {start.isSuccess && (
        <p role="status" className="text-sm text-approved">
          {start.data.runs.length} run(s): {start.data.runs.filter((r) => r.reused).length} reused.{' '}
          <Link className="underline" to="/simulations">
            Follow them on the Simulations page
          </Link>
          .
        </p>
      )}
      <div>
        <Button type="submit" busy={start.isPending} disabled={!(Number(eps) > 0 && Number(sigma) > 0)}>
          Simulate state points
        </Button>
      </div>
    </form>
  );
}
