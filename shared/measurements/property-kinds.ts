/**
 * Property kinds accepted by the measurement upload, described as data.
 * Parsing, unit handling, validation and the fit read these definitions instead of
 * branching on the kind, so a new kind is one more entry here.
 */

export type PropertyKind =
  'b2' | 'density' | 'viscosity' | 'b3' | 'saturatedLiquidDensity' | 'saturatedVapourDensity' | 'vapourPressure' | 'b12';

export const PROPERTY_KIND_IDS: readonly PropertyKind[] = [
  'b2',
  'density',
  'viscosity',
  'b3',
  'saturatedLiquidDensity',
  'saturatedVapourDensity',
  'vapourPressure',
  'b12',
];

/** Physical dimension of a column, checked on the unit written in its header. */
export type Dimension =
  'temperature' | 'pressure' | 'molarVolume' | 'molarVolumeSquared' | 'massDensity' | 'amountDensity' | 'dynamicViscosity';

/** Keys of the quantities a column can hold (used by the column mapping). */
export type QuantityKey =
  | 'temperature'
  | 'pressure'
  | 'b2'
  | 'uB2'
  | 'density'
  | 'uDensity'
  | 'viscosity'
  | 'uViscosity'
  | 'b3'
  | 'uB3'
  | 'liquidDensity'
  | 'uLiquidDensity'
  | 'vapourDensity'
  | 'uVapourDensity'
  | 'vapourPressure'
  | 'uVapourPressure'
  | 'b12'
  | 'uB12';

/** Canonical row field names, exactly as the API uses them. */
export type CanonicalField =
  | 'temperatureK'
  | 'pressureMPa'
  | 'b2Cm3PerMol'
  | 'uB2Cm3PerMol'
  | 'densityKgPerM3'
  | 'uDensityKgPerM3'
  | 'viscosityMicroPaS'
  | 'uViscosityMicroPaS'
  | 'b3Cm6PerMol2'
  | 'uB3Cm6PerMol2'
  | 'liquidDensityKgPerM3'
  | 'uLiquidDensityKgPerM3'
  | 'vapourDensityKgPerM3'
  | 'uVapourDensityKgPerM3'
  | 'vapourPressureMPa'
  | 'uVapourPressureMPa'
  | 'b12Cm3PerMol'
  | 'uB12Cm3PerMol';

export interface QuantityDefinition {
  key: QuantityKey;
  /** Canonical field in a parsed row. */
  field: CanonicalField;
  /** Human label for messages and the mapping screen. */
  label: string;
  /** Symbol as printed in tables and messages. */
  symbol: string;
  /** Canonical unit in mathjs syntax (what the stored value is expressed in). */
  canonicalUnit: string;
  /** Canonical unit as shown to a person. */
  canonicalUnitLabel: string;
  /** Header names that mean this quantity, compared case-insensitively without spaces, '_' or '-'. */
  aliases: readonly string[];
  /** Dimensions accepted in the header; the first is the canonical one. */
  dimensions: readonly Dimension[];
  /** 'positive': value must be > 0 after conversion; 'any': may be zero or negative (B2). */
  positivity: 'positive' | 'any';
  /** Problem code used when a 'positive' quantity is ≤ 0. */
  nonPositiveCode?: string;
  /** Uncertainties are differences: an offset unit (°C) converts without its offset. */
  isUncertainty: boolean;
  /** An example header for messages. */
  exampleHeader: string;
}

const q = (d: QuantityDefinition) => d;

