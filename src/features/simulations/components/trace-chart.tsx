import type { ChartDataset } from 'chart.js';
import { Scatter } from 'react-chartjs-2';
import { CHART_COLORS } from '@/components/charts/chart-setup';

/** One decimated series against MD step, with the detected start of production marked. */
export function TraceChart({
  steps,
  values,
  label,
  yTitle,
  equilibrationStep,
  height = 180,
  threshold,
}: {
  steps: number[];
  values: number[];
  label: string;
  yTitle: string;
  equilibrationStep?: number;
  height?: number;
  threshold?: { value: number; label: string };
}) {
  const data = steps.map((s, i) => ({ x: s, y: values[i] }));
  const ys = values.filter(Number.isFinite);
  const lo = Math.min(...ys, threshold?.value ?? Infinity);
  const hi = Math.max(...ys, threshold?.value ?? -Infinity);
  const datasets: ChartDataset<'scatter'>[] = [
    { label, data, showLine: true, pointRadius: 0, borderColor: CHART_COLORS.teal, borderWidth: 1.2 },
  ];
  if (equilibrationStep !== undefined)
    datasets.push({
      label: 'production starts',
      data: [
        { x: equilibrationStep, y: lo },
        { x: equilibrationStep, y: hi },
      ],
      showLine: true,
      pointRadius: 0,
      borderColor: CHART_COLORS.copper,
      borderDash: [5, 4],
      borderWidth: 1.5,
    });
  if (threshold)
    datasets.push({
      label: threshold.label,
      data: [
        { x: steps[0], y: threshold.value },
        { x: steps[steps.length - 1], y: threshold.value },
      ],
      showLine: true,
      pointRadius: 0,
      borderColor: CHART_COLORS.changes,
      borderDash: [2, 3],
      borderWidth: 1,
    });
  return (
    <div style={{ height }} role="img" aria-label={`${label} against MD step`}>
      <Scatter
        data={{ datasets }}
        options={{
          responsive: true,
          maintainAspectRatio: false,
          animation: false,
          plugins: { legend: { position: 'top', align: 'end', labels: { usePointStyle: true, boxWidth: 7, boxHeight: 7 } } },
          scales: {
            x: { type: 'linear', title: { display: true, text: 'MD step', font: { weight: 600 } } },
            y: { title: { display: true, text: yTitle, font: { weight: 600 } } },
          },
        }}
      />
    </div>
  );
}
