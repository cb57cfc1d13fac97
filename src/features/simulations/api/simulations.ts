import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { CreateSimulationBody, SimulationsFromMeasurementSetBody } from '@shared/schemas/simulations';
import type { JobStatus, QueueHealth, Simulation, SimulationStart } from '@shared/contracts/simulation';
import { api } from '@/lib/api-client';

// Answers of the API: the contracts in shared/contracts/simulation.ts (never declared again here).
export type { JobStatus, Simulation, SimulationState, SimulationSummary } from '@shared/contracts/simulation';
/** GET /api/simulations/queue: the job queue as the admin sees it. */
export type { QueueHealth as QueueState } from '@shared/contracts/simulation';

export const simulationKeys = {
  all: ['simulations'] as const,
  list: () => [...simulationKeys.all, 'list'] as const,
  queue: () => [...simulationKeys.all, 'queue'] as const,
  detail: (id: number) => [...simulationKeys.all, 'detail', id] as const,
};

const live = (s?: JobStatus) => s === 'queued' || s === 'running';

export const simulationsQueryOptions = () =>
  queryOptions({
    queryKey: simulationKeys.list(),
    queryFn: () => api<{ simulations: Simulation[] }>('/simulations').then((r) => r.simulations),
    refetchInterval: (q) => (q.state.data?.some((s) => live(s.status)) ? 1000 : false),
  });

export const simulationQueryOptions = (id: number) =>
  queryOptions({
    queryKey: simulationKeys.detail(id),
    queryFn: () => api<Simulation>(`/simulations/${id}`),
    refetchInterval: (q) => (live(q.state.data?.status) ? 1000 : false),
  });

export const queueQueryOptions = () =>
  queryOptions({
    queryKey: simulationKeys.queue(),
    queryFn: () => api<{ queue: QueueHealth }>('/simulations/queue').then((r) => r.queue),
    refetchInterval: 3000,
  });

export const useSimulations = () => useQuery(simulationsQueryOptions());
export const useQueueState = (enabled = true) => useQuery({ ...queueQueryOptions(), enabled });
export const useSimulation = (id: number) => useQuery(simulationQueryOptions(id));

export const useStartSimulation = () => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateSimulationBody) => api<SimulationStart>('/simulations', { body }),
    onSuccess: () => qc.invalidateQueries({ queryKey: simulationKeys.all }),
  });
};

export const useStartSimulationsFromMeasurementSet = () => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: SimulationsFromMeasurementSetBody) =>
      api<{ runs: SimulationStart[] }>('/simulations/from-measurement-set', { body }),
    onSuccess: () => qc.invalidateQueries({ queryKey: simulationKeys.all }),
  });
};

export const useSimulationAction = (id: number, action: 'cancel' | 'retry') => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => api<Simulation>(`/simulations/${id}/${action}`, { method: 'POST' }),
    onSuccess: () => qc.invalidateQueries({ queryKey: simulationKeys.all }),
  });
};
