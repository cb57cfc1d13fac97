import { Link, useNavigate, useParams } from 'react-router-dom';
import { ErrorState, LoadingState, PageHeader } from '@/components/ui/states';
import { useCreateFit } from '@/features/fits/api/fits';
import { FitSetupForm } from '@/features/fits/components/fit-setup-form';
import { useSubstance } from '@/features/substances/api/substances';
import { DatasetRowPicker } from '@/features/datasets/components/row-picker';

export function FitNewRoute() {
  const substanceId = Number(useParams().substanceId);
  const substance = useSubstance(substanceId);
  const create = useCreateFit();
  const navigate = useNavigate();
  if (substance.isPending) return <LoadingState />;
  if (substance.isError) return <ErrorState error={substance.error} onRetry={() => substance.refetch()} />;
  return (
    <>
      <PageHeader eyebrow={<Link to={`/substances/${substanceId}`} className="hover:underline">{substance.data.name}</Link>} title="New fit" subtitle="Weighted Levenberg–Marquardt over ε/k_B and σ of the LJ 12-6 potential. The fit runs in the background; you can leave the page." />
      <FitSetupForm substanceId={substanceId} datasets={substance.data.datasets} busy={create.isPending} error={create.error} onSubmit={(body) => create.mutate(body, { onSuccess: (r) => navigate(`/fits/${r.id}`) })}
        renderRowPicker={(d, excluded, onChange) => <DatasetRowPicker datasetId={d.id} name={d.name} excluded={excluded} onChange={onChange} />}
      />
    </>
  );
}
