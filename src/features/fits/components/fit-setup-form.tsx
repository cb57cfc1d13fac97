import { Fragment, useEffect, useMemo, useState, type ReactNode } from 'react';
import { get, useForm, useWatch, type FieldError, type FieldPath } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { FIELD_LABELS } from '@shared/schemas/field-labels';
import type { CreateFitBody } from '@shared/schemas/fits';
import { KindBadge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Field, Input, Select } from '@/components/ui/field';
import { Panel } from '@/components/ui/states';
import { ApiError, detailText } from '@/lib/api-client';
import {
  fitFormDefaults,
  fitFormSchema,
  formPathOf,
  isFittable,
  parseDecimal,
  type FitFormValues,
  type FitSetChoice,
  type PriorSetChoice,
} from './fit-form-schema';

export type { FitSetChoice, PriorSetChoice } from './fit-form-schema';

/** Shows a set's rows with a tick box each (the page supplies it: rows belong to the measurement-set feature). */
export type RowPickerRenderer = (set: FitSetChoice, excluded: number[], onChange: (rows: number[]) => void) => ReactNode;

const L = FIELD_LABELS;
const fmt = (x: number, digits = 4) => Number(x.toPrecision(digits)).toString();

/** One line naming an approved set as a prior: its values with their standard errors. */
function priorText(p: PriorSetChoice) {
  const pm = (v: number, se: number | null, unit: string) => `${fmt(v, 5)}${se ? ` ± ${fmt(se, 2)}` : ''} ${unit}`;
  return `v${p.version} · ${p.potentialLabel} · ε/k_B = ${pm(p.epsilonK, p.stdErr.epsilonK, 'K')}, σ = ${pm(p.sigmaAngstrom, p.stdErr.sigmaAngstrom, 'Å')}`;
}

/**
 * Measurement sets with weights, the potential model, options, bounds, starting values and the posterior, through
 * react-hook-form with the request schema (fit-form-schema.ts); the server validates again, and its refusals are
 * shown beside the fields they name.
 */
