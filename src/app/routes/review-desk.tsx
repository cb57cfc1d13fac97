import { EmptyState, ErrorState, LoadingState, PageHeader, Panel } from '@/components/ui/states';
import { useReviewQueue } from '@/features/parameter-sets/api/parameter-sets';
import { ParameterSetTable } from '@/features/parameter-sets/components/parameter-set-table';

/** The reviewer's queue: sets in review that they neither drafted nor fitted, oldest submission first. */
export function ReviewDeskRoute() {
  const queue = useReviewQueue();
  return (
    <>
      <PageHeader
        title="Review desk"
        subtitle="Parameter sets waiting for a decision. Sets you drafted, or whose fit you ran, go to another reviewer."
      />
      {queue.isPending ? (
        <LoadingState />
      ) : queue.isError ? (
        <ErrorState error={queue.error} onRetry={() => queue.refetch()} />
      ) : queue.data.length === 0 ? (
        <EmptyState title="Nothing waits for you">
          When a modeller submits a parameter set, it appears here and you receive an e-mail.
        </EmptyState>
      ) : (
        <Panel title={`${queue.data.length} in review`}>
          <ParameterSetTable sets={queue.data} caption="Parameter sets in review" withSubstance queue />
        </Panel>
      )}
    </>
  );
}
