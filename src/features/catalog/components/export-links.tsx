import { EXPORT_FORMATS, type ExportFormat } from '@shared/export/parameter-set-export';

const FORMAT_LABELS: Record<ExportFormat, { label: string; hint: string }> = {
  json: { label: 'JSON', hint: 'epsigma.parameter-set/1, every unit' },
  csv: { label: 'CSV', hint: 'one row, units in the headers' },
  'lammps-real': { label: 'LAMMPS real', hint: 'kcal/mol, Å' },
  'lammps-metal': { label: 'LAMMPS metal', hint: 'eV, Å' },
  'lammps-lj': { label: 'LAMMPS lj', hint: 'reduced units; the mass, energy and length scales in its comments' },
  gromacs: { label: 'GROMACS', hint: 'kJ/mol, nm' },
};

const MIXTURE_HINTS: Partial<Record<ExportFormat, string>> = {
  json: 'epsigma.mixture/1, every unit',
  csv: 'one row per pair, units in the headers',
};

/** One plain download link per format; the server names the file (Content-Disposition). */
export function ExportLinks({
  hrefOf,
  note,
  of = 'set',
  omit = [],
}: {
  hrefOf: (format: ExportFormat) => string;
  note?: string;
  of?: 'set' | 'mixture';
  omit?: readonly ExportFormat[];
}) {
  const hint = (f: ExportFormat) => (of === 'mixture' ? MIXTURE_HINTS[f] : undefined) ?? FORMAT_LABELS[f].hint;
  return (
    <div>
      <ul className="flex flex-wrap gap-2" aria-label="Downloads">
        {EXPORT_FORMATS.filter((f) => !omit.includes(f)).map((f) => (
          <li key={f}>
            <a
              href={hrefOf(f)}
              download
              className="inline-flex flex-col rounded-md border border-rule bg-paper-raised px-3 py-1.5 text-sm hover:bg-paper-deep"
              title={hint(f)}
            >
              <span className="font-semibold">↓ {FORMAT_LABELS[f].label}</span>
              <span className="text-xs text-ink-faint">{hint(f)}</span>
            </a>
          </li>
        ))}
      </ul>
      {note && <p className="mt-2 text-xs text-ink-faint">{note}</p>}
    </div>
  );
}
