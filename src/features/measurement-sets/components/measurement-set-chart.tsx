import { QUANTITIES, PROPERTY_KINDS, type PropertyKind, type QuantityKey } from '@shared/measurements/property-kinds';
import { PropertyChart, type ChartSeries } from '@/components/charts/property-chart';

export interface PlotRow {
  temperatureK: number;
  pressureMPa?: number;
  value: number;
  uncertainty: number;
}

/** Column heading of a quantity in canonical units, e.g. "u(B2) (cm³/mol)". */
export function quantityHeading(quantity: QuantityKey): string {
  const q = QUANTITIES[quantity];
  return `${q.exampleHeader.replace(/\s*[([].*$/, '')} (${q.canonicalUnitLabel})`;
}

const AXIS_SYMBOLS: Partial<Record<PropertyKind, string>> = { b2: 'B2', b3: 'B3', b12: 'B12', density: 'ρ', viscosity: 'η', saturatedLiquidDensity: 'ρ_liq', saturatedVapourDensity: 'ρ_vap', vapourPressure: 'p_sat' };

/** Axis title of a kind's measured value, with its canonical unit. */
export function valueAxisTitle(kind: PropertyKind): string {
  const q = QUANTITIES[PROPERTY_KINDS[kind].valueQuantity];
  const symbol = AXIS_SYMBOLS[kind];
  return symbol ? `${symbol} (${q.canonicalUnitLabel})` : quantityHeading(PROPERTY_KINDS[kind].valueQuantity);
}

/** Measured points against temperature with ±u error bars; densities are grouped by pressure. */
export function MeasurementSetChart({ kind, rows, height }: { kind: PropertyKind; rows: PlotRow[]; height?: number }) {
  let series: ChartSeries[];
  if (kind === 'density') {
    const byPressure = new Map<number, PlotRow[]>();
    for (const r of rows) {
      const p = Number((r.pressureMPa ?? 0).toPrecision(4));
      byPressure.set(p, [...(byPressure.get(p) ?? []), r]);
    }
    series = [...byPressure.entries()]
      .sort((a, b) => a[0] - b[0])
      .slice(0, 8)
      .map(([p, list]) => ({ label: `measured, ${p} MPa`, kind: 'measured' as const, points: list.map((r) => ({ x: r.temperatureK, y: r.value, u: r.uncertainty })) }));
  } else {
    series = [{ label: 'measured', kind: 'measured', points: rows.map((r) => ({ x: r.temperatureK, y: r.value, u: r.uncertainty })) }];
  }
  return <PropertyChart series={series} xTitle="T (K)" yTitle={valueAxisTitle(kind)} height={height} ariaLabel={`${PROPERTY_KINDS[kind].label} measurements`} />;
}
