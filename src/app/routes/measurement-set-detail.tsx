import { zodResolver } from '@hookform/resolvers/zod';
import { useForm, useWatch } from 'react-hook-form';
import type { z } from 'zod';
import { formatDate, formatDateTime } from '@shared/format/dates';
import { Link, useParams, useSearchParams, useLocation } from 'react-router-dom';
import { QUANTITIES, PROPERTY_KINDS, type QuantityKey } from '@shared/measurements/property-kinds';
import { formatMeasured } from '@shared/format/numbers';
import { FIELD_LABELS } from '@shared/schemas/field-labels';
import { withdrawMeasurementSetBody } from '@shared/schemas/measurements';
import { Badge, KindBadge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { DataTable, type TableColumns } from '@/components/ui/data-table';
import { Field, Input } from '@/components/ui/field';
import { ErrorState, LoadingState, PageHeader, Panel } from '@/components/ui/states';
import { useCan } from '@/lib/authorization';
import { invalidProps, sameNames, useServerFieldErrors } from '@/lib/forms';
import { type MeasurementSetRow, useMeasurementSet, useWithdrawMeasurementSet } from '@/features/measurement-sets/api/measurement-sets';
import { MeasurementSetChart } from '@/features/measurement-sets/components/measurement-set-chart';
import { quantityHeading } from '@/lib/quantity-labels';
import { SimulateRowsPanel } from '@/features/simulations/components/simulate-rows-panel';

function rowColumns(kind: keyof typeof PROPERTY_KINDS): TableColumns<MeasurementSetRow> {
  const def = PROPERTY_KINDS[kind];
  // "Row" counts the data rows from 1 (the number a fit's "leave rows out" uses); "File row" is the line in the file.
  const cols: TableColumns<MeasurementSetRow> = [
    { id: 'index', header: 'Row', accessorFn: (_r, i) => i + 1, meta: { numeric: true } },
    { accessorKey: 'row', header: 'File row', meta: { numeric: true } },
  ];
  for (const c of def.columns) {
    const q = QUANTITIES[c.quantity as QuantityKey];
    cols.push({
      accessorKey: q.field,
      header: quantityHeading(c.quantity),
      meta: { numeric: true },
      cell: (ctx) => formatMeasured(Number(ctx.getValue())),
    });
  }
  cols.push({
    accessorKey: 'uncertaintySource',
    header: 'u from',
    cell: (ctx) => (ctx.getValue() === 'measured' ? 'file' : <span className="text-review">default</span>),
  });
  return cols;
}

export function MeasurementSetDetailRoute() {
  const id = Number(useParams().measurementSetId);
  const [params, setParams] = useSearchParams();
  // Warnings of the upload that just stored this set (e.g. a missing citation), handed over by the upload page.
  const uploadWarnings = ((useLocation().state as { uploadWarnings?: string[] } | null)?.uploadWarnings ?? []).filter(Boolean);
  const version = params.get('version') ? Number(params.get('version')) : undefined;
  const measurementSet = useMeasurementSet(id, version);
  const canUpload = useCan('measurement-set:upload');
  const canSimulate = useCan('simulation:run');
  const withdraw = useWithdrawMeasurementSet(id);
  const withdrawForm = useForm<z.input<typeof withdrawMeasurementSetBody>, unknown, z.output<typeof withdrawMeasurementSetBody>>({
    resolver: zodResolver(withdrawMeasurementSetBody),
    defaultValues: { reason: '' },
  });
  const reason = useWatch({ control: withdrawForm.control, name: 'reason' });
  const reasonError = withdrawForm.formState.errors.reason?.message;
  useServerFieldErrors(withdraw.error, withdrawForm.setError, sameNames(['reason']));
  if (measurementSet.isPending) return <LoadingState />;
  if (measurementSet.isError) return <ErrorState error={measurementSet.error} onRetry={() => measurementSet.refetch()} />;
  const d = measurementSet.data;
  const def = PROPERTY_KINDS[d.kind];
  const plotRows = d.rows.map((r) => ({
    temperatureK: r.temperatureK,
    pressureMPa: r.pressureMPa,
    value: Number(r[def.valueField]),
    uncertainty: Number(r[def.uncertaintyField]),
  }));
  return (
    <>
      <PageHeader
        eyebrow={
          <Link to={`/substances/${d.substanceId}`} className="hover:underline">
            {d.substanceName}
          </Link>
        }
        title={d.name}
        subtitle={
          <span className="flex flex-wrap items-center gap-2">
            <KindBadge kind={d.kind} /> {d.kindLabel} · version {d.version} of {d.latestVersion} · {d.rowCount} points
            {d.withdrawn && <Badge tone="slate">Withdrawn</Badge>}
          </span>
        }
        action={
          canUpload &&
          !d.withdrawn && (
            <Link
              to={`/measurement-sets/${id}/new-version`}
              className="rounded-md bg-copper px-3.5 py-1.5 text-sm font-semibold text-white shadow-sm hover:bg-copper-dark"
            >
              Upload corrected version
            </Link>
          )
        }
      />
      {uploadWarnings.length > 0 && (
        <div role="status" className="mb-4 rounded-md border border-review/40 bg-review-soft/70 px-4 py-2 text-sm">
          <p className="font-semibold text-review">Stored, with a warning</p>
          <ul className="list-disc pl-5">
            {uploadWarnings.map((w) => (
              <li key={w}>{w}</li>
            ))}
          </ul>
        </div>
      )}
      {!d.source && !d.withdrawn && uploadWarnings.length === 0 && (
        <p role="status" className="mb-4 rounded-md bg-review-soft px-3 py-2 text-sm text-review">
          No source citation: a parameter set that uses this measurement set cannot be submitted for review until a version with a citation
          is uploaded.
        </p>
      )}
      {d.version !== d.latestVersion && (
        <p role="status" className="mb-4 rounded-md bg-review-soft px-3 py-2 text-sm text-review">
          You are looking at version {d.version}; the newest is version {d.latestVersion}.
        </p>
      )}
      {d.withdrawn && (
        <p role="status" className="mb-4 rounded-md bg-slate-soft px-3 py-2 text-sm text-slate">
          Withdrawn on {formatDate(d.withdrawn.at)}: {d.withdrawn.reason}. It is kept for history and offered to no new fit.
        </p>
      )}
      <div className="grid gap-6 lg:grid-cols-[3fr_2fr]">
        <Panel title="Measured values">
          <MeasurementSetChart kind={d.kind} rows={plotRows} />
        </Panel>
        <Panel title="Provenance">
          <dl className="grid grid-cols-[max-content_1fr] gap-x-4 gap-y-1.5 text-sm">
            <dt className="text-ink-faint">Source</dt>
            <dd>{d.source ?? '—'}</dd>
            <dt className="text-ink-faint">DOI</dt>
            <dd>
              {d.doi ? (
                <a className="text-copper underline" href={`https://doi.org/${d.doi}`} target="_blank" rel="noreferrer">
                  {d.doi}
                </a>
              ) : (
                '—'
              )}
            </dd>
            <dt className="text-ink-faint">Method</dt>
            <dd>{d.method ?? '—'}</dd>
            <dt className="text-ink-faint">Notes</dt>
            <dd className="whitespace-pre-line">{d.notes ?? '—'}</dd>
            <dt className="text-ink-faint">File</dt>
            <dd>
              <a className="text-copper underline" href={`/api/measurement-sets/${id}/versions/${d.version}/original`} download>
                {d.originalFilename}
              </a>
            </dd>
            <dt className="text-ink-faint">SHA-256</dt>
            <dd className="break-all font-mono text-xs">{d.sha256}</dd>
            <dt className="text-ink-faint">Read as</dt>
            <dd>
              delimiter “{d.delimiter === '\t' ? 'tab' : d.delimiter}”, decimal “{d.decimal}”;{' '}
              {d.columns
                .filter((c) => c.quantity)
                .map((c) => `${c.header} → ${c.canonicalUnit}`)
                .join('; ')}
            </dd>
            <dt className="text-ink-faint">Default u</dt>
            <dd className="num">{(d.defaultRelativeUncertainty * 100).toFixed(2)} % relative, for rows without an uncertainty</dd>
            <dt className="text-ink-faint">Uploaded</dt>
            <dd>
              {formatDateTime(d.uploadedAt)} by {d.uploadedByName}
            </dd>
          </dl>
        </Panel>
        <Panel title="Rows (canonical units)" className="lg:col-span-1">
          <DataTable data={d.rows} columns={rowColumns(d.kind)} caption="Measured rows" rowKey={(r) => r.row} />
        </Panel>
        <div className="grid content-start gap-6">
          <Panel title="Version history">
            <ol className="space-y-2 text-sm">
              {d.versions.map((v) => (
                <li
                  key={v.version}
                  className={`rounded-md border px-3 py-2 ${v.version === d.version ? 'border-copper bg-copper-soft/40' : 'border-rule'}`}
                >
                  <button
                    type="button"
                    className="font-semibold hover:underline"
                    onClick={() => setParams(v.version === d.latestVersion ? {} : { version: String(v.version) })}
                  >
                    v{v.version}
                  </button>{' '}
                  · {v.rowCount} points · {formatDate(v.uploadedAt)} by {v.uploadedByName}
                  <div className="font-mono text-xs text-ink-faint">sha256 {v.sha256.slice(0, 16)}…</div>
                </li>
              ))}
            </ol>
          </Panel>
          {canSimulate && d.kind === 'density' && (
            <Panel title="Simulate these state points">
              <SimulateRowsPanel measurementSetId={d.id} version={d.version} />
            </Panel>
          )}
          {canUpload && !d.withdrawn && (
            <Panel title="Withdraw">
              <p className="mb-3 text-sm text-ink-soft">
                A withdrawn set stays readable with all its versions but is offered to no new fit.
              </p>
              <form noValidate className="grid gap-3" onSubmit={withdrawForm.handleSubmit((body) => withdraw.mutate(body.reason))}>
                <Field label={FIELD_LABELS.reason} htmlFor="withdraw-reason" error={reasonError}>
                  <Input id="withdraw-reason" {...invalidProps('withdraw-reason', reasonError)} {...withdrawForm.register('reason')} />
                </Field>
                {withdraw.isError && (
                  <p role="alert" className="text-sm text-changes">
                    {withdraw.error.message}
                  </p>
                )}
                <div>
                  <Button type="submit" variant="danger" busy={withdraw.isPending} disabled={reason.trim().length < 3}>
                    Withdraw set
                  </Button>
                </div>
              </form>
            </Panel>
          )}
        </div>
      </div>
    </>
  );
}
