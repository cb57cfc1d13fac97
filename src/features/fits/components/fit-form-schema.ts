import { z } from 'zod';
import { FIT_KINDS } from '@shared/fitting/property-models';
import {
  DEFAULT_LJ_BOUNDS,
  DEFAULT_POSTERIOR_SAMPLES,
  DEFAULT_RESTARTS,
  DENSITY_FIT_DEFAULTS,
  POSTERIOR_SEED,
  SUGGESTED_REPULSIVE_EXPONENT,
} from '@shared/fitting/fit-defaults';
import type { PropertyKind } from '@shared/measurements/property-kinds';
import { createFitBody, type CreateFitBody } from '@shared/schemas/fits';
import type { SimulationCutoffScheme } from '@shared/physics/cutoff-schemes';

/** A measurement set as the fit form offers it (the page passes its substance's sets). */
export interface FitSetChoice {
  id: number;
  name: string;
  version: number;
  kind: PropertyKind;
  rowCount: number;
  withdrawn: boolean;
}

/** An approved parameter set of the substance, offered as a Gaussian prior for the posterior. */
export interface PriorSetChoice {
  id: number;
  version: number;
  /** The pair potential of the set: a prior is offered only for a fit of the same potential. */
  potential: 'lj-12-6' | 'mie';
  /** λr of the set (12 for LJ 12-6): a held-λr fit takes a prior of the same λr only. */
  repulsiveExponent: number;
  potentialLabel: string;
  epsilonK: number;
  sigmaAngstrom: number;
  stdErr: { epsilonK: number | null; sigmaAngstrom: number | null };
}

/**
 * What the form holds: text as typed (a decimal comma is accepted), one row per offered set, switches for the
 * choices the request expresses by leaving fields out. Paths mirror the request body where a field exists there,
 * so a refusal (ours or the server's) lands on the field it names.
 */
export interface FitFormValues {
  sets: Array<{ id: number; use: boolean; weight: string; excludeRows: number[]; excludeReason: string; picking: boolean }>;
  hold: 'none' | 'epsilonK' | 'sigmaAngstrom';
  fixed: { epsilonK: string; sigmaAngstrom: string };
  options: {
    model: 'lj-12-6' | 'mie';
    exponent: 'held' | 'fitted';
    repulsiveExponent: string;
    quantumCorrection: boolean;
    bounds: { epsilonK: [string, string]; sigmaAngstrom: [string, string] };
    restarts: string;
    manualStart: boolean;
    start: { epsilonK: string; sigmaAngstrom: string };
    posteriorOn: boolean;
    posterior: { samples: string; seed: string; priorSetId: string };
    density: { atoms: string; steps: string; cutoff: string; scheme: SimulationCutoffScheme };
  };
}

export const isFittable = (d: FitSetChoice) => (FIT_KINDS as string[]).includes(d.kind);
// Gas-phase sets (B2, B3, viscosity) are ticked by default; densities add a simulation stage of minutes and
// saturation data (VLE) probe the liquid, so both are opt-in.
const isGasPhase = (d: FitSetChoice) => d.kind === 'b2' || d.kind === 'b3' || d.kind === 'viscosity';

/** The form's starting values: the server's own defaults (shared/fitting/fit-defaults.ts), written as text. */
export function fitFormDefaults(sets: FitSetChoice[]): FitFormValues {
  const t = (x: number) => String(x);
  return {
    sets: sets.map((d) => ({
      id: d.id,
      use: isFittable(d) && isGasPhase(d),
      weight: '1',
      excludeRows: [],
      excludeReason: '',
      picking: false,
    })),
    hold: 'none',
    fixed: { epsilonK: '', sigmaAngstrom: '' },
    options: {
      model: 'lj-12-6',
      exponent: 'held',
      repulsiveExponent: t(SUGGESTED_REPULSIVE_EXPONENT),
      quantumCorrection: false,
      bounds: {
        epsilonK: [t(DEFAULT_LJ_BOUNDS.epsilonK[0]), t(DEFAULT_LJ_BOUNDS.epsilonK[1])],
        sigmaAngstrom: [t(DEFAULT_LJ_BOUNDS.sigmaAngstrom[0]), t(DEFAULT_LJ_BOUNDS.sigmaAngstrom[1])],
      },
      restarts: t(DEFAULT_RESTARTS),
      manualStart: false,
      start: { epsilonK: '', sigmaAngstrom: '' },
      posteriorOn: false,
      posterior: { samples: t(DEFAULT_POSTERIOR_SAMPLES), seed: t(POSTERIOR_SEED), priorSetId: '' },
      density: {
        atoms: t(DENSITY_FIT_DEFAULTS.atoms),
        steps: t(DENSITY_FIT_DEFAULTS.steps),
        cutoff: t(DENSITY_FIT_DEFAULTS.cutoff),
        scheme: DENSITY_FIT_DEFAULTS.scheme,
      },
    },
  };
}

