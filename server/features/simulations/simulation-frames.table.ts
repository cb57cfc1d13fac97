/** One row per finished NPT run: its retained production frames as Float64 BLOBs (migration 20261202_0008). */
export interface SimulationFramesTable {
  jobId: number;
  reducedTemperature: number;
  reducedPressure: number;
  atoms: number;
  cutoff: number;
  scheme: string;
  timestep: number;
  /** The run's phase flag: only 'fluid' runs are pooled. */
  phase: string;
  frameCount: number;
  statisticalInefficiency: number;
  hamiltonianPotential: Uint8Array;
  volume: Uint8Array;
  createdAt: string;
}
