import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { ValidationSuiteRun } from '@shared/contracts/validation-suite';
import { api } from '@/lib/api-client';

export type { ValidationCheckResult, ValidationSuiteRun, ValidationTestSuiteOnly } from '@shared/contracts/validation-suite';

export const validationSuiteKeys = {
  all: ['validation-suite'] as const,
  run: () => [...validationSuiteKeys.all, 'run'] as const,
};

/** The server's kept run (the first request of a process runs the suite, a few seconds). */
export const validationSuiteQueryOptions = () =>
  queryOptions({
    queryKey: validationSuiteKeys.run(),
    queryFn: () => api<ValidationSuiteRun>('/admin/validation-suite'),
    // The run only changes when someone reruns it.
    staleTime: Infinity,
  });

export const useValidationSuite = () => useQuery(validationSuiteQueryOptions());

/** Runs every check again on the server; the answer replaces the cached run. */
export function useRerunValidationSuite() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => api<ValidationSuiteRun>('/admin/validation-suite?rerun=1'),
    onSuccess: (run) => queryClient.setQueryData(validationSuiteKeys.run(), run),
  });
}
