import {
  Chart,
  Filler,
  Legend,
  LinearScale,
  LineController,
  LineElement,
  PointElement,
  ScatterController,
  Tooltip,
  type ChartDataset,
  type Plugin,
} from 'chart.js';

/** Our colours (see src/index.css): ink for measured, copper for model curves, teal for simulated values. */
export const CHART_COLORS = {
  ink: '#18223a',
  inkFaint: '#7a8194',
  copper: '#a85a2a',
  teal: '#1b726d',
  rule: '#dbd0bb',
  changes: '#9e3428',
  slate: '#5f6b7d',
};

/** A dataset may carry symmetric vertical error bars (±u per point, same order as data). */
export type WithErrorBars = { errorBars?: number[]; errorBarColor?: string };

/** Draws vertical error bars with caps for datasets that carry `errorBars`. */
const errorBarsPlugin: Plugin = {
  id: 'epsigmaErrorBars',
  afterDatasetsDraw(chart) {
    const { ctx } = chart;
    const yScale = chart.scales.y;
    chart.data.datasets.forEach((dataset, i) => {
      const bars = (dataset as ChartDataset & WithErrorBars).errorBars;
      const meta = chart.getDatasetMeta(i);
      if (!bars || meta.hidden) return;
      ctx.save();
      ctx.strokeStyle = (dataset as WithErrorBars).errorBarColor ?? CHART_COLORS.ink;
      ctx.lineWidth = 1;
      meta.data.forEach((element, j) => {
        const u = bars[j];
        const point = dataset.data[j] as { x: number; y: number } | undefined;
        if (!u || !point || !Number.isFinite(u)) return;
        const x = element.x;
        const top = yScale.getPixelForValue(point.y + u);
        const bottom = yScale.getPixelForValue(point.y - u);
        ctx.beginPath();
        ctx.moveTo(x, top);
        ctx.lineTo(x, bottom);
        ctx.moveTo(x - 3, top);
        ctx.lineTo(x + 3, top);
        ctx.moveTo(x - 3, bottom);
        ctx.lineTo(x + 3, bottom);
        ctx.stroke();
      });
      ctx.restore();
    });
  },
};

/** A model curve may name itself at its right-hand end (e.g. the pressure of an isobar), instead of in the legend. */
export type WithEndLabel = { endLabel?: string };

const endLabelsPlugin: Plugin = {
  id: 'epsigmaEndLabels',
  afterDatasetsDraw(chart) {
    const { ctx, chartArea } = chart;
    chart.data.datasets.forEach((dataset, i) => {
      const label = (dataset as ChartDataset & WithEndLabel).endLabel;
      const meta = chart.getDatasetMeta(i);
      if (!label || meta.hidden) return;
      const last = [...meta.data]
        .reverse()
        .find(
          (el) =>
            Number.isFinite(el.x) && Number.isFinite(el.y) && el.x <= chartArea.right && el.y >= chartArea.top && el.y <= chartArea.bottom,
        );
      if (!last) return;
      ctx.save();
      ctx.font = '600 10px "Source Sans 3", system-ui, sans-serif';
      ctx.fillStyle = (dataset.borderColor as string) ?? CHART_COLORS.copper;
      ctx.textAlign = 'right';
      ctx.textBaseline = 'bottom';
      ctx.fillText(label, Math.min(last.x, chartArea.right - 2), last.y - 3);
      ctx.restore();
    });
  },
};

Chart.register(
  ScatterController,
  LineController,
  LinearScale,
  PointElement,
  LineElement,
  Tooltip,
  Legend,
  Filler,
  errorBarsPlugin,
  endLabelsPlugin,
);
Chart.defaults.font.family = '"Source Sans 3", system-ui, sans-serif';
Chart.defaults.color = CHART_COLORS.ink;
Chart.defaults.borderColor = 'rgba(219, 208, 187, 0.7)';