export function FitSetupForm({
  substanceId,
  measurementSets,
  priorSets = [],
  busy,
  error,
  onSubmit,
  renderRowPicker,
}: {
  substanceId: number;
  measurementSets: FitSetChoice[];
  priorSets?: PriorSetChoice[];
  busy: boolean;
  error: Error | null;
  onSubmit: (body: CreateFitBody) => void;
  renderRowPicker?: RowPickerRenderer;
}) {
  // The sets offered when the form opened: a refetch that adds a set must not shift the rows under the form.
  const [usable] = useState(() => measurementSets.filter((d) => !d.withdrawn));
  const schema = useMemo(() => fitFormSchema(substanceId, usable), [substanceId, usable]);
  const form = useForm<FitFormValues, unknown, CreateFitBody>({
    resolver: zodResolver(schema),
    defaultValues: fitFormDefaults(usable),
    reValidateMode: 'onChange',
  });
  const { register, setValue, setError, formState } = form;
  const errors = formState.errors;
  // Every value, re-rendering on change: the form shows and hides parts by them (it is small).
  const v = useWatch({ control: form.control }) as FitFormValues;
  // Rows of the last request, so the server's `measurementSets.k.*` details land on the right row.
  const [submittedRows, setSubmittedRows] = useState<number[]>([]);
  const chosenRows = () => v.sets.flatMap((s, i) => (s.use && isFittable(usable[i]) ? [i] : []));

  // A refusal's details go beside their fields; the rest stay in the message under the form.
  const details = error instanceof ApiError ? (error.details ?? []) : [];
  const placed = details.map((d) => (d.field ? formPathOf(d.field, submittedRows) : null));
  useEffect(() => {
    details.forEach((d, k) => placed[k] && setError(placed[k] as FieldPath<FitFormValues>, { type: 'server', message: d.message }));
    // Only a new refusal places messages; the arrays are derived from it.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [error, setError]);
  // Approved sets of the potential being fitted (and of the held λr); a chosen prior that no longer fits is let go.
  const heldExponent = v.options.model === 'mie' && v.options.exponent === 'held' ? parseDecimal(v.options.repulsiveExponent) : null;
  const priorOffered = priorSets.filter(
    (p) => p.potential === v.options.model && (heldExponent === null || p.repulsiveExponent === heldExponent),
  );
  const priorChosen = v.options.posterior.priorSetId;
  useEffect(() => {
    if (priorChosen !== '' && !priorOffered.some((p) => String(p.id) === priorChosen)) setValue('options.posterior.priorSetId', '');
  }, [priorChosen, priorOffered, setValue]);
  const unplaced = details.filter((d, k) => !placed[k] && !(error?.message ?? '').includes(d.message));

  const errorAt = (path: string) => (get(errors, path) as FieldError | undefined)?.message;
  const invalid = (path: string) => ({
    'aria-invalid': errorAt(path) ? true : undefined,
    'aria-describedby': errorAt(path) ? `${path.replace(/\./g, '-')}-error` : undefined,
  });
  const problem = (path: string) =>
    errorAt(path) ? (
      <p id={`${path.replace(/\./g, '-')}-error`} className="text-sm text-changes">
        {errorAt(path)}
      </p>
    ) : null;
  const fieldErrorCount = Object.keys(errors).filter((k) => k !== 'root').length;

  const o = v.options;
  const densityChosen = usable.some((d, i) => d.kind === 'density' && v.sets[i]?.use);
  const mie = o.model === 'mie';
  const setsMessage = errorAt('sets');

  return (
    <form
      noValidate
      className="grid gap-6"
      aria-label="New fit"
      onSubmit={form.handleSubmit((body) => {
        setSubmittedRows(chosenRows());
        onSubmit(body);
      })}
    >
      <Panel title="Measurement sets">
        {usable.length === 0 ? (
          <p className="text-ink-soft">This substance has no measurement sets in use. Upload one first.</p>
        ) : (
          <div className="overflow-x-auto">
            <table className="w-full text-left text-sm">
              <thead className="border-b border-rule text-xs tracking-wide text-ink-faint">
                <tr>
                  <th className="py-1.5">Use</th>
                  <th>Set</th>
                  <th>Kind</th>
                  <th className="text-right">Points</th>
                  <th className="w-28 pl-4">Weight</th>
                  {renderRowPicker && <th>Rows left out</th>}
                </tr>
              </thead>
              <tbody>
                {usable.map((d, i) => {
                  const c = v.sets[i];
                  const ok = isFittable(d);
                  const rowProblems = ['use', 'weight', 'excludeRows', 'excludeReason']
                    .map((f) => errorAt(`sets.${i}.${f}`))
                    .filter(Boolean);
                  return (
                    <Fragment key={d.id}>
                      <tr className="border-b border-rule/60">
                        <td className="py-1.5">
                          <input
                            type="checkbox"
                            className="accent-copper"
                            aria-label={`Use ${d.name}`}
                            disabled={!ok}
                            {...register(`sets.${i}.use`)}
                            checked={c.use && ok}
                          />
                        </td>
                        <td>
                          <span className="font-semibold">{d.name}</span> <span className="text-ink-faint">v{d.version}</span>
                          {d.kind === 'density' && (
                            <div className="text-xs text-ink-faint">
                              Adds a simulation stage: NPT runs at every state point, a few rounds of them.
                            </div>
                          )}
                          {rowProblems.length > 0 && (
                            <p id={`sets-${i}-error`} className="text-sm text-changes">
                              {rowProblems.join(' ')}
                            </p>
                          )}
                        </td>
                        <td>
                          <KindBadge kind={d.kind} />
                        </td>
                        <td className="num text-right">{d.rowCount}</td>
                        <td className="pl-4">
                          <Input
                            aria-label={`Weight of ${d.name}`}
                            inputMode="decimal"
                            disabled={!ok || !c.use}
                            aria-invalid={rowProblems.length ? true : undefined}
                            aria-describedby={rowProblems.length ? `sets-${i}-error` : undefined}
                            {...register(`sets.${i}.weight`)}
                          />
                        </td>
                        {renderRowPicker && (
                          <td className="whitespace-nowrap">
                            <Button
                              variant="quiet"
                              aria-expanded={c.picking}
                              disabled={!ok || !c.use}
                              onClick={() => setValue(`sets.${i}.picking`, !c.picking)}
                            >
                              {c.excludeRows.length ? `${c.excludeRows.length} left out` : 'None'} · {c.picking ? 'hide rows' : 'choose'}
                            </Button>
                          </td>
                        )}
                      </tr>
                      {renderRowPicker && c.picking && ok && c.use && (
                        <tr className="border-b border-rule/60">
                          <td />
                          <td colSpan={5} className="pb-3 pt-1">
                            <p className="mb-2 text-xs text-ink-faint">
                              Tick the rows to leave out of this fit. They stay in the set, are predicted at the fitted values and drawn
                              hollow, but never count in χ².
                            </p>
                            {renderRowPicker(d, c.excludeRows, (rows) =>
                              setValue(`sets.${i}.excludeRows`, rows, { shouldDirty: true, shouldValidate: formState.isSubmitted }),
                            )}
                            {c.excludeRows.length > 0 && (
                              <div className="mt-2">
                                <Field
                                  label={`Why rows ${c.excludeRows.join(', ')} are left out (optional)`}
                                  htmlFor={`exclude-reason-${d.id}`}
                                >
                                  <Input id={`exclude-reason-${d.id}`} maxLength={500} {...register(`sets.${i}.excludeReason`)} />
                                </Field>
                              </div>
                            )}
                          </td>
                        </tr>
                      )}
                    </Fragment>
                  );
                })}
              </tbody>
            </table>
          </div>
        )}
        {setsMessage && (
          <p id="sets-error" className="mt-2 text-sm text-changes">
            {setsMessage}
          </p>
        )}
        <p className="mt-3 text-xs text-ink-faint">
          A weight multiplies 1/u for every point of its set: residuals are weight·(model − measured)/u.
        </p>
      </Panel>
      <Panel title="Model">
        <div className="grid gap-4 md:grid-cols-2">
          <fieldset className="grid gap-2" aria-describedby={errorAt('options.model') ? 'options-model-error' : undefined}>
            <legend className="mb-1 text-sm font-semibold">{L['options.model']}</legend>
            <label className="flex items-center gap-2 text-sm">
              <input type="radio" className="accent-copper" value="lj-12-6" {...register('options.model')} /> LJ 12-6
            </label>
            <label className="flex items-center gap-2 text-sm">
              <input type="radio" className="accent-copper" value="mie" {...register('options.model')} /> Mie λr-6
            </label>
            <p className="text-xs text-ink-faint">Mie: u(r) = C ε[(σ/r)^λr − (σ/r)^6]; λr = 12 is LJ 12-6.</p>
            {problem('options.model')}
          </fieldset>
          {mie && (
            <fieldset className="grid gap-2">
              <legend className="mb-1 text-sm font-semibold">Repulsive exponent λr</legend>
              <div className="flex flex-wrap items-center gap-2 text-sm">
                <label className="flex items-center gap-2">
                  <input type="radio" className="accent-copper" value="held" {...register('options.exponent')} /> Hold at
                </label>
                <Input
                  aria-label={L['options.repulsiveExponent']}
                  className="!w-20"
                  inputMode="decimal"
                  disabled={o.exponent !== 'held'}
                  {...invalid('options.repulsiveExponent')}
                  {...register('options.repulsiveExponent')}
                />
                <span className="text-ink-faint">(8–36)</span>
              </div>
              {problem('options.repulsiveExponent')}
              <label className="flex items-center gap-2 text-sm">
                <input type="radio" className="accent-copper" value="fitted" {...register('options.exponent')} />{' '}
                {L['options.fitRepulsiveExponent']} (profiled over 8–36)
              </label>
              {problem('options.exponent')}
            </fieldset>
          )}
        </div>
      </Panel>
      <Panel title="Options">
        <div className="grid gap-4 md:grid-cols-2">
          <label className="flex items-start gap-2 text-sm md:col-span-2">
            <input
              type="checkbox"
              className="mt-1 accent-copper"
              aria-label={L['options.quantumCorrection']}
              {...register('options.quantumCorrection')}
            />
            <span>
              <span className="font-semibold">{L['options.quantumCorrection']}</span> — first-order Wigner–Kirkwood term, for light gases
              (He, H₂, Ne). Uses the substance's molar mass.
            </span>
          </label>
          <Field label={L['options.bounds.epsilonK']} htmlFor="eps-lo" error={errorAt('options.bounds.epsilonK')}>
            <div className="flex gap-2">
              <Input
                id="eps-lo"
                aria-label="ε/k_B lower bound (K)"
                inputMode="decimal"
                {...invalid('options.bounds.epsilonK')}
                {...register('options.bounds.epsilonK.0')}
              />
              <Input
                aria-label="ε/k_B upper bound (K)"
                inputMode="decimal"
                {...invalid('options.bounds.epsilonK')}
                {...register('options.bounds.epsilonK.1')}
              />
            </div>
          </Field>
          <Field label={L['options.bounds.sigmaAngstrom']} htmlFor="sigma-lo" error={errorAt('options.bounds.sigmaAngstrom')}>
            <div className="flex gap-2">
              <Input
                id="sigma-lo"
                aria-label="σ lower bound (Å)"
                inputMode="decimal"
                {...invalid('options.bounds.sigmaAngstrom')}
                {...register('options.bounds.sigmaAngstrom.0')}
              />
              <Input
                aria-label="σ upper bound (Å)"
                inputMode="decimal"
                {...invalid('options.bounds.sigmaAngstrom')}
                {...register('options.bounds.sigmaAngstrom.1')}
              />
            </div>
          </Field>
          <fieldset className="grid gap-2 md:col-span-2">
            <legend className="text-sm font-semibold">{L.fixed}</legend>
            <p className="text-xs text-ink-faint">
              A held parameter is exact in the result: no standard error, and one degree of freedom more. Only one of the two can be held.
            </p>
            <div className="flex flex-wrap items-start gap-x-6 gap-y-2">
              {(['epsilonK', 'sigmaAngstrom'] as const).map((p) => (
                <div key={p} className="grid gap-1">
                  <label className="flex items-center gap-2 text-sm">
                    <input
                      type="checkbox"
                      role="switch"
                      className="accent-copper"
                      aria-label={p === 'epsilonK' ? 'Hold ε/k_B' : 'Hold σ'}
                      checked={v.hold === p}
                      onChange={(e) => setValue('hold', e.target.checked ? p : 'none')}
                    />
                    <span className="w-24">{p === 'epsilonK' ? 'Hold ε/k_B at' : 'Hold σ at'}</span>
                    <Input
                      aria-label={L[`fixed.${p}`]}
                      className="!w-24"
                      inputMode="decimal"
                      disabled={v.hold !== p}
                      {...invalid(`fixed.${p}`)}
                      {...register(`fixed.${p}`)}
                    />{' '}
                    {p === 'epsilonK' ? 'K' : 'Å'}
                  </label>
                  {problem(`fixed.${p}`)}
                </div>
              ))}
            </div>
          </fieldset>
          <Field
            label={L['options.restarts']}
            htmlFor="restarts"
            hint="Guards against a poor local minimum; the lowest χ² wins."
            error={errorAt('options.restarts')}
          >
            <Input id="restarts" inputMode="numeric" {...invalid('options.restarts')} {...register('options.restarts')} />
          </Field>
          <div className="grid gap-2">
            <label className="flex items-center gap-2 text-sm font-semibold">
              <input type="checkbox" className="accent-copper" {...register('options.manualStart')} />
              Set starting values myself
            </label>
            {o.manualStart ? (
              <>
                <div className="flex gap-2">
                  <Input
                    aria-label={L['options.start.epsilonK']}
                    placeholder="ε/k_B (K)"
                    inputMode="decimal"
                    {...invalid('options.start.epsilonK')}
                    {...register('options.start.epsilonK')}
                  />
                  <Input
                    aria-label={L['options.start.sigmaAngstrom']}
                    placeholder="σ (Å)"
                    inputMode="decimal"
                    {...invalid('options.start.sigmaAngstrom')}
                    {...register('options.start.sigmaAngstrom')}
                  />
                </div>
                {problem('options.start.epsilonK')}
                {problem('options.start.sigmaAngstrom')}
              </>
            ) : (
              <p className="text-xs text-ink-faint">
                Automatic: from the Boyle temperature where B2 changes sign and the B2 magnitude, or a scan in ε for viscosity alone.
              </p>
            )}
          </div>
        </div>
      </Panel>
      <Panel title="Posterior (Bayesian)">
        <div className="grid gap-4">
          <label className="flex items-start gap-2 text-sm">
            <input
              type="checkbox"
              role="switch"
              className="mt-1 accent-copper"
              aria-label={L['options.posterior']}
              {...register('options.posteriorOn')}
            />
            <span>
              <span className="font-semibold">{L['options.posterior']}</span> of ε/k_B and σ after the fit: an affine-invariant ensemble
              sampler (Goodman & Weare 2010) started at the optimum, flat priors within the bounds. Adds seconds to a gas-phase fit; the
              result shows the draws, the 95 % credible region and bands on the data plots.
            </span>
          </label>
          {problem('options.posteriorOn')}
          {o.posteriorOn && (
            <div className="grid gap-4 md:grid-cols-3">
              <Field
                label={L['options.posterior.samples']}
                htmlFor="posterior-samples"
                hint="Kept after burn-in; 100–20 000."
                error={errorAt('options.posterior.samples')}
              >
                <Input
                  id="posterior-samples"
                  inputMode="numeric"
                  {...invalid('options.posterior.samples')}
                  {...register('options.posterior.samples')}
                />
              </Field>
              <Field
                label={L['options.posterior.seed']}
                htmlFor="posterior-seed"
                hint="The same seed gives the same draws."
                error={errorAt('options.posterior.seed')}
              >
                <Input
                  id="posterior-seed"
                  inputMode="numeric"
                  {...invalid('options.posterior.seed')}
                  {...register('options.posterior.seed')}
                />
              </Field>
              <Field
                label={L['options.posterior.prior.parameterSetId']}
                htmlFor="posterior-prior"
                hint={
                  priorOffered.length
                    ? 'Gaussian in ε/k_B and σ with the set’s values and covariance, times the flat prior.'
                    : `No approved ${o.model === 'mie' ? 'Mie' : 'LJ 12-6'} set of this substance yet.`
                }
                error={errorAt('options.posterior.priorSetId')}
              >
                <Select
                  id="posterior-prior"
                  disabled={!priorOffered.length}
                  {...invalid('options.posterior.priorSetId')}
                  {...register('options.posterior.priorSetId')}
                >
                  <option value="">None: flat within the bounds</option>
                  {priorOffered.map((p) => (
                    <option key={p.id} value={String(p.id)}>
                      {priorText(p)}
                    </option>
                  ))}
                </Select>
              </Field>
            </div>
          )}
        </div>
      </Panel>
      {densityChosen && (
        <Panel title="Simulation stage (densities)">
          <p className="mb-3 text-sm text-ink-soft">
            The equation of state (Johnson, Zollweg & Gubbins 1993) fits first; its parameters start rounds of NPT simulations at the
            measured state points. Runs are cached by reduced state and settings and shared between fits.
          </p>
          <div className="grid gap-4 md:grid-cols-4">
            <Field label={L['options.density.atoms']} htmlFor="md-atoms" error={errorAt('options.density.atoms')}>
              <Input id="md-atoms" inputMode="numeric" {...invalid('options.density.atoms')} {...register('options.density.atoms')} />
            </Field>
            <Field label={L['options.density.steps']} htmlFor="md-steps" error={errorAt('options.density.steps')}>
              <Input id="md-steps" inputMode="numeric" {...invalid('options.density.steps')} {...register('options.density.steps')} />
            </Field>
            <Field label={L['options.density.cutoff']} htmlFor="md-cutoff" error={errorAt('options.density.cutoff')}>
              <Input id="md-cutoff" inputMode="decimal" {...invalid('options.density.cutoff')} {...register('options.density.cutoff')} />
            </Field>
            <Field label={L['options.density.scheme']} htmlFor="md-scheme" error={errorAt('options.density.scheme')}>
              <Select id="md-scheme" {...register('options.density.scheme')}>
                <option value="truncated-tail">truncated + tail corrections</option>
                <option value="truncated-shifted">truncated and shifted</option>
              </Select>
            </Field>
          </div>
        </Panel>
      )}
      {(error || fieldErrorCount > 0 || errors.root?.request) && (
        <div role="alert" className="rounded-md bg-changes-soft px-3 py-2 text-sm text-changes">
          <p className="font-semibold">
            {error?.message ?? (fieldErrorCount > 0 ? 'Check the marked fields: the fit was not started.' : errors.root?.request?.message)}
          </p>
          {errors.root?.request && error && <p>{errors.root.request.message}</p>}
          {unplaced.length > 0 && (
            <ul className="mt-1 list-disc pl-5">
              {unplaced.map((d, i) => (
                <li key={i}>{detailText(d)}</li>
              ))}
            </ul>
          )}
        </div>
      )}
      <div>
        <Button type="submit" variant="primary" busy={busy}>
          Run fit
        </Button>
      </div>
    </form>
  );
}
