import { useEffect, useMemo, useState } from 'react';
import { get, useForm, useWatch, type FieldError, type FieldPath } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { decodeCsvBytes } from '@shared/measurements/decode-bytes';
import type { ColumnMapping } from '@shared/measurements/headers';
import { parseMeasurementCsv, type ParseResult } from '@shared/measurements/parse-measurement-csv';
import { PROPERTY_KIND_IDS, PROPERTY_KINDS, QUANTITIES, type PropertyKind, type QuantityKey } from '@shared/measurements/property-kinds';
import { formatMeasured } from '@shared/format/numbers';
import { KindBadge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Field, Input, Select, TextArea } from '@/components/ui/field';
import { Panel } from '@/components/ui/states';
import { ApiError } from '@/lib/api-client';
import { useUploadMeasurementSet } from '../api/measurement-sets';
import { quantityHeading } from '@/lib/quantity-labels';
import { MeasurementSetChart } from './measurement-set-chart';
import { relativeFromPercent, uploadFormPathOf, uploadFormSchema, type UploadFields, type UploadFormValues } from './upload-form-schema';

export interface UploadWizardProps {
  substanceId: number;
  molarMassGPerMol: number;
  /** Set for a corrected version of an existing measurement set: the kind is then fixed. */
  existing?: {
    measurementSetId: number;
    kind: PropertyKind;
    name: string;
    source: string | null;
    doi: string | null;
    method: string | null;
  };
  onStored: (result: { id: number; version: number }) => void;
}

/**
 * Choose file → preview and column mapping → check → store. The preview runs the same parser the server
 * runs, so what is shown is what will be stored; the server checks everything again.
 */
