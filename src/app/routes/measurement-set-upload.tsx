import { Link, useNavigate, useParams } from 'react-router-dom';
import { ErrorState, LoadingState, PageHeader } from '@/components/ui/states';
import { useMeasurementSet } from '@/features/measurement-sets/api/measurement-sets';
import { UploadWizard } from '@/features/measurement-sets/components/upload-wizard';
import { useSubstance } from '@/features/substances/api/substances';

/** Upload a new measurement set for a substance. */
export function MeasurementSetUploadRoute() {
  const substanceId = Number(useParams().substanceId);
  const substance = useSubstance(substanceId);
  const navigate = useNavigate();
  if (substance.isPending) return <LoadingState />;
  if (substance.isError) return <ErrorState error={substance.error} onRetry={() => substance.refetch()} />;
  return (
    <>
      <PageHeader
        eyebrow={
          <Link to={`/substances/${substanceId}`} className="hover:underline">
            {substance.data.name}
          </Link>
        }
        title="Upload measurements"
        subtitle="A CSV table of B2(T), ρ(T, P) or η(T). Nothing is stored until every row passes."
      />
      <UploadWizard
        substanceId={substanceId}
        molarMassGPerMol={substance.data.molarMassGPerMol}
        onStored={(r) =>
          navigate(`/measurement-sets/${r.id}`, { state: { uploadWarnings: (r as { warnings?: string[] }).warnings ?? [] } })
        }
      />
    </>
  );
}

/** Upload a corrected table as version n+1 of a measurement set; earlier versions stay as they are. */
export function MeasurementSetNewVersionRoute() {
  const measurementSetId = Number(useParams().measurementSetId);
  const measurementSet = useMeasurementSet(measurementSetId);
  const substance = useSubstance(measurementSet.data?.substanceId ?? 0);
  const navigate = useNavigate();
  if (measurementSet.isPending || (measurementSet.data && substance.isPending)) return <LoadingState />;
  if (measurementSet.isError) return <ErrorState error={measurementSet.error} onRetry={() => measurementSet.refetch()} />;
  if (substance.isError) return <ErrorState error={substance.error} onRetry={() => substance.refetch()} />;
  const d = measurementSet.data;
  return (
    <>
      <PageHeader
        eyebrow={
          <Link to={`/measurement-sets/${measurementSetId}`} className="hover:underline">
            {d.name}
          </Link>
        }
        title={`Corrected version v${d.latestVersion + 1}`}
        subtitle="Version history is kept: the earlier versions stay readable and downloadable, byte for byte."
      />
      <UploadWizard
        substanceId={d.substanceId}
        molarMassGPerMol={substance.data!.molarMassGPerMol}
        existing={{ measurementSetId, kind: d.kind, name: d.name, source: d.source, doi: d.doi, method: d.method }}
        onStored={(r) =>
          navigate(`/measurement-sets/${r.id}`, { state: { uploadWarnings: (r as { warnings?: string[] }).warnings ?? [] } })
        }
      />
    </>
  );
}
