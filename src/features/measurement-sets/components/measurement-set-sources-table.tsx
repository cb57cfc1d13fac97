import { Link } from 'react-router-dom';
import { KindBadge } from '@/components/ui/badge';

export interface MeasurementSetSourceRow {
  versionId: number;
  measurementSetId?: number;
  name: string;
  version: number;
  kind: string;
  rowCount?: number | null;
  source?: string | null;
  method?: string | null;
  doi?: string | null;
  sha256?: string | null;
  weight?: number;
}

/**
 * The measurement-set versions behind a parameter set with their provenance. Readers who may open measurement sets
 * get links and the SHA-256; the catalog shows the citation only.
 */
export function MeasurementSetSourcesTable({
  rows,
  linkToMeasurementSets = false,
  showSha = false,
}: {
  rows: MeasurementSetSourceRow[];
  linkToMeasurementSets?: boolean;
  showSha?: boolean;
}) {
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm">
        <thead className="border-b border-rule text-xs tracking-wide text-ink-faint">
          <tr>
            <th className="py-1.5 text-left">Set</th>
            <th className="text-left">Kind</th>
            <th className="text-right">Points</th>
            <th className="pl-4 text-left">Source</th>
            <th className="text-left">DOI</th>
            {showSha && <th className="text-left">SHA-256</th>}
          </tr>
        </thead>
        <tbody>
          {rows.map((d) => (
            <tr key={d.versionId} className="border-b border-rule/60">
              <td className="py-1.5">
                {linkToMeasurementSets && d.measurementSetId ? (
                  <Link className="underline" to={`/measurement-sets/${d.measurementSetId}?version=${d.version}`}>
                    {d.name} v{d.version}
                  </Link>
                ) : (
                  `${d.name} v${d.version}`
                )}
                {d.weight !== undefined && d.weight !== 1 && <span className="text-ink-faint"> (weight {d.weight})</span>}
              </td>
              <td>
                <KindBadge kind={d.kind} />
              </td>
              <td className="num text-right">{d.rowCount ?? '—'}</td>
              <td className="pl-4">
                {d.source ?? <span className="text-ink-faint">not given</span>}
                {d.method && <div className="text-xs text-ink-faint">{d.method}</div>}
              </td>
              <td>
                {d.doi ? (
                  <a className="underline" href={`https://doi.org/${encodeURI(d.doi)}`} rel="noreferrer noopener" target="_blank">
                    {d.doi}
                  </a>
                ) : (
                  '—'
                )}
              </td>
              {showSha && <td className="font-mono text-xs">{d.sha256 ? `${d.sha256.slice(0, 12)}…` : '—'}</td>}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
