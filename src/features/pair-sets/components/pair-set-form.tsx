import { zodResolver } from '@hookform/resolvers/zod';
import { useForm, useWatch } from 'react-hook-form';
import { z } from 'zod';
import { pairSetCreateBody } from '@shared/schemas/pair-sets';
import { Button } from '@/components/ui/button';
import { Field, Select } from '@/components/ui/field';
import { ErrorState, LoadingState } from '@/components/ui/states';
import { detailText } from '@/lib/api-client';
import { invalidProps, sameNames, useServerFieldErrors } from '@/lib/forms';
import { useApprovedSets, useB12MeasurementSets, useCreatePairSet } from '../api/pair-sets';

const formShape = z.object({ parameterSetIds: z.tuple([z.string(), z.string()]), measurementSetId: z.string(), fitLij: z.boolean() });
type FormValues = z.input<typeof formShape>;

/** The choices become the request, judged by pairSetCreateBody (the server's schema). */
const formSchema = formShape
  .transform((v): z.input<typeof pairSetCreateBody> => ({
    parameterSetIds: v.parameterSetIds.map(Number),
    measurementSetId: Number(v.measurementSetId),
    fitLij: v.fitLij,
  }))
  .pipe(pairSetCreateBody);

/** Modeller's form: two approved sets held fixed, one B12 measurement set, fit k_ij (and l_ij) and send to review. */
export function PairSetForm() {
  const sets = useApprovedSets(true);
  const measurementSets = useB12MeasurementSets(true);
  const create = useCreatePairSet();
  const form = useForm<FormValues, unknown, z.output<typeof pairSetCreateBody>>({
    resolver: zodResolver(formSchema),
    defaultValues: { parameterSetIds: ['', ''], measurementSetId: '', fitLij: false },
  });
  const errors = form.formState.errors;
  const [[a, b], measurementSetId] = useWatch({ control: form.control, name: ['parameterSetIds', 'measurementSetId'] });
  const unplaced = useServerFieldErrors(
    create.error,
    form.setError,
    sameNames(['parameterSetIds', 'parameterSetIds.0', 'parameterSetIds.1', 'measurementSetId', 'fitLij']),
  );
  if (sets.isPending || measurementSets.isPending) return <LoadingState />;
  if (sets.isError) return <ErrorState error={sets.error} onRetry={() => sets.refetch()} />;
  if (measurementSets.isError) return <ErrorState error={measurementSets.error} onRetry={() => measurementSets.refetch()} />;
  const ready = a && b && a !== b && measurementSetId;
  return (
    <form noValidate className="grid gap-3" aria-label="Fit a pair set" onSubmit={form.handleSubmit((body) => create.mutate(body))}>
      <div className="grid gap-3 sm:grid-cols-2">
        {[
          // A complaint about the pair as a whole goes beside the second set.
          { id: 'pair-set-a', label: 'First approved set', index: 0 as const, error: errors.parameterSetIds?.[0]?.message },
          {
            id: 'pair-set-b',
            label: 'Second approved set',
            index: 1 as const,
            error: errors.parameterSetIds?.[1]?.message ?? errors.parameterSetIds?.message,
          },
        ].map((f) => (
          <Field key={f.id} label={f.label} htmlFor={f.id} error={f.error}>
            <Select id={f.id} {...invalidProps(f.id, f.error)} {...form.register(`parameterSetIds.${f.index}`)}>
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
      <Field
        label="Cross second virial coefficients B12"
        htmlFor="pair-set-data"
        error={errors.measurementSetId?.message}
        hint={measurementSets.data.length === 0 ? 'Upload a B12 table (T, B12, u(B12)) with one of the two substances first.' : undefined}
      >
        <Select
          id="pair-set-data"
          {...invalidProps('pair-set-data', errors.measurementSetId?.message)}
          {...form.register('measurementSetId')}
        >
          <option value="">Choose…</option>
          {measurementSets.data.map((d) => (
            <option key={d.id} value={d.id}>
              {d.name} ({d.substanceName}, v{d.version}, {d.rowCount} rows)
            </option>
          ))}
        </Select>
      </Field>
      <label className="flex items-center gap-2 text-sm">
        <input type="checkbox" className="accent-copper" {...form.register('fitLij')} />
        Also fit l_ij in σ12 = (1 − l_ij)(σ1 + σ2)/2
      </label>
      {a && a === b && <p className="text-sm text-changes">Choose two different sets.</p>}
      {create.isError && (
        <div role="alert" className="rounded-md bg-changes-soft px-4 py-2 text-sm text-changes">
          {create.error.message}
          {unplaced.map((d, i) => (
            <div key={i}>{detailText(d)}</div>
          ))}
        </div>
      )}
      {create.isSuccess && (
        <p role="status" className="text-sm text-approved">
          Pair set #{create.data.id} fitted: k_ij = {create.data.kij.toFixed(4)} ± {create.data.kijStdErr?.toFixed(4) ?? '?'}; it waits for
          review.
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
