import { useState } from 'react';
import { CUTOFF_SCHEME_LABELS, CUTOFF_SCHEMES, CUTOFF_SIGMA_RANGE, type CutoffScheme, type Validity } from '@shared/schemas/parameter-sets';
import { Button } from '@/components/ui/button';
import { Field, Input, Select, TextArea } from '@/components/ui/field';
import { useDraftParameterSet, type ParameterSetSummary } from '../api/parameter-sets';
import { FormError } from './form-error';
import { toValidity, validityInputOf, ValidityFields, type ValidityInput } from './validity-fields';

/**
 * Drafts a parameter set from a succeeded fit. The validity range starts at the span of the fitted data;
 * the scheme at the fit's (full potential for B2 and viscosity, the simulations' cutoff for densities).
 */
export function DraftParameterSetForm({ fitId, defaults, onDrafted }: { fitId: number; defaults: { scheme: CutoffScheme; cutoffSigma: number | null; validity: Validity }; onDrafted: (set: ParameterSetSummary) => void }) {
  const draft = useDraftParameterSet();
  const [scheme, setScheme] = useState<CutoffScheme>(defaults.scheme);
  const [cutoff, setCutoff] = useState(String(defaults.cutoffSigma ?? 2.5));
  const [validity, setValidity] = useState<ValidityInput>(validityInputOf(defaults.validity));
  const [rationale, setRationale] = useState('');
  return (
    <form
      className="grid gap-4"
      aria-label="Draft a parameter set"
      onSubmit={(e) => {
        e.preventDefault();
        draft.mutate(
          { fitId, scheme, ...(scheme !== 'full-potential' ? { cutoffSigma: Number(cutoff.replace(',', '.')) } : {}), validity: toValidity(validity), rationale },
          { onSuccess: onDrafted },
        );
      }}
    >
      <div className="grid gap-3 sm:grid-cols-2">
        <Field label="Cutoff scheme" htmlFor="draft-scheme" hint="B2 and dilute-gas viscosity see the whole potential; density fits use their simulations’ cutoff.">
          <Select id="draft-scheme" value={scheme} onChange={(e) => setScheme(e.target.value as CutoffScheme)}>
            {CUTOFF_SCHEMES.map((s) => <option key={s} value={s}>{CUTOFF_SCHEME_LABELS[s]}</option>)}
          </Select>
        </Field>
        {scheme !== 'full-potential' && (
          <Field label="Cutoff r_c (σ)" htmlFor="draft-cutoff" hint={`${CUTOFF_SIGMA_RANGE.min} to ${CUTOFF_SIGMA_RANGE.max} σ`}>
            <Input id="draft-cutoff" inputMode="decimal" value={cutoff} onChange={(e) => setCutoff(e.target.value)} />
          </Field>
        )}
      </div>
      <ValidityFields idPrefix="draft" value={validity} onChange={setValidity} hint="Starts at the span of the fitted data." />
      <Field label="Rationale" htmlFor="draft-rationale" hint="Why these values, for what use; the reviewer reads this first.">
        <TextArea id="draft-rationale" rows={3} value={rationale} onChange={(e) => setRationale(e.target.value)} />
      </Field>
      <FormError error={draft.error} />
      <div>
        <Button type="submit" variant="primary" busy={draft.isPending}>Draft parameter set</Button>
      </div>
    </form>
  );
}
