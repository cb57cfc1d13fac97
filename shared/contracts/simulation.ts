/**
 * Contract of a job as the API shows it and of its one public kind, the NPT simulation: the stored input and result of a
 * `simulation` job (job.input_json, job.result_json), the answers of /api/simulations (list, detail, start, cancel,
 * retry) and the queue view (/api/simulations/queue). Built in server/features/simulations/simulations.view.ts.
 */
import { z } from 'zod';
import { SIMULATION_CUTOFF_SCHEMES } from '../physics/cutoff-schemes';

export const jobStatusSchema = z.enum(['queued', 'running', 'succeeded', 'failed', 'cancelled']);
export type JobStatus = z.infer<typeof jobStatusSchema>;

/** What every job shows of itself (its result is the kind's business). */
export const jobFields = {
  id: z.number().int(),
  kind: z.string(),
  status: jobStatusSchema,
  progress: z.number(),
  stage: z.string().nullable(),
  error: z.string().nullable(),
  retryable: z.boolean(),
  attempts: z.number().int(),
  seed: z.number().int(),
  /** Worker process that ran (or runs) the job: host and process id. */
  ranOn: z.string().nullable(),
  createdAt: z.string(),
  startedAt: z.string().nullable(),
  finishedAt: z.string().nullable(),
};

/** A run's state with every engine setting filled in (reduced units). */
export const simulationStateSchema = z.strictObject({
  reducedTemperature: z.number(),
  reducedPressure: z.number(),
  atoms: z.number().int(),
  steps: z.number().int(),
  cutoff: z.number(),
  scheme: z.enum(SIMULATION_CUTOFF_SCHEMES),
  timestep: z.number(),
  seed: z.number().int(),
});
export type SimulationState = z.infer<typeof simulationStateSchema>;

/** Where a run came from, when a modeller started it from a measured density. */
export const simulationOriginSchema = z.strictObject({
  substanceId: z.number().int(),
  measurementSetId: z.number().int(),
  version: z.number().int(),
  fileRow: z.number().int(),
  temperatureK: z.number(),
  pressureMPa: z.number(),
  densityKgPerM3: z.number(),
  epsilonK: z.number(),
  sigmaAngstrom: z.number(),
});
export type SimulationOrigin = z.infer<typeof simulationOriginSchema>;

/** job.input_json of a simulation (read after readStoredJson: older rows say datasetId; vocabulary: keep). */
export const storedSimulationInput = z.strictObject({ state: simulationStateSchema, origin: simulationOriginSchema.optional() });
export type SimulationInput = z.infer<typeof storedSimulationInput>;

export const mdTraceSchema = z.strictObject({
  step: z.array(z.number()),
  reducedDensity: z.array(z.number()),
  reducedTemperature: z.array(z.number()),
  potentialEnergyPerAtom: z.array(z.number()),
  q6: z.array(z.number()),
});
export type MdTraceView = z.infer<typeof mdTraceSchema>;

/**
 * An NPT run's result without its trace and frames (shared/physics/md/npt.ts NptResult). Fields the engine gained
 * later (start, warnings, volume fluctuation) are optional so runs stored before them still read.
 */
