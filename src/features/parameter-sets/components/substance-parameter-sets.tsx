import { EmptyState, ErrorState, LoadingState, Panel } from '@/components/ui/states';
import { useSubstanceParameterSets } from '../api/parameter-sets';
import { ParameterSetTable } from './parameter-set-table';

/** The substance page's list of parameter sets (consumers see published ones only; the server filters). */
export function SubstanceParameterSetsPanel({ substanceId, substanceName }: { substanceId: number; substanceName: string }) {
  const sets = useSubstanceParameterSets(substanceId);
  return (
    <Panel title="Parameter sets">
      {sets.isPending ? (
        <LoadingState />
      ) : sets.isError ? (
        <ErrorState error={sets.error} onRetry={() => sets.refetch()} />
      ) : sets.data.length === 0 ? (
        <EmptyState title="No parameter sets yet">A modeller drafts one from a succeeded fit, on the fit’s page.</EmptyState>
      ) : (
        <ParameterSetTable sets={sets.data} caption={`Parameter sets of ${substanceName}`} />
      )}
    </Panel>
  );
}
