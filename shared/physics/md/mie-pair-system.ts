/** What the Mie pair loops read from LjSystem (lj-system.ts): the half neighbour list in CSR form and the box. */
export interface MiePairSystem {
  readonly n: number;
  readonly pos: Float64Array;
  readonly force: Float64Array;
  readonly nbList: Int32Array;
  readonly nbStart: Int32Array;
  readonly nbMid: Int32Array;
  readonly rc2: number;
  readonly box: number;
}

/** Pair sums of one evaluation, as LjSystem's PairSums. */
export interface MiePairSums {
  potentialTruncated: number;
  virial: number;
  pairsInside: number;
}
