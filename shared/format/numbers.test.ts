import { describe, expect, it } from 'vitest';
import { formatMeasured, formatSignificant, formatWithUncertainty } from './numbers';

// Rounding of a result with its standard uncertainty: JCGM 100:2008 (GUM) §7.2.6 — the uncertainty to at
// most two significant digits, the value to the same decimal place. Examples are our own.
describe('formatWithUncertainty', () => {
  it('rounds the uncertainty to two significant digits and the value to match', () => {
    expect(formatWithUncertainty(119.6123, 0.4321, 'K')).toBe('119.61 ± 0.43 K');
    expect(formatWithUncertainty(3.40512, 0.0123, 'Å')).toBe('3.405 ± 0.012 Å');
    expect(formatWithUncertainty(-152.34, 12.6, 'cm³/mol')).toBe('-152 ± 13 cm³/mol');
  });
  it('falls back to significant digits without an uncertainty', () => {
    expect(formatWithUncertainty(119.61234, undefined, 'K')).toBe('119.61 K');
    expect(formatSignificant(0.000123456, 3)).toBe('0.000123');
    expect(formatSignificant(0.0000123456, 3)).toBe('1.23e-5');
    expect(formatSignificant(22.6149, 4)).toBe('22.61');
  });
});

describe('formatMeasured', () => {
  it('drops conversion round-off and trailing zeros (common practice, no source)', () => {
    expect(formatMeasured(298.15000000000003)).toBe('298.15');
    expect(formatMeasured(0.02)).toBe('0.02');
    expect(formatMeasured(1)).toBe('1');
  });
});
