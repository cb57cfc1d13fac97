import { Link, useNavigate, useParams } from 'react-router-dom';
import { ErrorState, LoadingState, PageHeader } from '@/components/ui/states';
import { useCreateFit } from '@/features/fits/api/fits';
import { FitSetupForm } from '@/features/fits/components/fit-setup-form';
import { useSubstanceParameterSets } from '@/features/parameter-sets/api/parameter-sets';
import { useSubstance } from '@/features/substances/api/substances';
import { MeasurementSetRowPicker } from '@/features/measurement-sets/components/row-picker';

export function FitNewRoute() {
  const substanceId = Number(useParams().substanceId);
  const substance = useSubstance(substanceId);
  // Approved sets of the substance, offered as a Gaussian prior for the posterior (none while they load).
  const sets = useSubstanceParameterSets(substanceId);
  const priorSets = (sets.data ?? []).filter((p) => p.state === 'approved');
  const create = useCreateFit();
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
        title="New fit"
        subtitle="Weighted Levenberg–Marquardt over ε/k_B and σ of an LJ 12-6 or Mie λr-6 potential, with its posterior if you ask. The fit runs in the background; you can leave the page."
      />
      <FitSetupForm
        substanceId={substanceId}
        measurementSets={substance.data.measurementSets ?? []}
        priorSets={priorSets}
        busy={create.isPending}
        error={create.error}
        onSubmit={(body) => create.mutate(body, { onSuccess: (r) => navigate(`/fits/${r.id}`) })}
        renderRowPicker={(d, excluded, onChange) => (
          <MeasurementSetRowPicker measurementSetId={d.id} name={d.name} excluded={excluded} onChange={onChange} />
        )}
      />
    </>
  );
}