const text = z.string();
const formShape = z.object({
  sets: z.array(
    z.object({
      id: z.number(),
      use: z.boolean(),
      weight: text,
      excludeRows: z.array(z.number()),
      excludeReason: text,
      picking: z.boolean(),
    }),
  ),
  hold: z.enum(['none', 'epsilonK', 'sigmaAngstrom']),
  fixed: z.object({ epsilonK: text, sigmaAngstrom: text }),
  options: z.object({
    model: z.enum(['lj-12-6', 'mie']),
    exponent: z.enum(['held', 'fitted']),
    repulsiveExponent: text,
    quantumCorrection: z.boolean(),
    bounds: z.object({ epsilonK: z.tuple([text, text]), sigmaAngstrom: z.tuple([text, text]) }),
    restarts: text,
    manualStart: z.boolean(),
    start: z.object({ epsilonK: text, sigmaAngstrom: text }),
    posteriorOn: z.boolean(),
    posterior: z.object({ samples: text, seed: text, priorSetId: text }),
    density: z.object({ atoms: text, steps: text, cutoff: text, scheme: z.enum(['truncated-tail', 'truncated-shifted']) }),
  }),
});

type Path = ReadonlyArray<PropertyKey>;

/**
 * The form field a request path names: `measurementSets.k.*` is the k-th chosen set, i.e. form row `chosen[k]`; the
 * prior's set id is the picker; every other path is spelled the same in both. Unknown paths give null.
 */
export function formPathOf(path: Path | string, chosen: readonly number[]): string | null {
  const parts = (typeof path === 'string' ? path.split('.') : path.map(String)).filter((p) => p !== '');
  if (!parts.length) return null;
  if (parts[0] === 'measurementSets') {
    if (parts.length === 1) return 'sets';
    const row = chosen[Number(parts[1])];
    if (row === undefined) return 'sets';
    const field = parts[2];
    return field === 'weight' || field === 'excludeRows' || field === 'excludeReason' ? `sets.${row}.${field}` : `sets.${row}.use`;
  }
  if (parts[0] === 'fixed') return parts[1] === 'epsilonK' || parts[1] === 'sigmaAngstrom' ? `fixed.${parts[1]}` : 'fixed.sigmaAngstrom';
  if (parts[0] === 'options') {
    const [, group, field] = parts;
    if (group === undefined) return null;
    if (group === 'posterior')
      return field === 'prior'
        ? 'options.posterior.priorSetId'
        : field === 'samples' || field === 'seed'
          ? `options.posterior.${field}`
          : 'options.posteriorOn';
    if (group === 'fitRepulsiveExponent') return 'options.exponent';
    if (group === 'bounds' || group === 'start')
      return field === 'epsilonK' || field === 'sigmaAngstrom' ? `options.${group}.${field}` : `options.${group}.epsilonK`;
    if (group === 'density')
      return field && ['atoms', 'steps', 'cutoff', 'scheme'].includes(field) ? `options.density.${field}` : 'options.density.atoms';
    if (['model', 'repulsiveExponent', 'quantumCorrection', 'restarts'].includes(group)) return `options.${group}`;
    return null;
  }
  return null;
}

/** A number as typed ('2,5' is 2.5); NaN for empty or non-numeric text. */
export const parseDecimal = (s: string) => (s.trim() === '' ? Number.NaN : Number(s.trim().replace(',', '.')));

/**
 * The form's schema: the form values become a request body, which the request schema (createFitBody, the one the
 * server uses) then judges; its complaints are moved onto the fields they concern.
 */
