/**
 * Writing numbers for people. An uncertainty is rounded to two significant digits and the value to the
 * same decimal place (JCGM 100:2008, GUM §7.2.6: "at most two significant digits" for the uncertainty).
 */
export function formatWithUncertainty(value: number, uncertainty: number | undefined | null, unit = ''): string {
  const suffix = unit ? ` ${unit}` : '';
  if (!Number.isFinite(value)) return `—${suffix}`;
  if (uncertainty == null || !Number.isFinite(uncertainty) || uncertainty <= 0) return `${formatSignificant(value, 5)}${suffix}`;
  const exponent = Math.floor(Math.log10(uncertainty));
  const decimals = Math.max(0, -(exponent - 1));
  if (decimals > 12 || Math.abs(value) >= 1e7 || (Math.abs(value) < 1e-4 && value !== 0)) {
    return `${value.toExponential(3)} ± ${uncertainty.toExponential(1)}${suffix}`;
  }
  return `${value.toFixed(decimals)} ± ${uncertainty.toFixed(decimals)}${suffix}`;
}

/** A number with `digits` significant digits, without exponent notation in the everyday range. */
export function formatSignificant(value: number, digits = 4): string {
  if (!Number.isFinite(value)) return '—';
  if (value === 0) return '0';
  const abs = Math.abs(value);
  if (abs >= 1e7 || abs < 1e-4) return value.toExponential(digits - 1);
  const decimals = Math.max(0, digits - 1 - Math.floor(Math.log10(abs)));
  return value.toFixed(Math.min(decimals, 12));
}

/** A stored measurement as written: up to `digits` significant digits, trailing zeros dropped. */
export function formatMeasured(value: number, digits = 8): string {
  if (!Number.isFinite(value)) return '—';
  return String(Number(value.toPrecision(digits)));
}
