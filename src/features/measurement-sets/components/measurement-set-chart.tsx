import { PROPERTY_KINDS, type PropertyKind } from '@shared/measurements/property-kinds';
import { PropertyChart, type ChartSeries } from '@/components/charts/property-chart';
import { valueAxisTitle } from '@/lib/quantity-labels';

export interface PlotRow {
  temperatureK: number;
  pressureMPa?: number;
  value: number;
  uncertainty: number;
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
      .map(([p, list]) => ({
        label: `measured, ${p} MPa`,
        kind: 'measured' as const,
        points: list.map((r) => ({ x: r.temperatureK, y: r.value, u: r.uncertainty })),
      }));
  } else {
    series = [{ label: 'measured', kind: 'measured', points: rows.map((r) => ({ x: r.temperatureK, y: r.value, u: r.uncertainty })) }];
  }
  return (
    <PropertyChart
      series={series}
      xTitle="T (K)"
      yTitle={valueAxisTitle(kind)}
      height={height}
      ariaLabel={`${PROPERTY_KINDS[kind].label} measurements`}
    />
  );
}