export const simulationSummarySchema = z.strictObject({
  reducedDensity: z.number(),
  stdErr: z.number(),
  effectiveSamples: z.number(),
  statisticalInefficiency: z.number(),
  startedFrom: z.enum(['melted-lattice', 'fcc-lattice']).optional(),
  warnings: z.array(z.string()).optional(),
  phase: z.enum(['fluid', 'solid', 'two-phase']),
  reducedPotentialEnergy: z.number(),
  reducedPotentialEnergyStdErr: z.number(),
  reducedEnthalpy: z.number(),
  reducedEnthalpyStdErr: z.number(),
  reducedConfigurationalEnthalpy: z.number(),
  dRhoDT: z.number(),
  dRhoDTStdErr: z.number(),
  dRhoDP: z.number(),
  dRhoDPStdErr: z.number(),
  isothermalCompressibility: z.number(),
  meanVolume: z.number().optional(),
  volumeVariance: z.number().optional(),
  volumeVarianceStdErr: z.number().optional(),
  /** Engine settings as run; the extension limits are absent from runs stored before extensions. */
  settings: z.strictObject({
    ...simulationStateSchema.shape,
    skin: z.number(),
    thermostatTau: z.number(),
    sampleEvery: z.number().int(),
    tuningSteps: z.number().int(),
    initialDensity: z.number(),
    minEffectiveSamples: z.number().optional(),
    maxSteps: z.number().int().optional(),
  }),
  /** Engine diagnostics; the step counts and melt check are absent from runs stored before them. */
  diagnostics: z.strictObject({
    volumeAcceptance: z.number(),
    maxLnVolumeStep: z.number(),
    meanTemperature: z.number(),
    temperatureStdErr: z.number(),
    meanPressure: z.number(),
    meanPressureStdErr: z.number(),
    conservedEnergyDriftPerAtomPerTime: z.number(),
    equilibrationSample: z.number().int(),
    equilibrationStep: z.number().int(),
    productionSamples: z.number().int(),
    statisticalInefficiency: z.number(),
    effectiveSamples: z.number(),
    blockingStdErr: z.number(),
    totalSteps: z.number().int().optional(),
    meltSteps: z.number().int().optional(),
    meltQ6: z.number().nullable().optional(),
    listBuilds: z.number().int(),
    wallSeconds: z.number(),
  }),
  orderParameter: z.strictObject({
    q6Mean: z.number(),
    q6Last: z.number(),
    localDensityVarianceToMean: z.number(),
    sparseCellFraction: z.number(),
    bondsPerAtom: z.number(),
  }),
  /** How many production frames went into simulation_frames (storeSimulationFrames); absent for runs stored before frames. */
  framesStored: z.number().int().optional(),
});
export type SimulationSummary = z.infer<typeof simulationSummarySchema>;

/** job.result_json of a simulation: the summary with its trace; frames went to simulation_frames (never in a view). */
export const storedSimulationResult = simulationSummarySchema.extend({ trace: mdTraceSchema, frames: z.unknown().optional() });

/** One simulation: the job, its state and origin, the result's summary, and (detail only) its trace. */
export const simulationView = z.strictObject({
  ...jobFields,
  state: simulationStateSchema,
  origin: simulationOriginSchema.nullable(),
  summary: simulationSummarySchema.nullable(),
  trace: mdTraceSchema.optional(),
});
export type Simulation = z.infer<typeof simulationView>;

export const simulationListView = z.strictObject({ simulations: z.array(simulationView) });

/** 202 of a start: the job (reused when the same run exists) and the state it runs. */
export const simulationStartView = z.strictObject({ id: z.number().int(), reused: z.boolean(), state: simulationStateSchema });
export type SimulationStart = z.infer<typeof simulationStartView>;
export const simulationsFromMeasurementSetView = z.strictObject({ runs: z.array(simulationStartView) });

const laneCountsSchema = z.strictObject({ waiting: z.number().int(), active: z.number().int(), delayed: z.number().int() });
const lanesSchema = z.strictObject({ simulation: laneCountsSchema, fast: laneCountsSchema });

/** A worker process that runs jobs, as it last reported itself. */
export const workerInfoSchema = z.strictObject({
  name: z.string(),
  host: z.string(),
  pid: z.number().int(),
  threads: z.strictObject({ simulation: z.number().int(), fast: z.number().int() }),
  active: z.number().int(),
  engineVersions: z.record(z.string(), z.string()),
  startedAt: z.string(),
  lastSeenAt: z.string(),
});
export type WorkerInfo = z.infer<typeof workerInfoSchema>;

/** The job queue as the admin sees it (GET /api/simulations/queue `queue`); `error` when the queue could not be asked. */
export const queueHealthSchema = z.strictObject({
  driver: z.enum(['sqlite', 'redis']),
  waiting: z.number().int(),
  active: z.number().int(),
  delayed: z.number().int(),
  workers: z.number().int(),
  lanes: lanesSchema,
  workerList: z.array(workerInfoSchema),
  error: z.string().optional(),
});
export type QueueHealth = z.infer<typeof queueHealthSchema>;
export const queueView = z.strictObject({ queue: queueHealthSchema });
