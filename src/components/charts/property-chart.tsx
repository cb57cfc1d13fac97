import { Scatter } from 'react-chartjs-2';
import type { ChartData, ChartOptions } from 'chart.js';
import { CHART_COLORS, type WithEndLabel, type WithErrorBars } from './chart-setup';

export interface SeriesPoint {
  x: number;
  y: number;
  u?: number;
  /** Drawn as an open marker: a point left out of the fit. */
  hollow?: boolean;
  /** A band's lower edge at x (its upper edge is y). */
  lower?: number;
}

export interface ChartSeries {
  label: string;
  /** 'band': a shaded region from each point's `lower` to its y (e.g. a posterior-predictive 95 % band). */
  kind: 'measured' | 'model' | 'simulated' | 'band';
  points: SeriesPoint[];
  /** Leave out of the legend (e.g. one model curve per isobar, named at its end instead). */
  inLegend?: boolean;
  /** Text drawn at the right-hand end of a curve. */
  endLabel?: string;
}

const STYLE = {
  measured: { color: CHART_COLORS.ink, pointStyle: 'circle' as const, radius: 3.5 },
  simulated: { color: CHART_COLORS.teal, pointStyle: 'rectRot' as const, radius: 4.5 },
  model: { color: CHART_COLORS.copper, pointStyle: 'circle' as const, radius: 0 },
  band: { color: CHART_COLORS.copper, pointStyle: 'rect' as const, radius: 0 },
};

/** A band is two line datasets, the lower one filled up to the upper one ('-1': the dataset before it). */
type ScatterDataset = ChartData<'scatter'>['datasets'][number];

function toBandDatasets(s: ChartSeries): ScatterDataset[] {
  type Dataset = ScatterDataset & { inLegend: boolean };
  const edge = {
    showLine: true,
    pointRadius: 0,
    pointHoverRadius: 0,
    borderWidth: 0.75,
    borderColor: 'rgba(168,90,42,0.45)',
    backgroundColor: 'rgba(168,90,42,0.16)',
    tension: 0,
    spanGaps: false,
  };
  const upperEdge = s.points.map((p) => ({ x: p.x, y: p.y }));
  const lowerEdge = s.points.map((p) => ({ x: p.x, y: p.lower ?? p.y }));
  const upper: Dataset = { ...edge, label: `${s.label} (upper)`, data: upperEdge, inLegend: false, fill: false };
  const lower: Dataset = { ...edge, label: s.label, data: lowerEdge, pointStyle: 'rect', inLegend: s.inLegend ?? true, fill: '-1' };
  return [upper, lower];
}

/** Several series of one kind (isotherms, isobars) keep their colour and differ by marker shape. */
const SHAPES = ['circle', 'triangle', 'rect', 'rectRot', 'star', 'crossRot', 'rectRounded', 'cross'] as const;

/** Points drawn open (left out of the fit) become a series of their own, so the legend names them. */
function toDatasets(series: ChartSeries[]) {
  const counts: Record<string, number> = {};
  return series.flatMap((s): ScatterDataset[] => {
    if (s.kind === 'band') return toBandDatasets(s);
    const index = (counts[s.kind] = (counts[s.kind] ?? -1) + 1);
    const open = s.points.filter((p) => p.hollow);
    if (!open.length || s.kind === 'model') return [toDataset(s, index)];
    return [
      toDataset({ ...s, points: s.points.filter((p) => !p.hollow) }, index),
      toDataset({ ...s, label: `${s.label}, left out`, points: open }, index),
    ];
  });
}

function toDataset(s: ChartSeries, indexOfKind: number) {
  const base = STYLE[s.kind];
  const style = { ...base, pointStyle: s.kind === 'model' ? base.pointStyle : SHAPES[indexOfKind % SHAPES.length] };
  const line = s.kind === 'model';
  const fill = line ? style.color : `${style.color}cc`;
  const anyHollow = s.points.some((p) => p.hollow);
  return {
    label: s.label,
    data: s.points.map((p) => ({ x: p.x, y: p.y })),
    errorBars: s.points.some((p) => p.u) ? s.points.map((p) => p.u ?? 0) : undefined,
    errorBarColor: style.color,
    showLine: line,
    borderColor: style.color,
    backgroundColor: fill,
    pointBackgroundColor: anyHollow ? s.points.map((p) => (p.hollow ? '#fffdf8' : fill)) : undefined,
    pointBorderWidth: anyHollow ? s.points.map((p) => (p.hollow ? 1.5 : 1)) : undefined,
    borderWidth: line ? 2 : 1,
    borderDash: line && indexOfKind > 0 ? [6, 3 + indexOfKind] : undefined,
    pointRadius: style.radius,
    pointHoverRadius: line ? 0 : style.radius + 2,
    pointStyle: style.pointStyle,
    tension: 0,
    spanGaps: false,
    endLabel: s.endLabel,
    inLegend: s.inLegend ?? true,
  } as ChartData<'scatter'>['datasets'][number] & WithErrorBars & WithEndLabel;
}

