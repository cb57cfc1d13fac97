import { Scatter } from 'react-chartjs-2';
import type { ChartData } from 'chart.js';
import type { GasFitResult } from '@shared/fitting/gas-fit';
import type { LjFitResult } from '@shared/fitting/lj-fit';
import { PROPERTY_MODELS, type FitKind } from '@shared/fitting/property-models';
import { CHART_COLORS } from '@/components/charts/chart-setup';

type Outline = Array<{ epsilonK: number; sigmaAngstrom: number }>;
type Dataset = ChartData<'scatter'>['datasets'][number];

/** Colours of the single-kind regions: distinct from copper (linearised) and teal (posterior), readable on paper. */
const KIND_COLORS = ['#5b4a9e', '#2f6f2f', '#9e3428', '#8a6d00', '#3b5b8c', '#7a3b6b'];
const TEAL_DRAWS = 'rgba(27,114,109,0.28)';
const closed = (o: Outline) => [...o, o[0]].map((p) => ({ x: p.epsilonK, y: p.sigmaAngstrom }));
/** Short names for the legend (it wraps on a phone); the model's own label for any other kind. */
const SHORT_KIND_NAMES: Record<string, string> = {
  b2: 'B2',
  b3: 'B3',
  viscosity: 'viscosity',
  density: 'density',
  saturatedLiquidDensity: 'saturated liquid density',
  saturatedVapourDensity: 'saturated vapour density',
  vapourPressure: 'vapour pressure',
};
const kindName = (kind: string) => SHORT_KIND_NAMES[kind] ?? PROPERTY_MODELS[kind as FitKind]?.label ?? kind;

interface LegendEntry {
  text: string;
  swatch: 'fill' | 'dash' | 'dots' | 'point';
  color: string;
}

function Swatch({ entry }: { entry: LegendEntry }) {
  const { swatch, color } = entry;
  return (
    <svg width="22" height="10" aria-hidden="true" className="shrink-0">
      {swatch === 'fill' && <rect x="1" y="1" width="20" height="8" fill="rgba(168,90,42,0.14)" stroke={color} strokeWidth="1.5" />}
      {swatch === 'dash' && <line x1="1" y1="5" x2="21" y2="5" stroke={color} strokeWidth="2" strokeDasharray="5 3" />}
      {swatch === 'dots' && [4, 9, 14, 19].map((x, i) => <circle key={x} cx={x} cy={i % 2 ? 3 : 7} r="1.6" fill={color} />)}
      {swatch === 'point' && <circle cx="11" cy="5" r="4" fill={color} />}
    </svg>
  );
}

/**
 * The 95 % regions of (ε/k_B, σ): the linearised joint region with the best estimate, and, when the result has
 * them, the posterior draws with their 95 % credible region and the region of each kind of data fitted alone.
 * The legend is written out under the plot (it wraps on a phone), with the plain-words notes of the result.
 */
