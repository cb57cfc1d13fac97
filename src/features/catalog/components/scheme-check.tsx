import { CUTOFF_SCHEME_LABELS, CUTOFF_SCHEMES, type CutoffScheme } from '@shared/physics/cutoff-schemes';
import { Select } from '@/components/ui/field';

/**
 * What a different cutoff treatment does to the parameters, in words. Truncation and shifting change the
 * effective potential, so ε and σ fitted under one treatment reproduce the data only under that treatment.
 */
function mismatchText(fitted: CutoffScheme, used: CutoffScheme): string {
  if (fitted === 'full-potential')
    return 'These parameters were fitted to the full potential (B2 or dilute-gas viscosity). With a truncated potential use a long cutoff with tail corrections, or expect shifted properties.';
  if (used === 'full-potential')
    return `These parameters were fitted with a ${CUTOFF_SCHEME_LABELS[fitted].toLowerCase()} potential; the full potential would not reproduce the data they were fitted to.`;
  return `These parameters were fitted with a ${CUTOFF_SCHEME_LABELS[fitted].toLowerCase()} potential, not ${CUTOFF_SCHEME_LABELS[used].toLowerCase()}: liquid densities and energies will differ from the data they were fitted to.`;
}

/** "My simulation uses …": the person's own scheme, remembered, with a warning when it is not the set's. */
export function SchemeCheck({
  fitted,
  cutoffSigma,
  used,
  onChange,
  busy,
}: {
  fitted: CutoffScheme;
  cutoffSigma: number | null;
  used: CutoffScheme | undefined;
  onChange: (s: CutoffScheme | null) => void;
  busy?: boolean;
}) {
  return (
    <div className="grid gap-2">
      <label htmlFor="my-scheme" className="text-sm font-semibold">
        My simulation uses
      </label>
      <Select
        id="my-scheme"
        value={used ?? ''}
        disabled={busy}
        onChange={(e) => onChange((e.target.value || null) as CutoffScheme | null)}
        className="max-w-sm"
      >
        <option value="">Not said</option>
        {CUTOFF_SCHEMES.map((s) => (
          <option key={s} value={s}>
            {CUTOFF_SCHEME_LABELS[s]}
          </option>
        ))}
      </Select>
      {used && used !== fitted ? (
        <p role="alert" className="rounded-md border border-changes/40 bg-changes-soft px-3 py-2 text-sm text-changes">
          <span className="font-semibold">Different scheme. </span>
          {mismatchText(fitted, used)}
        </p>
      ) : used ? (
        <p role="status" className="text-sm text-approved">
          Matches the scheme the set was fitted for{cutoffSigma !== null ? ` (use r_c = ${cutoffSigma} σ)` : ''}.
        </p>
      ) : null}
    </div>
  );
}
