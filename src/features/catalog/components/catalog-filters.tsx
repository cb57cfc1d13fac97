import { PROPERTY_KIND_IDS, type PropertyKind } from '@shared/measurements/property-kinds';
import { CUTOFF_SCHEME_LABELS, CUTOFF_SCHEMES, type CutoffScheme } from '@shared/physics/cutoff-schemes';
import { KindBadge } from '@/components/ui/badge';
import { Field, Input, Select } from '@/components/ui/field';
import type { CatalogFilters } from '../api/catalog';

const numberOrUndefined = (s: string) => (s.trim() === '' || !Number.isFinite(Number(s)) ? undefined : Number(s));

/** Search by name, scheme, the kinds of data behind a set, and a temperature range the validity must overlap. */
export function CatalogFilterBar({ filters, onChange }: { filters: CatalogFilters; onChange: (f: CatalogFilters) => void }) {
  const kinds = filters.kind ?? [];
  const toggleKind = (k: PropertyKind) => onChange({ ...filters, kind: kinds.includes(k) ? kinds.filter((x) => x !== k) : [...kinds, k] });
  return (
    <form role="search" className="grid gap-4 md:grid-cols-[2fr_1.5fr_1fr_1fr]" onSubmit={(e) => e.preventDefault()}>
      <Field label="Substance" htmlFor="catalog-q">
        <Input
          id="catalog-q"
          type="search"
          placeholder="Name or formula"
          value={filters.q ?? ''}
          onChange={(e) => onChange({ ...filters, q: e.target.value })}
        />
      </Field>
      <Field label="Scheme" htmlFor="catalog-scheme">
        <Select
          id="catalog-scheme"
          value={filters.scheme ?? ''}
          onChange={(e) => onChange({ ...filters, scheme: (e.target.value || undefined) as CutoffScheme | undefined })}
        >
          <option value="">Any scheme</option>
          {CUTOFF_SCHEMES.map((s) => (
            <option key={s} value={s}>
              {CUTOFF_SCHEME_LABELS[s]}
            </option>
          ))}
        </Select>
      </Field>
      <Field label="From (K)" htmlFor="catalog-tmin" hint="Validity overlaps this range">
        <Input
          id="catalog-tmin"
          inputMode="decimal"
          value={filters.tMinK ?? ''}
          onChange={(e) => onChange({ ...filters, tMinK: numberOrUndefined(e.target.value) })}
        />
      </Field>
      <Field label="To (K)" htmlFor="catalog-tmax">
        <Input
          id="catalog-tmax"
          inputMode="decimal"
          value={filters.tMaxK ?? ''}
          onChange={(e) => onChange({ ...filters, tMaxK: numberOrUndefined(e.target.value) })}
        />
      </Field>
      <fieldset className="flex flex-wrap items-center gap-3 md:col-span-4">
        <legend className="mb-1 text-sm font-semibold">Fitted to (all of)</legend>
        {PROPERTY_KIND_IDS.map((k) => (
          <label key={k} className="flex cursor-pointer items-center gap-1.5 text-sm">
            <input
              type="checkbox"
              checked={kinds.includes(k)}
              onChange={() => toggleKind(k)}
              className="accent-copper"
              aria-label={`Fitted to ${k}`}
            />
            <KindBadge kind={k} />
          </label>
        ))}
      </fieldset>
    </form>
  );
}