export function EllipseChart({ result, height = 280 }: { result: LjFitResult; height?: number }) {
  const r = result as GasFitResult;
  const held = result.heldParameters ?? [];
  if (held.length)
    return (
      <p className="text-sm text-ink-soft">
        {held.includes('sigmaAngstrom') ? 'σ' : 'ε/k_B'} is held, so there is no joint region: only{' '}
        {held.includes('sigmaAngstrom') ? 'ε/k_B' : 'σ'} was fitted, and its standard error and profile interval say how well the data fix
        it at the held value.
      </p>
    );
  const posterior = r.posterior;
  const draws = posterior?.draws ?? [];
  const credible = posterior?.credibleRegion95 ?? [];
  const kinds = (r.tension?.regions ?? []).filter((g) => g.constrainsBoth && (g.ellipse95?.length ?? 0) > 2);
  if (!result.ellipse95 && !draws.length)
    return <p className="text-sm text-ink-soft">No confidence region: the covariance could not be computed (see the warnings).</p>;

  const datasets: Dataset[] = [];
  const legend: LegendEntry[] = [];
  // Drawn first, so the fit's own regions stay on top of them.
  kinds.forEach((g, i) => {
    const color = KIND_COLORS[i % KIND_COLORS.length];
    const label = `${kindName(g.kind)} alone, 95 %`;
    datasets.push({
      label,
      data: closed(g.ellipse95!),
      showLine: true,
      pointRadius: 0,
      borderColor: color,
      borderWidth: 1.5,
      borderDash: [2, 3],
      fill: false,
    });
    legend.push({ text: label, swatch: 'dash', color });
  });
  if (draws.length) {
    const label = `posterior draws (${draws.length})`;
    datasets.push({
      label,
      data: draws.map((d) => ({ x: d.epsilonK, y: d.sigmaAngstrom })),
      pointRadius: 1.3,
      pointHoverRadius: 2,
      backgroundColor: TEAL_DRAWS,
      borderColor: TEAL_DRAWS,
      borderWidth: 0,
    });
    legend.push({ text: label, swatch: 'dots', color: CHART_COLORS.teal });
  }
  if (credible.length > 2) {
    const label = 'posterior 95 % credible region';
    datasets.push({
      label,
      data: closed(credible),
      showLine: true,
      pointRadius: 0,
      borderColor: CHART_COLORS.teal,
      borderWidth: 2,
      borderDash: [6, 3],
      fill: false,
    });
    legend.push({ text: label, swatch: 'dash', color: CHART_COLORS.teal });
  }
  if (result.ellipse95) {
    const label = draws.length ? 'linearised 95 % region' : '95 % region';
    datasets.push({
      label,
      data: closed(result.ellipse95.points),
      showLine: true,
      pointRadius: 0,
      borderColor: CHART_COLORS.copper,
      backgroundColor: 'rgba(168,90,42,0.12)',
      fill: true,
      borderWidth: 1.5,
    });
    legend.push({ text: label, swatch: 'fill', color: CHART_COLORS.copper });
  }
  datasets.push({
    label: 'best fit',
    data: [{ x: result.epsilonK, y: result.sigmaAngstrom }],
    pointRadius: 4,
    backgroundColor: CHART_COLORS.ink,
    borderColor: CHART_COLORS.ink,
  });
  legend.push({ text: 'best fit', swatch: 'point', color: CHART_COLORS.ink });

  const described = [
    result.ellipse95
      ? `95 % confidence ellipse around ε/k_B = ${result.epsilonK.toFixed(2)} K, σ = ${result.sigmaAngstrom.toFixed(4)} Å`
      : `best fit ε/k_B = ${result.epsilonK.toFixed(2)} K, σ = ${result.sigmaAngstrom.toFixed(4)} Å`,
    draws.length ? `${draws.length} posterior draws${credible.length > 2 ? ' with their 95 % credible region' : ''}` : '',
    kinds.length ? `the 95 % regions of ${kinds.map((g) => kindName(g.kind)).join(' and ')} fitted alone` : '',
  ].filter(Boolean);
  // The result's own sentences where the posterior and the linearised intervals part, and where kinds pull apart.
  const notes = [...(posterior?.messages ?? []), ...(kinds.length ? (r.tension?.messages ?? []) : [])];
  return (
    <figure aria-label="95 % regions of ε/k_B and σ">
      <div style={{ height }} role="img" aria-label={described.join('; ')}>
        <Scatter
          data={{ datasets }}
          options={{
            responsive: true,
            maintainAspectRatio: false,
            animation: false,
            plugins: {
              legend: { display: false },
              tooltip: { filter: (item) => item.dataset.label === 'best fit' || !item.dataset.showLine },
            },
            scales: {
              x: { type: 'linear', title: { display: true, text: 'ε/k_B (K)', font: { weight: 600 } }, ticks: { maxTicksLimit: 6 } },
              y: { title: { display: true, text: 'σ (Å)', font: { weight: 600 } }, ticks: { maxTicksLimit: 6 } },
            },
          }}
        />
      </div>
      <ul aria-label="Legend of the ε–σ plot" className="mt-2 flex flex-wrap gap-x-4 gap-y-1 text-xs text-ink-soft">
        {legend.map((e) => (
          <li key={e.text} className="flex items-center gap-1.5">
            <Swatch entry={e} />
            {e.text}
          </li>
        ))}
      </ul>
      <figcaption className="mt-1 text-xs text-ink-faint">
        {result.ellipse95?.description}
        {result.ellipse95 && !/\.\s*$/.test(result.ellipse95.description) ? '.' : ''}
        {draws.length > 0 &&
          ' Dots: draws from the posterior (flat priors within the bounds unless a prior is named in the posterior panel); dashed teal: their 95 % highest-posterior-density region.'}
      </figcaption>
      {notes.length > 0 && (
        <ul role="note" aria-label="Notes on the regions" className="mt-2 list-disc pl-5 text-sm">
          {notes.map((m) => (
            <li key={m}>{m}</li>
          ))}
        </ul>
      )}
      {draws.length > 0 && posterior && notes.length === 0 && (
        <p className="mt-2 text-sm" role="note">
          The posterior and the linearised 95 % intervals agree for both parameters.
        </p>
      )}
    </figure>
  );
}