export interface PropertyChartProps {
  series: ChartSeries[];
  xTitle: string;
  yTitle: string;
  /** Residuals (e.g. (model − measured)/u) drawn in a small panel underneath sharing the x-axis. */
  residuals?: { title: string; series: ChartSeries[] };
  height?: number;
  ariaLabel: string;
}

/** Measured points with error bars, model curves and optional residual panel; axis titles carry units. */
export function PropertyChart({ series, xTitle, yTitle, residuals, height = 320, ariaLabel }: PropertyChartProps) {
  const axisTitle = { weight: 600 as const, size: 12 };
  const residualTitle = { weight: 600 as const, size: 11 };
  const xs = [...series, ...(residuals?.series ?? [])].flatMap((s) => s.points.map((p) => p.x));
  const xMin = xs.length ? Math.min(...xs) : 0;
  const xMax = xs.length ? Math.max(...xs) : 1;
  const pad = (xMax - xMin || Math.abs(xMax) || 1) * 0.04;
  // Suggested (not hard) limits: the axis still ends on round ticks, and both panels get the same ones.
  const xScale = { type: 'linear' as const, suggestedMin: xMin - pad, suggestedMax: xMax + pad, grid: { color: 'rgba(219,208,187,0.5)' } };
  const options: ChartOptions<'scatter'> = {
    responsive: true,
    maintainAspectRatio: false,
    animation: false,
    plugins: {
      legend: {
        position: 'top',
        align: 'end',
        labels: {
          usePointStyle: true,
          boxWidth: 7,
          boxHeight: 7,
          font: { size: 12 },
          filter: (item, data) => (data.datasets[item.datasetIndex!] as { inLegend?: boolean }).inLegend !== false,
        },
      },
      tooltip: { mode: 'nearest', intersect: true },
    },
    scales: {
      x: { ...xScale, title: { display: !residuals, text: xTitle, font: axisTitle } },
      y: {
        title: { display: true, text: yTitle, font: axisTitle },
        grid: { color: 'rgba(219,208,187,0.5)' },
        afterFit: (axis) => void (axis.width = Math.max(axis.width, 64)),
      },
    },
  };
  const residualOptions: ChartOptions<'scatter'> = {
    responsive: true,
    maintainAspectRatio: false,
    animation: false,
    plugins: { legend: { display: false } },
    scales: {
      x: { ...xScale, title: { display: true, text: xTitle, font: axisTitle } },
      // The same y-axis width as the main panel, so the two x-axes line up.
      y: {
        title: { display: true, text: residuals?.title ?? '', font: residualTitle },
        ticks: { maxTicksLimit: 5 },
        grid: { color: (c) => (c.tick.value === 0 ? CHART_COLORS.inkFaint : 'rgba(219,208,187,0.5)') },
        afterFit: (axis) => void (axis.width = Math.max(axis.width, 64)),
      },
    },
  };
  return (
    <figure aria-label={ariaLabel} className="w-full">
      <div style={{ height }} role="img" aria-label={`${ariaLabel}: ${yTitle} against ${xTitle}`}>
        <Scatter data={{ datasets: toDatasets(series) }} options={options} />
      </div>
      {residuals && (
        <div
          style={{ height: Math.max(160, Math.round(height * 0.5)) }}
          className="mt-1"
          role="img"
          aria-label={`Residuals: ${residuals.title}`}
          // Σy² of the filled (counted) residual points: lets a reader (and a test) check the panel against the χ² shown.
          data-residual-sum-squares={residuals.series
            .flatMap((s) => s.points.filter((p) => !p.hollow && Number.isFinite(p.y)).map((p) => p.y * p.y))
            .reduce((a, b) => a + b, 0)}
        >
          <Scatter data={{ datasets: toDatasets(residuals.series) }} options={residualOptions} />
        </div>
      )}
    </figure>
  );
}