/** Every quantity known to the upload, by key. Temperature and pressure are shared by kinds. */
export const QUANTITIES: Record<QuantityKey, QuantityDefinition> = {
  temperature: q({
    key: 'temperature',
    symbol: 'T',
    field: 'temperatureK',
    label: 'temperature',
    canonicalUnit: 'K',
    canonicalUnitLabel: 'K',
    aliases: ['t', 'temp', 'temperature'],
    dimensions: ['temperature'],
    positivity: 'positive',
    nonPositiveCode: 'nonpositive-temperature',
    isUncertainty: false,
    exampleHeader: 'T (K)',
  }),
  pressure: q({
    key: 'pressure',
    symbol: 'P',
    field: 'pressureMPa',
    label: 'pressure',
    canonicalUnit: 'MPa',
    canonicalUnitLabel: 'MPa',
    aliases: ['p', 'pressure', 'press'],
    dimensions: ['pressure'],
    positivity: 'positive',
    nonPositiveCode: 'nonpositive-pressure',
    isUncertainty: false,
    exampleHeader: 'P (MPa)',
  }),
  b2: q({
    key: 'b2',
    symbol: 'B2',
    field: 'b2Cm3PerMol',
    label: 'second virial coefficient B2',
    canonicalUnit: 'cm^3/mol',
    canonicalUnitLabel: 'cm³/mol',
    aliases: ['b2', 'b', 'b(t)', 'b2(t)', 'b₂', 'secondvirialcoefficient', 'virialcoefficient', 'secondvirial'],
    dimensions: ['molarVolume'],
    positivity: 'any',
    isUncertainty: false,
    exampleHeader: 'B2 (cm3/mol)',
  }),
  uB2: q({
    key: 'uB2',
    symbol: 'u(B2)',
    field: 'uB2Cm3PerMol',
    label: 'uncertainty of B2',
    canonicalUnit: 'cm^3/mol',
    canonicalUnitLabel: 'cm³/mol',
    aliases: ['u(b2)', 'u(b)', 'u(b₂)', 'ub2', 'ub', 'δb2', 'δb', 'uncertaintyb2', 'b2uncertainty', 'u(b2)(t)'],
    dimensions: ['molarVolume'],
    positivity: 'positive',
    nonPositiveCode: 'nonpositive-uncertainty',
    isUncertainty: true,
    exampleHeader: 'u(B2) (cm3/mol)',
  }),
  density: q({
    key: 'density',
    symbol: 'ρ',
    field: 'densityKgPerM3',
    label: 'density',
    canonicalUnit: 'kg/m^3',
    canonicalUnitLabel: 'kg/m³',
    aliases: ['rho', 'ρ', 'density', 'dens', 'massdensity', 'molardensity'],
    dimensions: ['massDensity', 'amountDensity'],
    positivity: 'positive',
    nonPositiveCode: 'nonpositive-density',
    isUncertainty: false,
    exampleHeader: 'rho (kg/m3)',
  }),
  uDensity: q({
    key: 'uDensity',
    symbol: 'u(ρ)',
    field: 'uDensityKgPerM3',
    label: 'uncertainty of density',
    canonicalUnit: 'kg/m^3',
    canonicalUnitLabel: 'kg/m³',
    aliases: ['u(rho)', 'u(ρ)', 'u(density)', 'urho', 'uρ', 'δrho', 'δρ', 'uncertaintyrho', 'uncertaintydensity', 'densityuncertainty'],
    dimensions: ['massDensity', 'amountDensity'],
    positivity: 'positive',
    nonPositiveCode: 'nonpositive-uncertainty',
    isUncertainty: true,
    exampleHeader: 'u(rho) (kg/m3)',
  }),
  viscosity: q({
    key: 'viscosity',
    symbol: 'η',
    field: 'viscosityMicroPaS',
    label: 'viscosity',
    canonicalUnit: 'uPa s',
    canonicalUnitLabel: 'µPa·s',
    aliases: ['eta', 'η', 'viscosity', 'visc', 'shearviscosity', 'dynamicviscosity'],
    dimensions: ['dynamicViscosity'],
    positivity: 'positive',
    nonPositiveCode: 'nonpositive-viscosity',
    isUncertainty: false,
    exampleHeader: 'eta (uPa s)',
  }),
  uViscosity: q({
    key: 'uViscosity',
    symbol: 'u(η)',
    field: 'uViscosityMicroPaS',
    label: 'uncertainty of viscosity',
    canonicalUnit: 'uPa s',
    canonicalUnitLabel: 'µPa·s',
    aliases: [
      'u(eta)',
      'u(η)',
      'u(viscosity)',
      'ueta',
      'uη',
      'δeta',
      'δη',
      'uncertaintyeta',
      'uncertaintyviscosity',
      'viscosityuncertainty',
    ],
    dimensions: ['dynamicViscosity'],
    positivity: 'positive',
    nonPositiveCode: 'nonpositive-uncertainty',
    isUncertainty: true,
    exampleHeader: 'u(eta) (uPa s)',
  }),
  b3: q({
    key: 'b3',
    symbol: 'B3',
    field: 'b3Cm6PerMol2',
    label: 'third virial coefficient B3',
    canonicalUnit: 'cm^6/mol^2',
    canonicalUnitLabel: 'cm⁶/mol²',
    aliases: ['b3', 'b₃', 'b3(t)', 'thirdvirialcoefficient', 'thirdvirial'],
    dimensions: ['molarVolumeSquared'],
    positivity: 'any',
    isUncertainty: false,
    exampleHeader: 'B3 (cm6/mol2)',
  }),
  uB3: q({
    key: 'uB3',
    symbol: 'u(B3)',
    field: 'uB3Cm6PerMol2',
    label: 'uncertainty of B3',
    canonicalUnit: 'cm^6/mol^2',
    canonicalUnitLabel: 'cm⁶/mol²',
    aliases: ['u(b3)', 'u(b₃)', 'ub3', 'δb3', 'uncertaintyb3', 'b3uncertainty'],
    dimensions: ['molarVolumeSquared'],
    positivity: 'positive',
    nonPositiveCode: 'nonpositive-uncertainty',
    isUncertainty: true,
    exampleHeader: 'u(B3) (cm6/mol2)',
  }),
  liquidDensity: q({
    key: 'liquidDensity',
    symbol: 'ρ_liq',
    field: 'liquidDensityKgPerM3',
    label: 'saturated liquid density',
    canonicalUnit: 'kg/m^3',
    canonicalUnitLabel: 'kg/m³',
    aliases: ['rholiq', 'ρliq', 'rhol', 'ρl', 'rholiquid', 'ρliquid', "ρ'", 'ρ′', 'liquiddensity', 'saturatedliquiddensity', 'rhosatliq'],
    dimensions: ['massDensity', 'amountDensity'],
    positivity: 'positive',
    nonPositiveCode: 'nonpositive-density',
    isUncertainty: false,
    exampleHeader: 'rho_liq (kg/m3)',
  }),
  uLiquidDensity: q({
    key: 'uLiquidDensity',
    symbol: 'u(ρ_liq)',
    field: 'uLiquidDensityKgPerM3',
    label: 'uncertainty of saturated liquid density',
    canonicalUnit: 'kg/m^3',
    canonicalUnitLabel: 'kg/m³',
    aliases: ['u(rholiq)', 'u(ρliq)', 'u(rhol)', 'u(ρl)', 'urholiq', 'δrholiq', 'u(liquiddensity)'],
    dimensions: ['massDensity', 'amountDensity'],
    positivity: 'positive',
    nonPositiveCode: 'nonpositive-uncertainty',
    isUncertainty: true,
    exampleHeader: 'u(rho_liq) (kg/m3)',
  }),
  vapourDensity: q({
    key: 'vapourDensity',
    symbol: 'ρ_vap',
    field: 'vapourDensityKgPerM3',
    label: 'saturated vapour density',
    canonicalUnit: 'kg/m^3',
    canonicalUnitLabel: 'kg/m³',
    aliases: [
      'rhovap',
      'ρvap',
      'rhov',
      'ρv',
      'rhovapour',
      'rhovapor',
      "ρ''",
      'ρ″',
      'vapourdensity',
      'vapordensity',
      'saturatedvapourdensity',
      'saturatedvapordensity',
    ],
    dimensions: ['massDensity', 'amountDensity'],
    positivity: 'positive',
    nonPositiveCode: 'nonpositive-density',
    isUncertainty: false,
    exampleHeader: 'rho_vap (kg/m3)',
  }),
  uVapourDensity: q({
    key: 'uVapourDensity',
    symbol: 'u(ρ_vap)',
    field: 'uVapourDensityKgPerM3',
    label: 'uncertainty of saturated vapour density',
    canonicalUnit: 'kg/m^3',
    canonicalUnitLabel: 'kg/m³',
    aliases: ['u(rhovap)', 'u(ρvap)', 'u(rhov)', 'u(ρv)', 'urhovap', 'δrhovap', 'u(vapourdensity)', 'u(vapordensity)'],
    dimensions: ['massDensity', 'amountDensity'],
    positivity: 'positive',
    nonPositiveCode: 'nonpositive-uncertainty',
    isUncertainty: true,
    exampleHeader: 'u(rho_vap) (kg/m3)',
  }),
  vapourPressure: q({
    key: 'vapourPressure',
    symbol: 'p_sat',
    field: 'vapourPressureMPa',
    label: 'vapour pressure',
    canonicalUnit: 'MPa',
    canonicalUnitLabel: 'MPa',
    aliases: ['psat', 'ps', 'pσ', 'pvap', 'vapourpressure', 'vaporpressure', 'saturationpressure'],
    dimensions: ['pressure'],
    positivity: 'positive',
    nonPositiveCode: 'nonpositive-pressure',
    isUncertainty: false,
    exampleHeader: 'p_sat (kPa)',
  }),
  uVapourPressure: q({
    key: 'uVapourPressure',
    symbol: 'u(p_sat)',
    field: 'uVapourPressureMPa',
    label: 'uncertainty of vapour pressure',
    canonicalUnit: 'MPa',
    canonicalUnitLabel: 'MPa',
    aliases: ['u(psat)', 'u(ps)', 'u(pvap)', 'upsat', 'δpsat', 'u(vapourpressure)', 'u(vaporpressure)'],
    dimensions: ['pressure'],
    positivity: 'positive',
    nonPositiveCode: 'nonpositive-uncertainty',
    isUncertainty: true,
    exampleHeader: 'u(p_sat) (kPa)',
  }),
  b12: q({
    key: 'b12',
    symbol: 'B12',
    field: 'b12Cm3PerMol',
    label: 'cross second virial coefficient B12',
    canonicalUnit: 'cm^3/mol',
    canonicalUnitLabel: 'cm³/mol',
    aliases: ['b12', 'b₁₂', 'b12(t)', 'crossvirialcoefficient', 'crosssecondvirialcoefficient', 'interactionvirialcoefficient'],
    dimensions: ['molarVolume'],
    positivity: 'any',
    isUncertainty: false,
    exampleHeader: 'B12 (cm3/mol)',
  }),
  uB12: q({
    key: 'uB12',
    symbol: 'u(B12)',
    field: 'uB12Cm3PerMol',
    label: 'uncertainty of B12',
    canonicalUnit: 'cm^3/mol',
    canonicalUnitLabel: 'cm³/mol',
    aliases: ['u(b12)', 'u(b₁₂)', 'ub12', 'δb12', 'uncertaintyb12', 'b12uncertainty'],
    dimensions: ['molarVolume'],
    positivity: 'positive',
    nonPositiveCode: 'nonpositive-uncertainty',
    isUncertainty: true,
    exampleHeader: 'u(B12) (cm3/mol)',
  }),
};

