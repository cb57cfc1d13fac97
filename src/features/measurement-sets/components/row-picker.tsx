import { PROPERTY_KINDS } from '@shared/measurements/property-kinds';
import { formatMeasured } from '@shared/format/numbers';
import { ErrorState, LoadingState } from '@/components/ui/states';
import { useMeasurementSet } from '../api/measurement-sets';
import { quantityHeading } from '@/lib/quantity-labels';

/**
 * The rows of one measurement set (the version a fit would use) with a tick box each to leave the row out of
 * a fit. Row numbers count the data rows from 1, as the measurement set page's "Row" column does.
 */
export function MeasurementSetRowPicker({
  measurementSetId,
  name,
  excluded,
  onChange,
}: {
  measurementSetId: number;
  name: string;
  excluded: number[];
  onChange: (rows: number[]) => void;
}) {
  const measurementSet = useMeasurementSet(measurementSetId);
  if (measurementSet.isPending) return <LoadingState label="Loading the rows…" />;
  if (measurementSet.isError) return <ErrorState error={measurementSet.error} onRetry={() => measurementSet.refetch()} />;
  const d = measurementSet.data;
  const def = PROPERTY_KINDS[d.kind];
  const hasPressure = d.rows.some((r) => typeof r.pressureMPa === 'number');
  const toggle = (row: number, out: boolean) =>
    onChange(out ? [...excluded, row].sort((a, b) => a - b) : excluded.filter((r) => r !== row));
  return (
    <div className="max-h-72 overflow-auto rounded-md border border-rule">
      <table className="w-full text-sm" aria-label={`Rows of ${name}`}>
        <thead className="sticky top-0 bg-paper-raised text-xs tracking-wide text-ink-faint">
          <tr className="border-b border-rule">
            <th className="py-1.5 pl-3 text-left">Leave out</th>
            <th className="text-right">Row</th>
            <th className="text-right">File row</th>
            <th className="text-right">T (K)</th>
            {hasPressure && <th className="text-right">P (MPa)</th>}
            <th className="text-right">{quantityHeading(def.valueQuantity)}</th>
            <th className="pr-3 text-right">{quantityHeading(def.uncertaintyQuantity)}</th>
          </tr>
        </thead>
        <tbody>
          {d.rows.map((r, i) => {
            // Rows are counted from 1 over the data, as the measurement set page's "Row" column shows them.
            const row = i + 1;
            const out = excluded.includes(row);
            return (
              <tr
                key={row}
                className={`border-b border-rule/50 ${out ? 'bg-changes-soft/40 text-ink-faint line-through decoration-ink-faint/60' : ''}`}
              >
                <td className="py-1 pl-3">
                  <input
                    type="checkbox"
                    className="accent-copper"
                    aria-label={`Leave out row ${row} of ${name}`}
                    checked={out}
                    onChange={(e) => toggle(row, e.target.checked)}
                  />
                </td>
                <td className="num text-right">{row}</td>
                <td className="num text-right text-ink-faint">{r.row}</td>
                <td className="num text-right">{formatMeasured(r.temperatureK, 6)}</td>
                {hasPressure && (
                  <td className="num text-right">{typeof r.pressureMPa === 'number' ? formatMeasured(r.pressureMPa, 6) : '—'}</td>
                )}
                <td className="num text-right">{formatMeasured(Number(r[def.valueField]))}</td>
                <td className="num pr-3 text-right">{formatMeasured(Number(r[def.uncertaintyField]))}</td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
