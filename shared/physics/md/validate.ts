/** Entry validation shared by the MD drivers: each failure is a RangeError that names the parameter. */
export function requireNumber(name: string, value: unknown, min: number, max: number): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new RangeError(`${name} must be a finite number, got ${String(value)}`);
  }
  if (value < min || value > max) throw new RangeError(`${name} must be between ${min} and ${max}, got ${value}`);
  return value;
}

export function requireInteger(name: string, value: unknown, min: number, max: number): number {
  const v = requireNumber(name, value, min, max);
  if (!Number.isInteger(v)) throw new RangeError(`${name} must be an integer, got ${v}`);
  return v;
}