export interface KindColumn {
  quantity: QuantityKey;
  required: boolean;
}

export interface PropertyKindDefinition {
  kind: PropertyKind;
  label: string;
  /** Columns of this kind, in the order a template file lists them. */
  columns: readonly KindColumn[];
  /** The measured property (what the fit compares with the model). */
  valueQuantity: QuantityKey;
  valueField: CanonicalField;
  /** Its standard uncertainty (always filled in a parsed row: measured or default). */
  uncertaintyQuantity: QuantityKey;
  uncertaintyField: CanonicalField;
  /** Fields that define a state point; two rows with equal keys are duplicates. */
  stateFields: readonly CanonicalField[];
  /**
   * Floor (in the canonical unit of the value) for the default uncertainty when the value can be
   * zero or negative: u = relative × max(|value|, floor). See defaultUncertainty().
   */
  defaultUncertaintyFloor?: number;
}

/**
 * B2 crosses zero at the Boyle temperature (about 410 K for argon), so a purely relative default
 * uncertainty would vanish there and give those points almost infinite weight in the fit.
 * The floor of 10 cm³/mol keeps u ≥ relative × 10 cm³/mol (0.1 cm³/mol at 1 %), which is about the
 * best absolute uncertainty of careful B2 measurements (common practice, no source).
 */
