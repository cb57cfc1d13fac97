/**
 * Unit handling for measurement columns: spelling normalisation, dimension checks and conversion
 * to the canonical unit of a quantity, through mathjs units.
 * A private mathjs instance is used so the units defined here (poise) do not leak into other code.
 */
import { create, unitDependencies, createUnitDependencies, type Unit } from 'mathjs';
import { QUANTITIES, isQuantityKey, type Dimension, type QuantityKey } from './property-kinds';

const math = create({ unitDependencies, createUnitDependencies });

// mathjs 15 has no poise. 1 P = 0.1 Pa·s exactly (NIST SP 811, 2008, Appendix B.8, "poise (P)").
// Short prefixes give cP and µP (written uP after normalisation); long ones centipoise, micropoise.
math.createUnit('P', { definition: '0.1 Pa s', prefixes: 'short' });
math.createUnit('poise', { definition: '0.1 Pa s', prefixes: 'long' });

/** A mathjs unit with the dimension of each Dimension, to compare bases against. */
const DIMENSION_REFERENCE: Record<Dimension, string> = {
  temperature: 'K',
  pressure: 'Pa',
  molarVolume: 'm^3/mol',
  molarVolumeSquared: 'm^6/mol^2',
  massDensity: 'kg/m^3',
  amountDensity: 'mol/m^3',
  dynamicViscosity: 'Pa s',
};

const DIMENSION_LABEL: Record<Dimension, { name: string; examples: string }> = {
  temperature: { name: 'temperature', examples: 'K, °C' },
  pressure: { name: 'pressure', examples: 'Pa, kPa, MPa, bar, atm' },
  molarVolume: { name: 'molar volume', examples: 'cm³/mol, m³/mol, L/mol' },
  molarVolumeSquared: { name: 'squared molar volume', examples: 'cm⁶/mol², L²/mol², m⁶/mol²' },
  massDensity: { name: 'mass density', examples: 'kg/m³, g/cm³' },
  amountDensity: { name: 'molar density', examples: 'mol/L, mol/m³' },
  dynamicViscosity: { name: 'dynamic viscosity', examples: 'Pa·s, mPa·s, µPa·s, cP, µP' },
};

export type UnitErrorCode = 'missing-unit' | 'unknown-unit' | 'wrong-dimension' | 'missing-molar-mass' | 'invalid-molar-mass';

/** Thrown by the conversion functions; `code` matches the Problem codes of the parser. */
export class UnitConversionError extends Error {
  constructor(
    readonly code: UnitErrorCode,
    message: string,
  ) {
    super(message);
    this.name = 'UnitConversionError';
  }
}

/**
 * Rewrites the unit spellings found in spreadsheets into mathjs syntax:
 * µ/μ → u, °C/℃/deg C/Celsius → degC, '·', '*', '.' between symbols → space,
 * superscripts and bare exponents (cm3, m-3, m³) → cm^3, m^-3, "Pas" → "Pa s".
 */
export function normaliseUnitText(unitText: string): string {
  let s = unitText.replace(/º/g, '°'); // ordinal indicator typed for a degree sign
  s = s.normalize('NFKC'); // ³ → 3, ⁻ → -, ℃ → °C, full-width letters → ASCII
  s = s.replace(/[µμ]/g, 'u').replace(/[\u2212\u2013]/g, '-'); // minus sign, en dash (from ⁻ after NFKC)
  s = s
    .replace(/°\s*C\b/g, 'degC')
    .replace(/°\s*F\b/g, 'degF')
    .replace(/°\s*K\b/g, 'K');
  s = s.replace(/\bdeg\.?\s*C\b/gi, 'degC').replace(/\bdeg\.?\s*F\b/gi, 'degF');
  s = s.replace(/\bcelsius\b/gi, 'degC').replace(/\bkelvin\b/gi, 'K');
  s = s.replace(/\b(bar|psi)a\b/g, '$1'); // "bara", "psia": absolute pressure (gauge "barg" stays unknown)
  s = s.replace(/[·⋅•×∙*]/g, ' ');
  s = s.replace(/([A-Za-z])\.(?=[A-Za-z])/g, '$1 ');
  s = s.replace(/\b([a-zA-Z]?)Pas\b/g, '$1Pa s');
  s = s.replace(/([A-Za-z])\s*\^?\s*([-+]?\d+)\b/g, '$1^$2');
  s = s
    .replace(/\s*\/\s*/g, '/')
    .replace(/\s*\^\s*/g, '^')
    .replace(/\s+/g, ' ')
    .trim();
  return s;
}

interface ParsedUnit {
  normalised: string;
  unit: Unit;
  dimension?: Dimension;
}

const parseCache = new Map<string, ParsedUnit | UnitConversionError>();

function dimensionOf(u: Unit): Dimension | undefined {
  for (const [dim, ref] of Object.entries(DIMENSION_REFERENCE) as Array<[Dimension, string]>) {
    if (u.equalBase(math.unit(ref))) return dim;
  }
  return undefined;
}

/** Parses unit text into a mathjs unit; throws UnitConversionError('unknown-unit') on failure. */
export function parseUnit(unitText: string): ParsedUnit {
  const cached = parseCache.get(unitText);
  if (cached instanceof UnitConversionError) throw cached;
  if (cached) return cached;
  const result = parseUnitUncached(unitText);
  if (parseCache.size > 500) parseCache.clear();
  parseCache.set(unitText, result);
  if (result instanceof UnitConversionError) throw result;
  return result;
}

