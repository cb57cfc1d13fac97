import { Link, useSearchParams } from 'react-router-dom';
import { COMBINING_RULE_INFO, COMBINING_RULES, type CombiningRule } from '@shared/mixing/combining-rules';
import { EmptyState, ErrorState, LoadingState, PageHeader, Panel } from '@/components/ui/states';
import { Field, Select } from '@/components/ui/field';
import { UnitSwitch } from '@/components/ui/unit-switch';
import { mixtureHref, useCatalog, useMixture, usePreferences, useUpdatePreferences } from '@/features/catalog/api/catalog';
import { ExportLinks } from '@/features/catalog/components/export-links';
import { MixtureTable } from '@/features/catalog/components/mixture-table';
import { temperatureRangeText } from '@/features/catalog/components/unit-text';
import { ParameterSetCaution } from '@/features/parameter-sets/components/caution';

/** Cross parameters of several approved sets by a combining rule; picks live in the address. */
export function MixturesRoute() {
  const [params, setParams] = useSearchParams();
  const picked = (params.get('sets') ?? '')
    .split(',')
    .map(Number)
    .filter((n) => Number.isInteger(n) && n > 0);
  const ruleParam = params.get('rule');
  const rule: CombiningRule =
    ruleParam && (COMBINING_RULES as readonly string[]).includes(ruleParam) ? (ruleParam as CombiningRule) : 'lorentz-berthelot';
  const catalog = useCatalog({});
  const mixture = useMixture(picked, rule);
  const prefs = usePreferences();
  const update = useUpdatePreferences();
  const energy = prefs.data?.energyUnit ?? 'K';
  const length = prefs.data?.lengthUnit ?? 'Å';
  const setPicks = (sets: number[], r: CombiningRule) =>
    setParams(new URLSearchParams({ ...(sets.length ? { sets: sets.join(',') } : {}), rule: r }), { replace: true });
  const toggle = (id: number) => setPicks(picked.includes(id) ? picked.filter((x) => x !== id) : [...picked, id], rule);
  const csvUnits = [energy, length === 'Å' ? 'A' : length].join(',');
  return (
    <>
      <PageHeader
        eyebrow="Catalog"
        title="Mixtures"
        subtitle={
          <>
            Cross parameters from approved{' '}
            <Link className="text-copper underline" to="/pair-sets">
              pair sets
            </Link>{' '}
            (k_ij fitted to B12 data) where one exists, otherwise from a combining rule: estimates, not fitted to mixture data.
          </>
        }
      />
      <div className="grid gap-6">
        <ParameterSetCaution />
        <div className="grid gap-6 lg:grid-cols-[1fr_2fr]">
          <Panel title="Components">
            {catalog.isPending ? (
              <LoadingState />
            ) : catalog.isError ? (
              <ErrorState error={catalog.error} onRetry={() => catalog.refetch()} />
            ) : catalog.data.length < 2 ? (
              <EmptyState title="Fewer than two approved sets">A mixture needs at least two approved parameter sets.</EmptyState>
            ) : (
              <fieldset className="grid gap-1.5">
                <legend className="sr-only">Approved sets in the mixture</legend>
                {catalog.data.map((s) => (
                  <label key={s.id} className="flex cursor-pointer items-baseline gap-2 rounded px-1 py-0.5 text-sm hover:bg-paper-deep">
                    <input type="checkbox" className="accent-copper" checked={picked.includes(s.id)} onChange={() => toggle(s.id)} />
                    <span className="font-semibold">
                      {s.substanceName} v{s.version}
                    </span>
                    <span className="text-xs text-ink-faint">
                      {s.schemeLabel}
                      {s.cutoffSigma !== null ? `, r_c = ${s.cutoffSigma} σ` : ''}
                    </span>
                    {picked.includes(s.id) && (
                      <span className="ml-auto text-xs font-semibold text-copper">#{picked.indexOf(s.id) + 1}</span>
                    )}
                  </label>
                ))}
              </fieldset>
            )}
            <div className="mt-4">
              <Field label="Combining rule" htmlFor="mixture-rule" hint={COMBINING_RULE_INFO[rule].reference}>
                <Select id="mixture-rule" value={rule} onChange={(e) => setPicks(picked, e.target.value as CombiningRule)}>
                  {COMBINING_RULES.map((r) => (
                    <option key={r} value={r}>
                      {COMBINING_RULE_INFO[r].name}
                    </option>
                  ))}
                </Select>
              </Field>
            </div>
          </Panel>
          <Panel
            title="Pair parameters"
            actions={
              <UnitSwitch energy={energy} length={length} onChange={(u) => update.mutate({ energyUnit: u.energy, lengthUnit: u.length })} />
            }
          >
            {picked.length < 2 ? (
              <EmptyState title="Pick at least two sets">Tick two or more approved sets on the left.</EmptyState>
            ) : mixture.isPending ? (
              <LoadingState />
            ) : mixture.isError ? (
              <ErrorState error={mixture.error} onRetry={() => mixture.refetch()} />
            ) : (
              <div className="grid gap-4">
                <p role="note" className="rounded-md border border-review/40 bg-review-soft/60 px-4 py-2 text-sm">
                  <span className="font-semibold text-review">
                    {mixture.data.pairs.some((p) => p.kind === 'fitted-pair-set')
                      ? 'Fitted pair sets and combining-rule estimates. '
                      : 'Combining-rule estimates. '}
                  </span>
                  {mixture.data.note}
                </p>
                <MixtureTable mixture={mixture.data} energy={energy} length={length} />
                <p className="text-xs text-ink-faint">{mixture.data.formulas}</p>
                {mixture.data.cutoff.warning && (
                  <p role="alert" className="rounded-md bg-changes-soft px-4 py-2 text-sm text-changes">
                    {mixture.data.cutoff.warning}
                  </p>
                )}
                <p className="text-sm">
                  <span className="text-ink-faint">Every component is inside its validity range for </span>
                  {mixture.data.commonValidity ? (
                    <span className="num">{temperatureRangeText(mixture.data.commonValidity)}</span>
                  ) : (
                    <span className="text-changes">no common temperature range</span>
                  )}
                </p>
                <ExportLinks
                  of="mixture"
                  hrefOf={(f) => mixtureHref(picked, rule, f, f === 'csv' ? csvUnits : undefined)}
                  note="Every pair is written explicitly; cross pairs carry the estimate note."
                />
              </div>
            )}
          </Panel>
        </div>
      </div>
    </>
  );
}