export const B2_DEFAULT_UNCERTAINTY_FLOOR_CM3_PER_MOL = 10;

/** B3 crosses zero too (near T* ≈ 0.9 for LJ); 1000 cm⁶/mol² is the same kind of floor for it (common practice, no source). */
export const B3_DEFAULT_UNCERTAINTY_FLOOR_CM6_PER_MOL2 = 1000;

export const PROPERTY_KINDS: Record<PropertyKind, PropertyKindDefinition> = {
  b2: {
    kind: 'b2',
    label: 'Second virial coefficient B2(T)',
    columns: [
      { quantity: 'temperature', required: true },
      { quantity: 'b2', required: true },
      { quantity: 'uB2', required: false },
    ],
    valueQuantity: 'b2',
    valueField: 'b2Cm3PerMol',
    uncertaintyQuantity: 'uB2',
    uncertaintyField: 'uB2Cm3PerMol',
    stateFields: ['temperatureK'],
    defaultUncertaintyFloor: B2_DEFAULT_UNCERTAINTY_FLOOR_CM3_PER_MOL,
  },
  density: {
    kind: 'density',
    label: 'Fluid density ρ(T, P)',
    columns: [
      { quantity: 'temperature', required: true },
      { quantity: 'pressure', required: true },
      { quantity: 'density', required: true },
      { quantity: 'uDensity', required: false },
    ],
    valueQuantity: 'density',
    valueField: 'densityKgPerM3',
    uncertaintyQuantity: 'uDensity',
    uncertaintyField: 'uDensityKgPerM3',
    stateFields: ['temperatureK', 'pressureMPa'],
  },
  viscosity: {
    kind: 'viscosity',
    label: 'Dilute-gas shear viscosity η(T)',
    columns: [
      { quantity: 'temperature', required: true },
      { quantity: 'viscosity', required: true },
      { quantity: 'uViscosity', required: false },
    ],
    valueQuantity: 'viscosity',
    valueField: 'viscosityMicroPaS',
    uncertaintyQuantity: 'uViscosity',
    uncertaintyField: 'uViscosityMicroPaS',
    stateFields: ['temperatureK'],
  },
  b3: {
    kind: 'b3',
    label: 'Third virial coefficient B3(T)',
    columns: [
      { quantity: 'temperature', required: true },
      { quantity: 'b3', required: true },
      { quantity: 'uB3', required: false },
    ],
    valueQuantity: 'b3',
    valueField: 'b3Cm6PerMol2',
    uncertaintyQuantity: 'uB3',
    uncertaintyField: 'uB3Cm6PerMol2',
    stateFields: ['temperatureK'],
    defaultUncertaintyFloor: B3_DEFAULT_UNCERTAINTY_FLOOR_CM6_PER_MOL2,
  },
  saturatedLiquidDensity: {
    kind: 'saturatedLiquidDensity',
    label: 'Saturated liquid density ρ_liq(T)',
    columns: [
      { quantity: 'temperature', required: true },
      { quantity: 'liquidDensity', required: true },
      { quantity: 'uLiquidDensity', required: false },
    ],
    valueQuantity: 'liquidDensity',
    valueField: 'liquidDensityKgPerM3',
    uncertaintyQuantity: 'uLiquidDensity',
    uncertaintyField: 'uLiquidDensityKgPerM3',
    stateFields: ['temperatureK'],
  },
  saturatedVapourDensity: {
    kind: 'saturatedVapourDensity',
    label: 'Saturated vapour density ρ_vap(T)',
    columns: [
      { quantity: 'temperature', required: true },
      { quantity: 'vapourDensity', required: true },
      { quantity: 'uVapourDensity', required: false },
    ],
    valueQuantity: 'vapourDensity',
    valueField: 'vapourDensityKgPerM3',
    uncertaintyQuantity: 'uVapourDensity',
    uncertaintyField: 'uVapourDensityKgPerM3',
    stateFields: ['temperatureK'],
  },
  vapourPressure: {
    kind: 'vapourPressure',
    label: 'Vapour pressure p_sat(T)',
    columns: [
      { quantity: 'temperature', required: true },
      { quantity: 'vapourPressure', required: true },
      { quantity: 'uVapourPressure', required: false },
    ],
    valueQuantity: 'vapourPressure',
    valueField: 'vapourPressureMPa',
    uncertaintyQuantity: 'uVapourPressure',
    uncertaintyField: 'uVapourPressureMPa',
    stateFields: ['temperatureK'],
  },
  b12: {
    // A mixture property: stored with one of the two substances, fitted by a pair set (shared/mixing/cross-virial.ts),
    // never by the pure-substance fit.
    kind: 'b12',
    label: 'Cross second virial coefficient B12(T) of a pair',
    columns: [
      { quantity: 'temperature', required: true },
      { quantity: 'b12', required: true },
      { quantity: 'uB12', required: false },
    ],
    valueQuantity: 'b12',
    valueField: 'b12Cm3PerMol',
    uncertaintyQuantity: 'uB12',
    uncertaintyField: 'uB12Cm3PerMol',
    stateFields: ['temperatureK'],
    defaultUncertaintyFloor: B2_DEFAULT_UNCERTAINTY_FLOOR_CM3_PER_MOL,
  },
};

