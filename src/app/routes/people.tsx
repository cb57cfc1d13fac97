import { EmptyState, ErrorState, LoadingState, PageHeader, Panel } from '@/components/ui/states';
import { usePeople } from '@/features/people/api/people';
import { CreatePersonForm } from '@/features/people/components/create-person-form';
import { PeopleTable } from '@/features/people/components/people-table';

export function PeopleRoute() {
  const people = usePeople();
  return (
    <>
      <PageHeader eyebrow="Admin" title="People" subtitle="Who can sign in, and which roles they hold. A person may hold several roles." />
      <div className="grid gap-6 lg:grid-cols-[2fr_1fr]">
        <Panel title="Everyone">
          {people.isPending ? (
            <LoadingState />
          ) : people.isError ? (
            <ErrorState error={people.error} onRetry={() => people.refetch()} />
          ) : people.data.length === 0 ? (
            <EmptyState title="Nobody here yet" />
          ) : (
            <PeopleTable people={people.data} />
          )}
        </Panel>
        <Panel title="Add a person">
          <CreatePersonForm />
        </Panel>
      </div>
    </>
  );
}
