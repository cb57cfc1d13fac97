import { describe, expect, it } from 'vitest';
import {
  DEFAULT_LJ_BOUNDS,
  DEFAULT_POSTERIOR_SAMPLES,
  DEFAULT_RESTARTS,
  DENSITY_FIT_DEFAULTS,
  POSTERIOR_SEED,
} from '../../shared/fitting/fit-defaults';
import { fitFormDefaults, fitFormSchema, formPathOf, type FitSetChoice } from '../../src/features/fits/components/fit-form-schema';

// The fit form's values → request body step, which the form runs through react-hook-form's zod resolver.
const sets: FitSetChoice[] = [
  { id: 7, name: 'QG-1 B2', version: 1, kind: 'b2', rowCount: 12, withdrawn: false },
  { id: 8, name: 'QG-1 densities', version: 2, kind: 'density', rowCount: 20, withdrawn: false },
  { id: 9, name: 'QG-1 viscosity', version: 1, kind: 'viscosity', rowCount: 9, withdrawn: false },
];

describe('fit form schema', () => {
  it('sends the server defaults when nothing is changed (gas-phase sets ticked, densities opt-in)', () => {
    const body = fitFormSchema(3, sets).parse(fitFormDefaults(sets));
    expect(body).toEqual({
      substanceId: 3,
      measurementSets: [
        { id: 7, weight: 1 },
        { id: 9, weight: 1 },
      ],
      options: { quantumCorrection: false, bounds: DEFAULT_LJ_BOUNDS, restarts: DEFAULT_RESTARTS },
    });
  });

  it('a Mie fit with λr held at 16 and the posterior on, with decimal commas; densities bring the engine defaults', () => {
    const v = fitFormDefaults(sets);
    v.sets[1].use = true;
    v.sets[0].weight = '2,5';
    v.options.model = 'mie';
    v.options.repulsiveExponent = '16';
    v.options.posteriorOn = true;
    v.options.posterior.priorSetId = '4';
    v.options.exponent = 'fitted';
    const body = fitFormSchema(3, sets).safeParse(v);
    // The simulation stage holds λr: fitting it with densities is refused, on the λr choice.
    expect(body.success).toBe(false);
    expect(body.error!.issues.map((i) => i.path.join('.'))).toEqual(['options.exponent']);
    v.options.exponent = 'held';
    v.sets[1].use = false;
    const ok = fitFormSchema(3, sets).parse(v);
    expect(ok.measurementSets[0]).toEqual({ id: 7, weight: 2.5 });
    expect(ok.options).toMatchObject({
      model: 'mie',
      repulsiveExponent: 16,
      posterior: { samples: DEFAULT_POSTERIOR_SAMPLES, seed: POSTERIOR_SEED, prior: { parameterSetId: 4 } },
    });
    v.sets[1].use = true;
    v.options.model = 'lj-12-6';
    const withDensity = fitFormSchema(3, sets).parse(v);
    expect(withDensity.options!.density).toEqual({
      atoms: DENSITY_FIT_DEFAULTS.atoms,
      steps: DENSITY_FIT_DEFAULTS.steps,
      cutoff: DENSITY_FIT_DEFAULTS.cutoff,
      scheme: DENSITY_FIT_DEFAULTS.scheme,
    });
  });

  it('puts every complaint on the field it concerns, the request schema’s too', () => {
    const v = fitFormDefaults(sets);
    v.sets[2].weight = 'heavy';
    v.hold = 'sigmaAngstrom';
    v.options.restarts = '1.5';
    const first = fitFormSchema(3, sets).safeParse(v);
    expect(first.error!.issues.map((i) => [i.path.join('.'), i.message])).toEqual([
      ['sets.2.weight', '“heavy” is not a weight'],
      ['fixed.sigmaAngstrom', 'give the σ to hold, in Å'],
      ['options.restarts', '“1.5” is not a whole number'],
    ]);
    // Numbers that parse but break the request schema: its messages, on the form's rows (set 9 is request item 1).
    const w = fitFormDefaults(sets);
    w.sets[2].weight = '500';
    w.options.bounds.epsilonK = ['300', '200'];
    w.options.model = 'mie';
    w.options.repulsiveExponent = '40';
    const second = fitFormSchema(3, sets).safeParse(w);
    expect(second.error!.issues.map((i) => [i.path.join('.'), i.message])).toEqual([
      ['sets.2.weight', 'weight must be at most 100'],
      ['options.bounds.epsilonK', 'epsilonK bounds must be [lower, upper] with lower < upper'],
      ['options.repulsiveExponent', 'the repulsive exponent λr is at most 36'],
    ]);
    const none = fitFormDefaults(sets);
    none.sets.forEach((s) => (s.use = false));
    expect(
      fitFormSchema(3, sets)
        .safeParse(none)
        .error!.issues.map((i) => i.path.join('.')),
    ).toEqual(['sets']);
  });

  it('maps the server’s detail fields to the form’s', () => {
    const chosen = [0, 2];
    expect(formPathOf('measurementSets.1.excludeRows', chosen)).toBe('sets.2.excludeRows');
    expect(formPathOf('measurementSets.0.id', chosen)).toBe('sets.0.use');
    expect(formPathOf('measurementSets', chosen)).toBe('sets');
    expect(formPathOf('fixed', chosen)).toBe('fixed.sigmaAngstrom');
    expect(formPathOf('options.posterior.prior.parameterSetId', chosen)).toBe('options.posterior.priorSetId');
    expect(formPathOf('options.fitRepulsiveExponent', chosen)).toBe('options.exponent');
    expect(formPathOf('options.density.steps', chosen)).toBe('options.density.steps');
    expect(formPathOf('substanceId', chosen)).toBeNull();
  });
});