export function fitFormSchema(substanceId: number, sets: FitSetChoice[]) {
  return formShape.transform((v, ctx): CreateFitBody => {
    let complaints = 0;
    const complain = (path: string, message: string) => {
      complaints++;
      ctx.addIssue({ code: 'custom', path: path.split('.'), message });
    };
    const number = (path: string, raw: string, what = 'a number') => {
      const x = parseDecimal(raw);
      if (!Number.isFinite(x)) complain(path, raw.trim() === '' ? `give ${what}` : `“${raw.trim()}” is not ${what}`);
      return x;
    };
    const whole = (path: string, raw: string) => {
      const x = number(path, raw, 'a whole number');
      if (Number.isFinite(x) && !Number.isInteger(x)) complain(path, `“${raw.trim()}” is not a whole number`);
      return x;
    };
    const chosen: number[] = [];
    v.sets.forEach((s, i) => {
      const d = sets.find((x) => x.id === s.id);
      if (s.use && d && isFittable(d)) chosen.push(i);
    });
    const measurementSets = chosen.map((i) => {
      const s = v.sets[i];
      const d = sets.find((x) => x.id === s.id)!;
      if (s.excludeRows.length >= d.rowCount)
        complain(`sets.${i}.excludeRows`, `every row of ${d.name} is left out: untick the set instead`);
      const reason = s.excludeReason.trim();
      return {
        id: s.id,
        weight: number(`sets.${i}.weight`, s.weight, 'a weight'),
        ...(s.excludeRows.length ? { excludeRows: s.excludeRows, ...(reason ? { excludeReason: reason } : {}) } : {}),
      };
    });
    const o = v.options;
    const mie = o.model === 'mie';
    const density = chosen.some((i) => sets.find((x) => x.id === v.sets[i].id)?.kind === 'density');
    const held =
      v.hold === 'none'
        ? null
        : number(`fixed.${v.hold}`, v.fixed[v.hold], v.hold === 'epsilonK' ? 'the ε/k_B to hold, in K' : 'the σ to hold, in Å');
    const priorSetId = o.posterior.priorSetId === '' ? null : Number(o.posterior.priorSetId);
    const body: CreateFitBody = {
      substanceId,
      measurementSets,
      ...(held !== null ? { fixed: { [v.hold]: held } } : {}),
      options: {
        quantumCorrection: o.quantumCorrection,
        bounds: {
          epsilonK: [number('options.bounds.epsilonK', o.bounds.epsilonK[0]), number('options.bounds.epsilonK', o.bounds.epsilonK[1])],
          sigmaAngstrom: [
            number('options.bounds.sigmaAngstrom', o.bounds.sigmaAngstrom[0]),
            number('options.bounds.sigmaAngstrom', o.bounds.sigmaAngstrom[1]),
          ],
        },
        restarts: whole('options.restarts', o.restarts),
        ...(o.manualStart
          ? {
              start: {
                epsilonK: number('options.start.epsilonK', o.start.epsilonK),
                sigmaAngstrom: number('options.start.sigmaAngstrom', o.start.sigmaAngstrom),
              },
            }
          : {}),
        ...(mie
          ? {
              model: 'mie' as const,
              ...(o.exponent === 'fitted'
                ? { fitRepulsiveExponent: true }
                : { repulsiveExponent: number('options.repulsiveExponent', o.repulsiveExponent, 'a number from 8 to 36') }),
            }
          : {}),
        ...(o.posteriorOn
          ? {
              posterior: {
                samples: whole('options.posterior.samples', o.posterior.samples),
                seed: whole('options.posterior.seed', o.posterior.seed),
                ...(priorSetId !== null ? { prior: { parameterSetId: priorSetId } } : {}),
              },
            }
          : {}),
        ...(density
          ? {
              density: {
                atoms: whole('options.density.atoms', o.density.atoms),
                steps: whole('options.density.steps', o.density.steps),
                cutoff: number('options.density.cutoff', o.density.cutoff),
                scheme: o.density.scheme,
              },
            }
          : {}),
      },
    };
    if (complaints) return z.NEVER;
    const judged = createFitBody.safeParse(body);
    if (judged.success) return judged.data;
    for (const issue of judged.error.issues) complain(formPathOf(issue.path, chosen) ?? 'root.request', issue.message);
    return z.NEVER;
  });
}
