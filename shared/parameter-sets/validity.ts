/**
 * Validity limits are rounded where they are made (the data span the server proposes, the draft form's
 * default, every value stored): 0.01 K and 0.001 MPa are finer than any measured state point needs, and
 * a limit such as 243.15 K must not come out as 243.14999999999998 after a °C → K conversion.
 */
export const VALIDITY_TEMPERATURE_STEP_K = 0.01;
export const VALIDITY_PRESSURE_STEP_MPA = 0.001;

/** Rounds to a number of decimals without binary artefacts (243.14999999999998 → 243.15). */
function roundTo(value: number, decimals: number): number {
  return Number(value.toFixed(decimals));
}

export function roundValidityTemperatureK(value: number): number {
  return roundTo(value, 2);
}

export function roundValidityPressureMPa(value: number): number {
  return roundTo(value, 3);
}

/** A lower limit rounded down and an upper limit rounded up, so the rounded range still holds every point. */
export function roundValidity<
  V extends { temperatureMinK: number; temperatureMaxK: number; pressureMinMPa?: number | null; pressureMaxMPa?: number | null },
>(v: V): V {
  const down = (x: number, d: number) => Math.floor(roundTo(x * 10 ** d, 6)) / 10 ** d;
  const up = (x: number, d: number) => Math.ceil(roundTo(x * 10 ** d, 6)) / 10 ** d;
  return {
    ...v,
    temperatureMinK: roundTo(down(v.temperatureMinK, 2), 2),
    temperatureMaxK: roundTo(up(v.temperatureMaxK, 2), 2),
    ...(v.pressureMinMPa != null ? { pressureMinMPa: roundTo(down(v.pressureMinMPa, 3), 3) } : {}),
    ...(v.pressureMaxMPa != null ? { pressureMaxMPa: roundTo(up(v.pressureMaxMPa, 3), 3) } : {}),
  };
}
