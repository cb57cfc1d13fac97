import { Scatter } from 'react-chartjs-2';
import type { LjFitResult } from '@shared/fitting/lj-fit';
import { CHART_COLORS } from '@/components/charts/chart-setup';

/** The 95 % joint confidence region of (ε/k_B, σ) with the best estimate. */
export function EllipseChart({ result, height = 260 }: { result: LjFitResult; height?: number }) {
  const held = result.heldParameters ?? [];
  if (held.length)
    return (
      <p className="text-sm text-ink-soft">
        {held.includes('sigmaAngstrom') ? 'σ' : 'ε/k_B'} is held, so there is no joint region: only {held.includes('sigmaAngstrom') ? 'ε/k_B' : 'σ'} was fitted, and its standard error and profile interval say how well the data fix it at the held value.
      </p>
    );
  if (!result.ellipse95) return <p className="text-sm text-ink-soft">No confidence region: the covariance could not be computed (see the warnings).</p>;
  const pts = result.ellipse95.points.map((p) => ({ x: p.epsilonK, y: p.sigmaAngstrom }));
  return (
    <figure aria-label="95 % joint confidence region of ε/k_B and σ">
      <div style={{ height }} role="img" aria-label={`95 % confidence ellipse around ε/k_B = ${result.epsilonK.toFixed(2)} K, σ = ${result.sigmaAngstrom.toFixed(4)} Å`}>
        <Scatter
          data={{
            datasets: [
              { label: '95 % region', data: [...pts, pts[0]], showLine: true, pointRadius: 0, borderColor: CHART_COLORS.copper, backgroundColor: 'rgba(168,90,42,0.12)', fill: true, borderWidth: 1.5 },
              { label: 'best fit', data: [{ x: result.epsilonK, y: result.sigmaAngstrom }], pointRadius: 4, backgroundColor: CHART_COLORS.ink, borderColor: CHART_COLORS.ink },
            ],
          }}
          options={{
            responsive: true,
            maintainAspectRatio: false,
            animation: false,
            plugins: { legend: { position: 'top', align: 'end', labels: { usePointStyle: true, boxWidth: 7, boxHeight: 7 } } },
            scales: {
              x: { type: 'linear', title: { display: true, text: 'ε/k_B (K)', font: { weight: 600 } } },
              y: { title: { display: true, text: 'σ (Å)', font: { weight: 600 } } },
            },
          }}
        />
      </div>
      <figcaption className="mt-1 text-xs text-ink-faint">{result.ellipse95.description}</figcaption>
    </figure>
  );
}
