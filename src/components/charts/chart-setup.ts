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

Chart.register(ScatterController, LineController, LinearScale, PointElement, LineElement, Tooltip, Legend, Filler, errorBarsPlugin);
Chart.defaults.font.family = '"Source Sans 3", system-ui, sans-serif';
Chart.defaults.color = CHART_COLORS.ink;
Chart.defaults.borderColor = 'rgba(219, 208, 187, 0.7)';