export function UploadWizard({ substanceId, molarMassGPerMol, existing, onStored }: UploadWizardProps) {
  const isVersion = !!existing;
  const schema = useMemo(() => uploadFormSchema(substanceId, isVersion), [substanceId, isVersion]);
  const form = useForm<UploadFormValues, unknown, UploadFormValues & { fields: UploadFields }>({
    resolver: zodResolver(schema),
    reValidateMode: 'onChange',
    defaultValues: {
      file: null,
      kind: existing?.kind ?? '',
      detectedKind: '',
      delimiter: '',
      decimal: '',
      relPercent: '1',
      mapping: null,
      name: existing?.name ?? '',
      source: existing?.source ?? '',
      doi: existing?.doi ?? '',
      method: existing?.method ?? '',
      notes: '',
    },
  });
  const { register, setValue, setError, formState } = form;
  const values = useWatch({ control: form.control }) as UploadFormValues;
  const { file, kind, delimiter, decimal, relPercent, name } = values;
  const mapping = values.mapping ?? undefined;
  const setMapping = (m: ColumnMapping | undefined) => setValue('mapping', m ?? null);
  // The decoded file: derived from the chosen file (asynchronously), not typed.
  const [text, setText] = useState<string | null>(null);
  const upload = useUploadMeasurementSet();

  useEffect(() => {
    if (!file) return;
    let cancelled = false;
    void file.arrayBuffer().then((buf) => {
      if (!cancelled) setText(decodeCsvBytes(new Uint8Array(buf)));
    });
    if (!isVersion && !form.getValues('name')) setValue('name', file.name.replace(/\.[^.]+$/, ''));
    setValue('mapping', null);
    return () => {
      cancelled = true;
    };
  }, [file, isVersion, form, setValue]);

  const rel = relativeFromPercent(relPercent);
  const result: ParseResult | null = useMemo(() => {
    if (text === null) return null;
    return parseMeasurementCsv(text, {
      kind: kind || undefined,
      delimiter: delimiter || undefined,
      decimal: decimal || undefined,
      mapping,
      defaultRelativeUncertainty: Number.isFinite(rel) && rel > 0 ? rel : undefined,
      molarMassGPerMol,
    });
  }, [text, kind, delimiter, decimal, mapping, rel, molarMassGPerMol]);

  const effectiveKind = (kind || result?.kind) as PropertyKind | undefined;
  // The kind read from the headers takes part in the judgement of a new upload.
  const detected = result?.kind ?? '';
  useEffect(() => setValue('detectedKind', detected), [detected, setValue]);
  // A refusal that names a field goes beside it; the rest (rows, columns) stay listed under the preview.
  const details = upload.error instanceof ApiError ? (upload.error.details ?? []) : [];
  const serverProblems = details.filter((d) => !d.field || d.row !== undefined);
  useEffect(() => {
    for (const d of details)
      if (d.field && d.row === undefined)
        setError(uploadFormPathOf(d.field) as FieldPath<UploadFormValues>, { type: 'server', message: d.message });
    // Only a new refusal places messages.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [upload.error, setError]);
  const errorAt = (path: string) => (get(formState.errors, path) as FieldError | undefined)?.message;
  const invalid = (path: string) => (errorAt(path) ? { 'aria-invalid': true, 'aria-describedby': `upload-${path}-error` } : {});

  const columnMapping = (index: number) =>
    mapping?.[index] ??
    (() => {
      const c = result?.columns.find((col) => col.index === index);
      return c?.quantity ? { quantity: c.quantity as QuantityKey, unit: c.unitText } : { quantity: 'ignore' as const, unit: undefined };
    })();

  const setColumn = (index: number, patch: Partial<{ quantity: QuantityKey | 'ignore'; unit: string }>) => {
    const base: ColumnMapping = {};
    for (const c of result?.columns ?? []) base[c.index] = columnMapping(c.index) as ColumnMapping[number];
    base[index] = { ...base[index], ...patch } as ColumnMapping[number];
    if (patch.quantity && patch.quantity !== 'ignore' && !base[index].unit) base[index].unit = QUANTITIES[patch.quantity].canonicalUnit;
    setMapping(base);
  };

  const store = form.handleSubmit(({ fields }) => {
    if (!file || !result?.ok || !effectiveKind) return;
    upload.mutate(
      {
        measurementSetId: existing?.measurementSetId,
        file,
        substanceId: existing ? undefined : substanceId,
        kind: existing ? undefined : effectiveKind,
        name: existing ? undefined : fields.name,
        source: fields.source,
        doi: fields.doi,
        method: fields.method,
        notes: fields.notes,
        defaultRelativeUncertainty: fields.defaultRelativeUncertainty,
        delimiter: result.delimiter,
        decimal: result.decimal,
        mapping,
      },
      { onSuccess: onStored },
    );
  });

  const allowedQuantities = effectiveKind
    ? PROPERTY_KINDS[effectiveKind].columns.map((c) => c.quantity)
    : (Object.keys(QUANTITIES) as QuantityKey[]);

  const problemAt = (path: string) =>
    errorAt(path) ? (
      <p id={`upload-${path}-error`} className="text-sm text-changes">
        {errorAt(path)}
      </p>
    ) : null;

  return (
    <form
      noValidate
      aria-label={existing ? 'Upload a corrected version' : 'Upload measurements'}
      className="grid gap-6"
      onSubmit={(e) => void store(e)}
    >
      <Panel title="1 · Choose a file">
        <div className="grid gap-4 md:grid-cols-2">
          <Field
            label="CSV file"
            htmlFor="upload-file"
            hint="Headers name the quantity and its unit, e.g. T (K), p [bar], B2 (cm3/mol), rho (kg/m3), eta (uPa s)."
          >
            <Input
              id="upload-file"
              type="file"
              accept=".csv,.txt,.tsv,text/csv"
              onChange={(e) => setValue('file', e.target.files?.[0] ?? null)}
            />
          </Field>
          <Field label="Kind" htmlFor="upload-kind" error={errorAt('kind')}>
            <Select
              id="upload-kind"
              disabled={!!existing}
              {...invalid('kind')}
              {...register('kind', { onChange: () => setMapping(undefined) })}
            >
              <option value="">Detect from the headers</option>
              {PROPERTY_KIND_IDS.map((k) => (
                <option key={k} value={k}>
                  {PROPERTY_KINDS[k].label}
                </option>
              ))}
            </Select>
          </Field>
          <Field label="Delimiter" htmlFor="upload-delimiter">
            <Select id="upload-delimiter" {...register('delimiter')}>
              <option value="">Detect{result ? ` (found “${result.delimiter === '\t' ? 'tab' : result.delimiter}”)` : ''}</option>
              <option value=",">Comma</option>
              <option value=";">Semicolon</option>
              <option value={'\t'}>Tab</option>
            </Select>
          </Field>
          <Field label="Decimal separator" htmlFor="upload-decimal">
            <Select id="upload-decimal" {...register('decimal')}>
              <option value="">Detect{result ? ` (found “${result.decimal}”)` : ''}</option>
              <option value=".">Point (1.23)</option>
              <option value=",">Comma (1,23)</option>
            </Select>
          </Field>
          <Field
            label="Default relative uncertainty (%)"
            htmlFor="upload-rel"
            hint="Used for rows without an uncertainty column or value; recorded on the version."
            error={errorAt('relPercent')}
          >
            <Input id="upload-rel" inputMode="decimal" {...invalid('relPercent')} {...register('relPercent')} />
          </Field>
          {!existing && (
            <Field label="Name of the measurement set" htmlFor="upload-name" error={errorAt('name')}>
              <Input id="upload-name" {...invalid('name')} {...register('name')} />
            </Field>
          )}
          <Field label="Source (citation)" htmlFor="upload-source" error={errorAt('source')}>
            <Input id="upload-source" {...invalid('source')} {...register('source')} />
          </Field>
          <Field label="DOI (optional)" htmlFor="upload-doi" hint="e.g. 10.1000/xyz123" error={errorAt('doi')}>
            <Input id="upload-doi" {...invalid('doi')} {...register('doi')} />
          </Field>
          <Field label="Measurement method (optional)" htmlFor="upload-method" error={errorAt('method')}>
            <Input id="upload-method" {...invalid('method')} {...register('method')} />
          </Field>
          <Field label="Notes (optional)" htmlFor="upload-notes" error={errorAt('notes')}>
            <TextArea id="upload-notes" rows={2} {...invalid('notes')} {...register('notes')} />
          </Field>
        </div>
      </Panel>

      {result && (
        <Panel title="2 · Columns" actions={effectiveKind && <KindBadge kind={effectiveKind} />}>
          <p className="mb-3 text-sm text-ink-soft">
            What each column holds and its unit. Change a row to map a column the headers did not name.
          </p>
          <table className="w-full text-left text-sm">
            <thead className="border-b border-rule text-xs tracking-wide text-ink-faint">
              <tr>
                <th className="py-1.5 pr-3">Column</th>
                <th className="px-2">Holds</th>
                <th className="px-2">Unit as written</th>
                <th className="px-2">Stored in</th>
              </tr>
            </thead>
            <tbody>
              {result.columns.map((c) => {
                const m = columnMapping(c.index);
                return (
                  <tr key={c.index} className="border-b border-rule/60">
                    <td className="py-1.5 pr-3 font-mono text-xs">{c.header || `(column ${c.index + 1})`}</td>
                    <td className="px-2">
                      <Select
                        aria-label={`Quantity of column ${c.header || c.index + 1}`}
                        value={m.quantity}
                        onChange={(e) => setColumn(c.index, { quantity: e.target.value as QuantityKey | 'ignore' })}
                      >
                        <option value="ignore">— ignore —</option>
                        {allowedQuantities.map((q) => (
                          <option key={q} value={q}>
                            {QUANTITIES[q].label}
                          </option>
                        ))}
                      </Select>
                    </td>
                    <td className="px-2">
                      <Input
                        aria-label={`Unit of column ${c.header || c.index + 1}`}
                        value={m.unit ?? ''}
                        disabled={m.quantity === 'ignore'}
                        onChange={(e) => setColumn(c.index, { unit: e.target.value })}
                      />
                    </td>
                    <td className="px-2 text-ink-soft">
                      {m.quantity !== 'ignore' ? QUANTITIES[m.quantity as QuantityKey].canonicalUnitLabel : ''}
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </Panel>
      )}

      {result && !result.ok && (
        <Panel title="3 · Problems to fix">
          <ul role="alert" className="space-y-1 text-sm">
            {result.problems.map((p, i) => (
              <li key={i} className="rounded bg-changes-soft/70 px-3 py-1.5 text-changes">
                {p.message}
              </li>
            ))}
          </ul>
          <p className="mt-3 text-sm text-ink-soft">Nothing is stored while any problem remains. Fix the file, or map the columns above.</p>
        </Panel>
      )}

      {result?.ok && effectiveKind && (
        <Panel title={`3 · Preview: ${result.rows.length} rows in canonical units`}>
          <div className="grid gap-6 lg:grid-cols-2">
            <MeasurementSetChart
              kind={effectiveKind}
              rows={result.rows.map((r) => {
                const rec = r as unknown as Record<string, number>;
                const d = PROPERTY_KINDS[effectiveKind];
                return {
                  temperatureK: r.temperatureK,
                  pressureMPa: rec.pressureMPa,
                  value: rec[d.valueField],
                  uncertainty: rec[d.uncertaintyField],
                };
              })}
              height={280}
            />
            <div className="max-h-80 overflow-auto">
              <table className="w-full text-sm" aria-label="Preview rows">
                <thead className="sticky top-0 bg-paper-raised text-xs tracking-wide text-ink-faint">
                  <tr>
                    <th className="px-2 py-1 text-right">Row</th>
                    {PROPERTY_KINDS[effectiveKind].columns.map((c) => (
                      <th key={c.quantity} className="px-2 py-1 text-right">
                        {quantityHeading(c.quantity)}
                      </th>
                    ))}
                  </tr>
                </thead>
                <tbody>
                  {result.rows.map((r) => (
                    <tr key={r.row} className="border-b border-rule/50">
                      <td className="num px-2 py-0.5 text-right text-ink-faint">{r.row}</td>
                      {PROPERTY_KINDS[effectiveKind].columns.map((c) => (
                        <td key={c.quantity} className="num px-2 py-0.5 text-right">
                          {formatMeasured((r as unknown as Record<string, number>)[QUANTITIES[c.quantity].field])}
                        </td>
                      ))}
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          </div>
          {result.warnings.length > 0 && (
            <ul role="status" aria-label="Unusual values" className="mt-4 space-y-1 text-sm">
              {result.warnings.map((w, i) => (
                <li key={i} className="rounded bg-review-soft/70 px-3 py-1.5 text-review">
                  {w.message}
                </li>
              ))}
            </ul>
          )}
          {problemAt('root.request')}
          {upload.isError && (
            <div role="alert" className="mt-4 rounded-md bg-changes-soft px-3 py-2 text-sm text-changes">
              <p className="font-semibold">{upload.error.message}</p>
              {serverProblems.length > 0 && (
                <ul className="mt-1 list-disc pl-5">
                  {serverProblems.slice(0, 20).map((p, i) => (
                    <li key={i}>{p.message}</li>
                  ))}
                </ul>
              )}
            </div>
          )}
          <div className="mt-4 flex items-center gap-3">
            <Button type="submit" variant="primary" busy={upload.isPending} disabled={!existing && !name.trim()}>
              {existing ? 'Store as a new version' : 'Store measurement set'}
            </Button>
            <span className="text-sm text-ink-soft">The original file is kept unchanged with its SHA-256.</span>
          </div>
        </Panel>
      )}
    </form>
  );
}
