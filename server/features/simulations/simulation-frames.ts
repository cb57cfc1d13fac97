/**
 * The frames of finished NPT runs, kept beside the job for reweighting (shared/physics/md/mbar.ts). A simulation
 * task returns its frames as base64 text inside the result (workers never open the database); the web process,
 * where it persists a job's result, calls `storeSimulationFrames`, which writes them as Float64 BLOBs into
 * simulation_frames and hands back the result without them, so job.result_json stays small.
 */
import { bytesFromFloat64, decodeFloat64, float64FromBytes, type RunFrames } from '../../../shared/physics/md/frames';
import type { ReweightRun } from '../../../shared/physics/md/mbar';
import type { Db, Tx } from '../../db/database';

interface ResultWithFrames {
  phase?: string;
  settings?: { reducedTemperature: number; reducedPressure: number; atoms: number; cutoff: number; scheme: string; timestep: number };
  frames?: RunFrames;
}

/**
 * Writes a simulation result's frames (if any) into simulation_frames and returns the result without the base64
 * frames (with `framesStored: frame count` instead). Anything else is returned unchanged. Idempotent per job.
 */
export async function storeSimulationFrames(db: Db | Tx, jobId: number, result: unknown): Promise<unknown> {
  const r = result as ResultWithFrames | null;
  if (!r || typeof r !== 'object' || !r.frames || !r.settings || typeof r.frames.hamiltonianPotentialBase64 !== 'string') return result;
  const { frames: maybeFrames, ...rest } = r as ResultWithFrames & Record<string, unknown>;
  const frames = maybeFrames!;
  const h = decodeFloat64(frames.hamiltonianPotentialBase64);
  const v = decodeFloat64(frames.volumeBase64);
  if (h.length !== v.length) throw new Error(`simulation ${jobId}: ${h.length} energies but ${v.length} volumes in its frames`);
  const s = r.settings;
  await db
    .insertInto('simulationFrames')
    .values({
      jobId,
      reducedTemperature: s.reducedTemperature,
      reducedPressure: s.reducedPressure,
      atoms: s.atoms,
      cutoff: s.cutoff,
      scheme: s.scheme,
      timestep: s.timestep,
      phase: String(r.phase ?? 'fluid'),
      frameCount: h.length,
      statisticalInefficiency: frames.statisticalInefficiency,
      hamiltonianPotential: Buffer.from(bytesFromFloat64(h)),
      volume: Buffer.from(bytesFromFloat64(v)),
      createdAt: new Date().toISOString(),
    })
    .onConflict((oc) => oc.column('jobId').doNothing())
    .execute();
  return { ...rest, framesStored: h.length };
}

type FramesRow = {
  jobId: number;
  reducedTemperature: number;
  reducedPressure: number;
  atoms: number;
  statisticalInefficiency: number;
  hamiltonianPotential: Uint8Array;
  volume: Uint8Array;
};

const toRun = (row: FramesRow): ReweightRun => ({
  id: row.jobId,
  reducedTemperature: row.reducedTemperature,
  reducedPressure: row.reducedPressure,
  atoms: row.atoms,
  statisticalInefficiency: row.statisticalInefficiency,
  hamiltonianPotential: float64FromBytes(row.hamiltonianPotential),
  volume: float64FromBytes(row.volume),
});

const COLUMNS = [
  'jobId',
  'reducedTemperature',
  'reducedPressure',
  'atoms',
  'statisticalInefficiency',
  'hamiltonianPotential',
  'volume',
] as const;

/** The frames of one run, or undefined when none are stored. */
export async function loadRunFrames(db: Db, jobId: number): Promise<ReweightRun | undefined> {
  const row = await db.selectFrom('simulationFrames').select(COLUMNS).where('jobId', '=', jobId).executeTakeFirst();
  return row ? toRun(row) : undefined;
}