function parseUnitUncached(unitText: string): ParsedUnit | UnitConversionError {
  const normalised = normaliseUnitText(unitText);
  if (normalised === '') return new UnitConversionError('missing-unit', 'No unit given.');
  let u: Unit;
  try {
    u = math.unit(normalised);
  } catch {
    return new UnitConversionError('unknown-unit', `Unknown unit "${unitText}".`);
  }
  // unit("5 K") parses a value too: a unit text must be a unit only.
  if (u.value !== null && u.value !== undefined) {
    return new UnitConversionError('unknown-unit', `Unknown unit "${unitText}": a unit must not contain a number.`);
  }
  return { normalised, unit: u, dimension: dimensionOf(u) };
}

export interface ConvertOptions {
  /** Molar mass of the substance in g/mol, needed to turn molar density (mol/L, mol/m³) into kg/m³. */
  molarMassGPerMol?: number;
  /**
   * Convert a difference (an uncertainty): offset units lose their offset, so 0.1 °C → 0.1 K.
   * Defaults to the quantity's isUncertainty flag.
   */
  difference?: boolean;
}

/** Human list of accepted units for a quantity, for messages. */
export function acceptedUnitsText(quantity: QuantityKey): string {
  return QUANTITIES[quantity].dimensions.map((d) => `a ${DIMENSION_LABEL[d].name} unit (${DIMENSION_LABEL[d].examples})`).join(' or ');
}

/**
 * Checks that a unit suits a quantity and returns a converter from a number in that unit to the
 * quantity's canonical unit. Throws UnitConversionError with a message for a person.
 */
export function makeConverter(unitText: string, quantity: QuantityKey, opts: ConvertOptions = {}): (value: number) => number {
  const def = QUANTITIES[quantity];
  let parsed: ParsedUnit;
  try {
    parsed = parseUnit(unitText);
  } catch (e) {
    if (e instanceof UnitConversionError && e.code === 'missing-unit') {
      throw new UnitConversionError(
        'missing-unit',
        `No unit given for ${def.label}; expected ${acceptedUnitsText(quantity)} in parentheses, e.g. "${def.exampleHeader}".`,
      );
    }
    if (e instanceof UnitConversionError) {
      throw new UnitConversionError(e.code, `${e.message} Expected ${acceptedUnitsText(quantity)} for ${def.label}.`);
    }
    throw e;
  }
  const dim = parsed.dimension;
  if (!dim || !def.dimensions.includes(dim)) {
    const got = dim ? `a ${DIMENSION_LABEL[dim].name} unit` : 'a unit of another dimension';
    // "C" and "F" parse as coulomb and farad; people mean degrees.
    const hint = quantity === 'temperature' && /^[CF]$/.test(unitText.trim()) ? ` For degrees Celsius write °C or degC.` : '';
    throw new UnitConversionError(
      'wrong-dimension',
      `Unit "${unitText}" is ${got}, but ${def.label} needs ${acceptedUnitsText(quantity)}.${hint}`,
    );
  }
  const difference = opts.difference ?? def.isUncertainty;
  const normalised = parsed.normalised;
  const canonical = def.canonicalUnit;

  if (dim === 'amountDensity') {
    const m = opts.molarMassGPerMol;
    if (m === undefined || m === null) {
      throw new UnitConversionError(
        'missing-molar-mass',
        `Unit "${unitText}" is a molar density; converting it to kg/m³ needs the substance's molar mass (g/mol), which was not given.`,
      );
    }
    if (!Number.isFinite(m) || m <= 0) {
      throw new UnitConversionError('invalid-molar-mass', `Molar mass must be a positive number of g/mol, got ${m}.`);
    }
    const molarMass = math.unit(m, 'g/mol');
    const factor = (math.unit(1, normalised).multiply(molarMass) as Unit).toNumber(canonical);
    return (value: number) => value * factor;
  }
  const absolute = (value: number) => math.unit(value, normalised).toNumber(canonical);
  const zero = absolute(0);
  // Linear units: one factor per column (a mathjs call per cell costs ~30 µs; 5000 rows matter in
  // the browser preview). Affine units (°C) map 0 to their offset and go through mathjs; a
  // difference keeps only their scale.
  if (zero === 0) {
    const factor = absolute(1);
    return (value: number) => value * factor;
  }
  return difference ? (value: number) => absolute(value) - zero : absolute;
}

/**
 * Converts one value written in `unitText` to the canonical unit of `quantity`
 * (temperature → K, pressure → MPa, b2/uB2 → cm³/mol, density/uDensity → kg/m³,
 * viscosity/uViscosity → µPa·s). Throws UnitConversionError with a clear message on an unknown
 * unit, a unit of the wrong dimension, or a molar density without `molarMassGPerMol`.
 */
export function convertToCanonical(value: number, unitText: string, quantity: string, opts: ConvertOptions = {}): number {
  if (!isQuantityKey(quantity)) {
    throw new UnitConversionError('unknown-unit', `Unknown quantity "${quantity}"; expected one of ${Object.keys(QUANTITIES).join(', ')}.`);
  }
  return makeConverter(unitText, quantity, opts)(value);
}
