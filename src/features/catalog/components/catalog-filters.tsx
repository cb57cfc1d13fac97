import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect } from 'react';
import { useForm } from 'react-hook-form';
import { useNavigationType } from 'react-router-dom';
import { z } from 'zod';
import { PROPERTY_KIND_IDS, type PropertyKind } from '@shared/measurements/property-kinds';
import { CUTOFF_SCHEME_LABELS, CUTOFF_SCHEMES } from '@shared/physics/cutoff-schemes';
import { catalogQuery, type CatalogQuery } from '@shared/schemas/catalog';
import { KindBadge } from '@/components/ui/badge';
import { Field, Input, Select } from '@/components/ui/field';
import { decimalOf, invalidProps } from '@/lib/forms';
import { catalogSearch, type CatalogFilters } from '../api/catalog';

const formShape = z.object({
  q: z.string(),
  scheme: z.union([z.literal(''), z.enum(CUTOFF_SCHEMES)]),
  tMinK: z.string(),
  tMaxK: z.string(),
  kind: z.array(z.string()),
});
type FormValues = z.input<typeof formShape>;

/** The boxes as typed become the catalog's query, judged by catalogQuery: the same schema GET /api/catalog validates with. */
const formSchema = formShape
  .transform((v): z.input<typeof catalogQuery> => ({
    q: v.q.trim() || undefined,
    scheme: v.scheme || undefined,
    kind: v.kind.length ? v.kind.join(',') : undefined,
    tMinK: decimalOf(v.tMinK),
    tMaxK: decimalOf(v.tMaxK),
  }))
  .pipe(catalogQuery);

const fromFilters = (f: CatalogFilters): FormValues => ({
  q: f.q ?? '',
  scheme: f.scheme ?? '',
  tMinK: f.tMinK === undefined ? '' : String(f.tMinK),
  tMaxK: f.tMaxK === undefined ? '' : String(f.tMaxK),
  kind: f.kind ?? [],
});

const toFilters = (q: CatalogQuery): CatalogFilters => ({
  q: q.q,
  scheme: q.scheme,
  kind: q.kind as PropertyKind[] | undefined,
  tMinK: q.tMinK,
  tMaxK: q.tMaxK,
});

/**
 * Search by name, scheme, the kinds of data behind a set, and a temperature range the validity must overlap.
 * Every valid change goes to the address at once; a refused one is said beside its field and changes nothing.
 */
export function CatalogFilterBar({ filters, onChange }: { filters: CatalogFilters; onChange: (f: CatalogFilters) => void }) {
  const form = useForm<FormValues, unknown, CatalogQuery>({
    resolver: zodResolver(formSchema),
    mode: 'onChange',
    defaultValues: fromFilters(filters),
  });
  const errors = form.formState.errors;
  // The address changed by a link or back/forward (not by this form, which only replaces it): show what it asks for.
  const navigationType = useNavigationType();
  const search = catalogSearch(filters);
  useEffect(() => {
    if (navigationType === 'REPLACE') return;
    const shown = formSchema.safeParse(form.getValues());
    if (shown.success && catalogSearch(toFilters(shown.data)) === search) return;
    form.reset(fromFilters(filters));
    // Only a change of the address may reset the boxes, never a re-render while someone types.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [navigationType, search]);
  useEffect(() => {
    const send = form.handleSubmit((q) => onChange(toFilters(q)));
    const subscription = form.watch((_, info) => {
      if (info.name) void send();
    });
    return () => subscription.unsubscribe();
  }, [form, onChange]);
  return (
    <form role="search" noValidate className="grid gap-4 md:grid-cols-[2fr_1.5fr_1fr_1fr]" onSubmit={(e) => e.preventDefault()}>
      <Field label="Substance" htmlFor="catalog-q" error={errors.q?.message}>
        <Input
          id="catalog-q"
          type="search"
          placeholder="Name or formula"
          {...invalidProps('catalog-q', errors.q?.message)}
          {...form.register('q')}
        />
      </Field>
      <Field label="Scheme" htmlFor="catalog-scheme" error={errors.scheme?.message}>
        <Select id="catalog-scheme" {...form.register('scheme')}>
          <option value="">Any scheme</option>
          {CUTOFF_SCHEMES.map((s) => (
            <option key={s} value={s}>
              {CUTOFF_SCHEME_LABELS[s]}
            </option>
          ))}
        </Select>
      </Field>
      <Field label="From (K)" htmlFor="catalog-tmin" hint="Validity overlaps this range" error={errors.tMinK?.message}>
        <Input id="catalog-tmin" inputMode="decimal" {...invalidProps('catalog-tmin', errors.tMinK?.message)} {...form.register('tMinK')} />
      </Field>
      <Field label="To (K)" htmlFor="catalog-tmax" error={errors.tMaxK?.message}>
        <Input id="catalog-tmax" inputMode="decimal" {...invalidProps('catalog-tmax', errors.tMaxK?.message)} {...form.register('tMaxK')} />
      </Field>
      <fieldset className="flex flex-wrap items-center gap-3 md:col-span-4">
        <legend className="mb-1 text-sm font-semibold">Fitted to (all of)</legend>
        {PROPERTY_KIND_IDS.map((k) => (
          <label key={k} className="flex cursor-pointer items-center gap-1.5 text-sm">
            <input type="checkbox" value={k} className="accent-copper" aria-label={`Fitted to ${k}`} {...form.register('kind')} />
            <KindBadge kind={k} />
          </label>
        ))}
      </fieldset>
    </form>
  );
}
