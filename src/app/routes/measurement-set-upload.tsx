import { Link, useNavigate, useParams } from 'react-router-dom';
import { ErrorState, LoadingState, PageHeader } from '@/components/ui/states';
import { useDataset } from '@/features/datasets/api/datasets';
import { UploadWizard } from '@/features/datasets/components/upload-wizard';
import { useSubstance } from '@/features/substances/api/substances';

/** Upload a new measurement set for a substance. */
export function DatasetUploadRoute() {
  const substanceId = Number(useParams().substanceId);
  const substance = useSubstance(substanceId);
  const navigate = useNavigate();
  if (substance.isPending) return <LoadingState />;
  if (substance.isError) return <ErrorState error={substance.error} onRetry={() => substance.refetch()} />;
  return (
    <>
      <PageHeader eyebrow={<Link to={`/substances/${substanceId}`} className="hover:underline">{substance.data.name}</Link>} title="Upload measurements" subtitle="A CSV table of B2(T), ρ(T, P) or η(T). Nothing is stored until every row passes." />
      <UploadWizard substanceId={substanceId} molarMassGPerMol={substance.data.molarMassGPerMol} onStored={(r) => navigate(`/datasets/${r.id}`, { state: { uploadWarnings: (r as { warnings?: string[] }).warnings ?? [] } })} />
    </>
  );
}

/** Upload a corrected table as version n+1 of a dataset; earlier versions stay as they are. */
export function DatasetNewVersionRoute() {
  const datasetId = Number(useParams().datasetId);
  const dataset = useDataset(datasetId);
  const substance = useSubstance(dataset.data?.substanceId ?? 0);
  const navigate = useNavigate();
  if (dataset.isPending || (dataset.data && substance.isPending)) return <LoadingState />;
  if (dataset.isError) return <ErrorState error={dataset.error} onRetry={() => dataset.refetch()} />;
  if (substance.isError) return <ErrorState error={substance.error} onRetry={() => substance.refetch()} />;
  const d = dataset.data;
  return (
    <>
      <PageHeader eyebrow={<Link to={`/datasets/${datasetId}`} className="hover:underline">{d.name}</Link>} title={`Corrected version v${d.latestVersion + 1}`} subtitle="Version history is kept: the earlier versions stay readable and downloadable, byte for byte." />
      <UploadWizard
        substanceId={d.substanceId}
        molarMassGPerMol={substance.data!.molarMassGPerMol}
        existing={{ datasetId, kind: d.property, name: d.name, source: d.source, doi: d.doi, method: d.method }}
        onStored={(r) => navigate(`/datasets/${r.id}`, { state: { uploadWarnings: (r as { warnings?: string[] }).warnings ?? [] } })}
      />
    </>
  );
}
