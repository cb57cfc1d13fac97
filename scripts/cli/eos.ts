/**
 * Reduced-unit answers of the full Lennard-Jones fluid's equation of state (σ = ε = m = k_B = 1):
 *   eos --reduced-temperature T --reduced-pressure P [--prefer liquid|vapour] [--model M] --json
 *     → { reducedDensity, phase, chosenRoot, stablePhase, roots, dRhoDT, dRhoDP, note, model, source }
 *       (the stable root unless --prefer names a phase; `chosenRoot` says which it is)
 *   eos --saturation --reduced-temperature T [--model M] --json
 *     → { saturationPressure, liquidDensity, vapourDensity, dPressureDT, …, model, source }
 *   eos --critical-point [--model M] --json → { reducedTemperature, reducedDensity, reducedPressure, model, source }
 * M is thol2016 (Thol et al. 2016, the default), jzg1993 (Johnson, Zollweg & Gubbins) or kn1994 (Kolafa & Nezbeda).
 */
import {
  DEFAULT_LJ_EOS_MODEL,
  LJ_EOS_MODELS,
  LJ_EOS_MODEL_IDS,
  isLjEosModelId,
  ljCoexistence,
  ljCriticalPoint,
  ljStableDensity,
} from '../../shared/physics/eos/lj-eos-models';
import { errorMessage, finiteNumberFlag, missingFlagError, parseFlags, requiredFlag } from './_flags';

const USAGE =
  'usage: eos --reduced-temperature <T*> --reduced-pressure <P*> [--prefer liquid|vapour] [--model thol2016|jzg1993|kn1994] --json; ' +
  'eos --saturation --reduced-temperature <T*> [--model …] --json; eos --critical-point [--model …] --json';

export async function run(argv: string[]): Promise<unknown> {
  const values = parseFlags(
    argv,
    {
      'reduced-temperature': { type: 'string' },
      'reduced-pressure': { type: 'string' },
      prefer: { type: 'string' },
      model: { type: 'string' },
      saturation: { type: 'boolean' },
      'critical-point': { type: 'boolean' },
      json: { type: 'boolean' },
    },
    USAGE,
  );
  const modelText = values.model ?? DEFAULT_LJ_EOS_MODEL;
  if (!isLjEosModelId(modelText)) throw new Error(`--model must be one of ${LJ_EOS_MODEL_IDS.join(', ')}, got "${modelText}"`);
  const model = modelText;
  const { source } = LJ_EOS_MODELS[model];
  if (values.saturation && values['critical-point']) throw new Error(`--saturation and --critical-point are separate questions; ${USAGE}`);

  if (values['critical-point']) {
    for (const f of ['reduced-temperature', 'reduced-pressure', 'prefer'] as const)
      if (values[f] !== undefined) throw new Error(`--${f} is not used with --critical-point`);
    const c = ljCriticalPoint(model);
    return {
      reducedTemperature: c.reducedTemperature,
      reducedDensity: c.reducedDensity,
      reducedPressure: c.reducedPressure,
      model,
      source,
    };
  }

  const reducedTemperature = finiteNumberFlag(
    'reduced-temperature',
    requiredFlag('reduced-temperature', values['reduced-temperature'], USAGE),
  );
  if (values.saturation) {
    for (const f of ['reduced-pressure', 'prefer'] as const)
      if (values[f] !== undefined) throw new Error(`--${f} is not used with --saturation`);
    if (!(reducedTemperature > 0))
      throw new Error(`--reduced-temperature must be a finite number > 0, got "${values['reduced-temperature']}"`);
    let s;
    try {
      s = ljCoexistence(reducedTemperature, model);
    } catch (err) {
      throw new Error(`--reduced-temperature ${reducedTemperature}: ${errorMessage(err)}`, { cause: err });
    }
    return {
      reducedTemperature,
      saturationPressure: s.saturationPressure,
      liquidDensity: s.liquidDensity,
      vapourDensity: s.vapourDensity,
      dPressureDT: s.dPressureDT,
      dLiquidDensityDT: s.dLiquidDensityDT,
      dVapourDensityDT: s.dVapourDensityDT,
      criticalTemperature: ljCriticalPoint(model).reducedTemperature,
      model,
      source,
    };
  }

  if (values['reduced-pressure'] === undefined) throw missingFlagError('reduced-pressure', USAGE);
  const reducedPressure = finiteNumberFlag('reduced-pressure', values['reduced-pressure']);
  if (!(reducedTemperature > 0))
    throw new Error(`--reduced-temperature must be a finite number > 0, got "${values['reduced-temperature']}"`);
  if (!(reducedPressure > 0)) throw new Error(`--reduced-pressure must be a finite number > 0, got "${values['reduced-pressure']}"`);
  const prefer = values.prefer;
  if (prefer !== undefined && prefer !== 'liquid' && prefer !== 'vapour')
    throw new Error(`--prefer must be "liquid" or "vapour", got "${prefer}"`);
  let r;
  try {
    r = ljStableDensity(reducedTemperature, reducedPressure, model, prefer);
  } catch (err) {
    throw new Error(errorMessage(err), { cause: err });
  }
  return {
    reducedDensity: r.reducedDensity,
    phase: r.phase,
    chosenRoot: r.chosen,
    stablePhase: r.stablePhase,
    roots: r.roots.map((x) => x.reducedDensity),
    dRhoDT: r.dRhoDT,
    dRhoDP: r.dRhoDP,
    note: r.note,
    model,
    source,
  };
}
