import { QUANTITIES, PROPERTY_KINDS, type PropertyKind, type QuantityKey } from '@shared/measurements/property-kinds';

/** Column heading of a quantity in canonical units, e.g. "u(B2) (cm³/mol)". */
export function quantityHeading(quantity: QuantityKey): string {
  const q = QUANTITIES[quantity];
  return `${q.exampleHeader.replace(/\s*[([].*$/, '')} (${q.canonicalUnitLabel})`;
}

const AXIS_SYMBOLS: Partial<Record<PropertyKind, string>> = {
  b2: 'B2',
  b3: 'B3',
  b12: 'B12',
  density: 'ρ',
  viscosity: 'η',
  saturatedLiquidDensity: 'ρ_liq',
  saturatedVapourDensity: 'ρ_vap',
  vapourPressure: 'p_sat',
};

/** Axis title of a kind's measured value, with its canonical unit (measurement-set charts and fit curves alike). */
export function valueAxisTitle(kind: PropertyKind): string {
  const q = QUANTITIES[PROPERTY_KINDS[kind].valueQuantity];
  const symbol = AXIS_SYMBOLS[kind];
  return symbol ? `${symbol} (${q.canonicalUnitLabel})` : quantityHeading(PROPERTY_KINDS[kind].valueQuantity);
}
