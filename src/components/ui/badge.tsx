import type { ReactNode } from 'react';

const TONES = {
  neutral: 'bg-paper-deep text-ink-soft',
  copper: 'bg-copper-soft text-copper-dark',
  teal: 'bg-teal-soft text-teal',
  approved: 'bg-approved-soft text-approved',
  review: 'bg-review-soft text-review',
  changes: 'bg-changes-soft text-changes',
  slate: 'bg-slate-soft text-slate',
} as const;

export type BadgeTone = keyof typeof TONES;

export function Badge({ tone = 'neutral', children }: { tone?: BadgeTone; children: ReactNode }) {
  return (
    <span className={`inline-flex items-center whitespace-nowrap rounded-full px-2 py-0.5 text-xs font-semibold ${TONES[tone]}`}>
      {children}
    </span>
  );
}

/** Property kinds get a short tag of their own. */
export const KIND_TAG: Record<string, { label: string; tone: BadgeTone }> = {
  b2: { label: 'B2(T)', tone: 'copper' },
  density: { label: 'ρ(T, P)', tone: 'teal' },
  viscosity: { label: 'η(T)', tone: 'slate' },
  b3: { label: 'B3(T)', tone: 'copper' },
  b12: { label: 'B12(T)', tone: 'copper' },
  saturatedLiquidDensity: { label: 'ρ_liq(T)', tone: 'teal' },
  saturatedVapourDensity: { label: 'ρ_vap(T)', tone: 'teal' },
  vapourPressure: { label: 'p_sat(T)', tone: 'slate' },
};

export function KindBadge({ kind }: { kind: string }) {
  const tag = KIND_TAG[kind] ?? { label: kind, tone: 'neutral' as const };
  return <Badge tone={tag.tone}>{tag.label}</Badge>;
}
