import { Button } from '@/components/ui/button';
import { EmptyState, ErrorState, LoadingState, PageHeader } from '@/components/ui/states';
import { Authorization } from '@/lib/authorization';
import { useRerunValidationSuite, useValidationSuite } from '@/features/validation-suite/api/validation-suite';
import { TestSuiteOnlyChecks, ValidationArea, ValidationSummary } from '@/features/validation-suite/components/validation-suite-view';

export function ValidationSuiteRoute() {
  return (
    <Authorization
      policy="validation:read"
      fallback={
        <>
          <PageHeader eyebrow="Admin" title="Validation suite" />
          <EmptyState title="Not allowed for your roles">The validation suite is for admins.</EmptyState>
        </>
      }
    >
      <ValidationSuite />
    </Authorization>
  );
}

function ValidationSuite() {
  const suite = useValidationSuite();
  const rerun = useRerunValidationSuite();
  const run = suite.data;
  return (
    <>
      <PageHeader
        eyebrow="Admin"
        title="Validation suite"
        subtitle="Every reference check of the unit tests (source, reference, ours, tolerance), run by the code of this server."
        action={
          <Button variant="primary" onClick={() => rerun.mutate()} busy={rerun.isPending} disabled={suite.isPending}>
            {rerun.isPending ? 'Running the checks…' : 'Run again'}
          </Button>
        }
      />
      {rerun.isError && <ErrorState title="The rerun failed" error={rerun.error} onRetry={() => rerun.mutate()} />}
      {suite.isPending ? (
        <LoadingState label="Running the reference checks on the server (a few seconds the first time)…" />
      ) : suite.isError ? (
        <ErrorState error={suite.error} onRetry={() => void suite.refetch()} />
      ) : run!.checks.length === 0 ? (
        <EmptyState title="No reference checks">The registry in shared/validation holds no checks.</EmptyState>
      ) : (
        <div className="grid gap-4" aria-busy={rerun.isPending || undefined}>
          <ValidationSummary run={run!} />
          {run!.areas.map((area) => {
            const checks = run!.checks.filter((c) => c.area === area);
            return checks.length > 0 ? <ValidationArea key={area} area={area} checks={checks} /> : null;
          })}
          <TestSuiteOnlyChecks checks={run!.testSuiteOnly} />
        </div>
      )}
    </>
  );
}