/**
 * The unit of a kind's stored `value` and `uncertainty` (measurement_row) and of a fit's `measured`, `predicted`,
 * `uncertainty` and `rms` for that kind: the canonical unit of its measured quantity, e.g. 'cm^3/mol' for B2.
 */
export const valueUnitOf = (kind: PropertyKind): string => QUANTITIES[PROPERTY_KINDS[kind].valueQuantity].canonicalUnit;

export function isPropertyKind(x: unknown): x is PropertyKind {
  return typeof x === 'string' && (PROPERTY_KIND_IDS as readonly string[]).includes(x);
}

export function isQuantityKey(x: unknown): x is QuantityKey {
  return typeof x === 'string' && Object.prototype.hasOwnProperty.call(QUANTITIES, x);
}

/** Quantities that belong to a kind. */
export function kindQuantities(kind: PropertyKind): QuantityKey[] {
  return PROPERTY_KINDS[kind].columns.map((c) => c.quantity);
}

/** Default relative uncertainty when the caller gives none (1 %). */
export const DEFAULT_RELATIVE_UNCERTAINTY = 0.01;

/**
 * Default absolute uncertainty of a value without a measured one:
 * relative × |value|, or relative × max(|value|, floor) for kinds whose value can be ≤ 0 (B2).
 */
