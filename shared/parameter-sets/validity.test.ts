import { describe, expect, it } from 'vitest';
import { roundValidity, roundValidityPressureMPa, roundValidityTemperatureK } from './validity';

describe('validity limits rounded where they are made', () => {
  it('removes binary artefacts of the °C → K conversion (273.15 K offset, ITS-90; common practice, no source)', () => {
    // −30 °C and −66 °C come out of floating-point addition as 243.14999999999998 K and 207.14999999999998 K.
    expect(-30 + 273.15).not.toBe(243.15);
    expect(roundValidityTemperatureK(-30 + 273.15)).toBe(243.15);
    expect(roundValidityTemperatureK(-66 + 273.15)).toBe(207.15);
    expect(roundValidityPressureMPa(0.1 + 0.2)).toBe(0.3);
  });

  it('rounds outward so the range still holds every point, and leaves clean values alone', () => {
    expect(roundValidity({ temperatureMinK: 243.156, temperatureMaxK: 300.001 })).toEqual({
      temperatureMinK: 243.15,
      temperatureMaxK: 300.01,
    });
    expect(
      roundValidity({
        temperatureMinK: -30 + 273.15,
        temperatureMaxK: 500 + 273.15,
        pressureMinMPa: 0.1000000001,
        pressureMaxMPa: 2.00049,
      }),
    ).toEqual({
      temperatureMinK: 243.15,
      temperatureMaxK: 773.15,
      pressureMinMPa: 0.1,
      pressureMaxMPa: 2.001,
    });
    expect(roundValidity({ temperatureMinK: 90, temperatureMaxK: 300, pressureMinMPa: null, pressureMaxMPa: null })).toEqual({
      temperatureMinK: 90,
      temperatureMaxK: 300,
      pressureMinMPa: null,
      pressureMaxMPa: null,
    });
  });
});
