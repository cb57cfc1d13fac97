import { detailsOf, detailText, type ApiErrorDetail } from '@/lib/api-client';

/** A refused request: its message and one line per field the server named, as the form labels it. */
export function FormError({
  error,
  unplaced,
}: {
  error: Error | null;
  /** the details not already beside their fields */ unplaced?: ApiErrorDetail[];
}) {
  if (!error) return null;
  const details = unplaced ?? detailsOf(error);
  return (
    <div role="alert" className="rounded-md bg-changes-soft px-3 py-2 text-sm text-changes">
      <p className="font-semibold">{error.message}</p>
      {details.length > 0 && (
        <ul className="mt-1 list-disc pl-5">
          {details.map((d, i) => (
            <li key={i}>{detailText(d)}</li>
          ))}
        </ul>
      )}
    </div>
  );
}
