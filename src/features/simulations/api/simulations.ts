import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { CreateSimulationBody, SimulationsFromMeasurementSetBody } from '@shared/schemas/simulations';
import { api } from '@/lib/api-client';
import type { SimulationCutoffScheme } from '@shared/physics/cutoff-schemes';

export type JobStatus = 'queued' | 'running' | 'succeeded' | 'failed' | 'cancelled';

export interface SimulationState {
  reducedTemperature: number;
  reducedPressure: number;
  atoms: number;
  steps: number;
  cutoff: number;
  scheme: SimulationCutoffScheme;
  timestep: number;
  seed: number;
}

export interface SimulationSummary {
  reducedDensity: number;
  stdErr: number;
  phase: 'fluid' | 'solid' | 'two-phase';
  reducedPotentialEnergy: number;
  reducedPotentialEnergyStdErr: number;
  reducedEnthalpy: number;
  dRhoDT: number;
  dRhoDTStdErr: number;
  dRhoDP: number;
  dRhoDPStdErr: number;
  isothermalCompressibility: number;
  diagnostics: Record<string, number>;
  orderParameter: { q6Mean: number; q6Last: number; localDensityVarianceToMean: number; sparseCellFraction: number; bondsPerAtom: number };
}

export interface Simulation {
  id: number;
  status: JobStatus;
  progress: number;
  stage: string | null;
  error: string | null;
  retryable: boolean;
  attempts: number;
  seed: number;
  /** Worker process that ran (or runs) it: host and process id. */
  ranOn: string | null;
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
  state: SimulationState;
  origin: { substanceId: number; measurementSetId: number; version: number; fileRow: number; temperatureK: number; pressureMPa: number; densityKgPerM3: number; epsilonK: number; sigmaAngstrom: number } | null;
  summary: SimulationSummary | null;
  trace?: { step: number[]; reducedDensity: number[]; reducedTemperature: number[]; potentialEnergyPerAtom: number[]; q6: number[] };
}

export interface QueueLane {
  waiting: number;
  active: number;
  delayed: number;
}

/** GET /api/simulations/queue: the job queue as the admin sees it. */
export interface QueueState {
  driver: 'sqlite' | 'redis';
  waiting: number;
  active: number;
  delayed: number;
  workers: number;
  lanes: { simulation: QueueLane; fast: QueueLane };
  workerList: Array<{ name: string; host: string; pid: number; threads: { simulation: number; fast: number }; active: number; startedAt: string; lastSeenAt: string }>;
}

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
    queryFn: () => api<{ queue: QueueState }>('/simulations/queue').then((r) => r.queue),
    refetchInterval: 3000,
  });

export const useSimulations = () => useQuery(simulationsQueryOptions());
export const useQueueState = (enabled = true) => useQuery({ ...queueQueryOptions(), enabled });
export const useSimulation = (id: number) => useQuery(simulationQueryOptions(id));

export const useStartSimulation = () => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateSimulationBody) => api<{ id: number; reused: boolean }>('/simulations', { body }),
    onSuccess: () => qc.invalidateQueries({ queryKey: simulationKeys.all }),
  });
};

export const useStartSimulationsFromMeasurementSet = () => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: SimulationsFromMeasurementSetBody) => api<{ runs: Array<{ id: number; reused: boolean }> }>('/simulations/from-measurement-set', { body }),
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
