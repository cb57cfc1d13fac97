/**
 * Per-frame data of an NPT run kept for reweighting (mbar.ts): for every retained production sample the total
 * potential energy of the sampled Hamiltonian H_pot (ε, the run's cutoff scheme in σ units, tail terms included
 * for 'truncated-tail') and the volume V (σ³). With the run's T*, P* these give the reduced potential
 * u(x) = (H_pot + P*·V)/T* at any other (T*, P*), which is all multistate reweighting needs.
 *
 * In a task result the two series travel as base64 text of little-endian Float64 values (JSON-safe, 8 bytes a
 * value plus a third); the web process stores them as BLOBs beside the run (simulation_frames table).
 */

export interface RunFrames {
  /** Number of frames. */
  count: number;
  /** Statistical inefficiency of the run's density series over these frames (samples per independent sample). */
  statisticalInefficiency: number;
  hamiltonianPotentialBase64: string;
  volumeBase64: string;
}

const ALPHABET = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789+/';
const LOOKUP = (() => {
  const t = new Int16Array(128).fill(-1);
  for (let i = 0; i < ALPHABET.length; i++) t[ALPHABET.charCodeAt(i)] = i;
  return t;
})();

function bytesOf(values: Float64Array): Uint8Array {
  const out = new Uint8Array(values.length * 8);
  const view = new DataView(out.buffer);
  for (let i = 0; i < values.length; i++) view.setFloat64(8 * i, values[i], true);
  return out;
}

/** Float64 values → base64 of their little-endian bytes. */
export function encodeFloat64(values: ArrayLike<number>): string {
  const bytes = bytesOf(Float64Array.from(values));
  let out = '';
  for (let i = 0; i < bytes.length; i += 3) {
    const b0 = bytes[i];
    const b1 = i + 1 < bytes.length ? bytes[i + 1] : 0;
    const b2 = i + 2 < bytes.length ? bytes[i + 2] : 0;
    out += ALPHABET[b0 >> 2] + ALPHABET[((b0 & 3) << 4) | (b1 >> 4)];
    out += i + 1 < bytes.length ? ALPHABET[((b1 & 15) << 2) | (b2 >> 6)] : '=';
    out += i + 2 < bytes.length ? ALPHABET[b2 & 63] : '=';
  }
  return out;
}

/** Inverse of encodeFloat64; throws on text that is not base64 of whole Float64 values. */
export function decodeFloat64(text: string): Float64Array {
  const clean = text.replace(/=+$/, '');
  const bytes = new Uint8Array(Math.floor((clean.length * 3) / 4));
  let j = 0;
  for (let i = 0; i < clean.length; i += 4) {
    const c = [0, 1, 2, 3].map((k) => (i + k < clean.length ? (LOOKUP[clean.charCodeAt(i + k)] ?? -1) : 0));
    if (c.some((v) => v < 0)) throw new RangeError('frames: not base64 text');
    const n = (c[0] << 18) | (c[1] << 12) | (c[2] << 6) | c[3];
    if (j < bytes.length) bytes[j++] = (n >> 16) & 255;
    if (j < bytes.length) bytes[j++] = (n >> 8) & 255;
    if (j < bytes.length) bytes[j++] = n & 255;
  }
  if (bytes.length % 8 !== 0) throw new RangeError('frames: byte count is not a multiple of 8');
  return float64FromBytes(bytes);
}

/** Little-endian Float64 bytes (e.g. a BLOB read from SQLite) → values. */
export function float64FromBytes(bytes: Uint8Array): Float64Array {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const out = new Float64Array(bytes.byteLength / 8);
  for (let i = 0; i < out.length; i++) out[i] = view.getFloat64(8 * i, true);
  return out;
}

/** Values → little-endian Float64 bytes (for a BLOB). */
export function bytesFromFloat64(values: ArrayLike<number>): Uint8Array {
  return bytesOf(Float64Array.from(values));
}
