/** Shown wherever frozen parameters are offered for use. */
export const PARAMETER_CAUTION =
  'Fitted model parameters are not validated property data for pressure, safety or process design; defer to local codes and licensed engineering practice.';

export function ParameterSetCaution() {
  return (
    <p role="note" className="rounded-md border border-review/40 bg-review-soft/60 px-4 py-2 text-sm">
      <span className="font-semibold text-review">Caution. </span>
      {PARAMETER_CAUTION}
    </p>
  );
}