export function defaultUncertainty(kind: PropertyKind, value: number, relative: number): number {
  const floor = PROPERTY_KINDS[kind].defaultUncertaintyFloor ?? 0;
  return relative * Math.max(Math.abs(value), floor);
}

/** Rows in canonical units, one interface per kind. `row` follows the convention of Problem.row. */
interface RowCommon {
  /** Line number in the file (1-based, as a spreadsheet shows it). */
  row: number;
  uncertaintySource: 'measured' | 'default-relative';
  /** Original cell text per canonical field, as written in the file. */
  raw: Partial<Record<CanonicalField, string>>;
}

export interface B2Row extends RowCommon {
  kind: 'b2';
  temperatureK: number;
  b2Cm3PerMol: number;
  uB2Cm3PerMol: number;
}

export interface DensityRow extends RowCommon {
  kind: 'density';
  temperatureK: number;
  pressureMPa: number;
  densityKgPerM3: number;
  uDensityKgPerM3: number;
}

export interface ViscosityRow extends RowCommon {
  kind: 'viscosity';
  temperatureK: number;
  viscosityMicroPaS: number;
  uViscosityMicroPaS: number;
}

export interface B3Row extends RowCommon {
  kind: 'b3';
  temperatureK: number;
  b3Cm6PerMol2: number;
  uB3Cm6PerMol2: number;
}

export interface SaturatedLiquidDensityRow extends RowCommon {
  kind: 'saturatedLiquidDensity';
  temperatureK: number;
  liquidDensityKgPerM3: number;
  uLiquidDensityKgPerM3: number;
}

export interface SaturatedVapourDensityRow extends RowCommon {
  kind: 'saturatedVapourDensity';
  temperatureK: number;
  vapourDensityKgPerM3: number;
  uVapourDensityKgPerM3: number;
}

export interface VapourPressureRow extends RowCommon {
  kind: 'vapourPressure';
  temperatureK: number;
  vapourPressureMPa: number;
  uVapourPressureMPa: number;
}

export interface B12Row extends RowCommon {
  kind: 'b12';
  temperatureK: number;
  b12Cm3PerMol: number;
  uB12Cm3PerMol: number;
}

export type CanonicalRow =
  B2Row | DensityRow | ViscosityRow | B3Row | SaturatedLiquidDensityRow | SaturatedVapourDensityRow | VapourPressureRow | B12Row;

/** Value and standard uncertainty of any row, read through the kind registry. */
export function rowValueAndUncertainty(row: CanonicalRow): { value: number; uncertainty: number } {
  const def = PROPERTY_KINDS[row.kind];
  const r = row as unknown as Record<string, number>;
  return { value: r[def.valueField], uncertainty: r[def.uncertaintyField] };
}
