/**
 * Writes the demo's measurement tables (fixtures/demo/*.csv) for the invented Quillmoor Chemicals scenario.
 * The numbers are invented: each substance has made-up "true" LJ parameters, the tables come from the
 * LJ models (B2 by quadrature, Chapman–Enskog viscosity, the JZG equation of state for densities, the Thol 2016
 * equation for saturation, B12 with an invented k_ij for the one demo pair) with a
 * small smooth departure from LJ behaviour and seeded scatter, as a real laboratory table would show.
 * Run: node --import tsx scripts/generate-demo-data.ts
 */
import { writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { AVOGADRO_PER_MOL, BOLTZMANN_J_PER_K } from '../shared/physics/constants';
import { ljEosDensity } from '../shared/physics/lj-eos';
import { b2WithGradient } from '../shared/physics/virial';
import { viscosityWithGradient } from '../shared/physics/viscosity';
import { DEMO_MIXTURES, DEMO_SUBSTANCES } from '../fixtures/demo/scenario';
import { ljCoexistence } from '../shared/physics/eos/lj-eos-models';
import { crossB2 } from '../shared/mixing/cross-virial';

let state = 20261201;
function uniform(): number {
  // mulberry32: a small seeded generator, so the demo tables are the same on every run
  state = (state + 0x6d2b79f5) | 0;
  let t = state;
  t = Math.imul(t ^ (t >>> 15), t | 1);
  t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
  return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
}
function gaussian(): number {
  return Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());
}

const out = (name: string, text: string) => writeFileSync(fileURLToPath(new URL(`../fixtures/demo/${name}`, import.meta.url)), text);
const header = (s: (typeof DEMO_SUBSTANCES)[number], what: string) =>
  `# Invented demonstration data (Quillmoor Chemicals, Fenwick Thermophysics Laboratory): ${s.name}, ${what}. Not a real measurement.\n`;

for (const s of DEMO_SUBSTANCES) {
  const { epsilonK, sigmaAngstrom, molarMassGPerMol } = s.hidden;
  if (s.tables.b2) {
    const lines = ['T (K),B2 (cm3/mol),u(B2) (cm3/mol)'];
    for (const T of s.tables.b2) {
      const model = b2WithGradient(T, epsilonK, sigmaAngstrom).b2Cm3PerMol;
      const departure = s.hidden.b2DepartureCm3PerMol * (epsilonK / T) ** 2;
      const u = Math.max(0.4, 0.01 * Math.abs(model));
      lines.push(`${T},${(model + departure + u * gaussian()).toFixed(2)},${u.toFixed(2)}`);
    }
    out(`${s.file}-b2.csv`, header(s, 'second virial coefficients') + lines.join('\n') + '\n');
  }
  if (s.tables.viscosity) {
    const lines = ['T (K),eta (uPa s),u(eta) (uPa s)'];
    for (const T of s.tables.viscosity) {
      const model = viscosityWithGradient(T, epsilonK, sigmaAngstrom, molarMassGPerMol).viscosityMicroPaS;
      const u = 0.005 * model;
      const departure = 1 + s.hidden.viscosityDepartureRelative * Math.log(T / 300);
      lines.push(`${T},${(model * departure + u * gaussian()).toFixed(3)},${u.toFixed(3)}`);
    }
    out(`${s.file}-viscosity.csv`, header(s, 'dilute-gas viscosity') + lines.join('\n') + '\n');
  }
  if (s.tables.density) {
    // Written the way the laboratory's densimeter exports: °C and bar.
    const lines = ['T [°C],p [bar],rho [kg/m3],u(rho) [kg/m3]'];
    const sigmaM = sigmaAngstrom * 1e-10;
    for (const [T, pBar] of s.tables.density) {
      const tStar = T / epsilonK;
      const pStar = (pBar * 1e5 * sigmaM ** 3) / (epsilonK * BOLTZMANN_J_PER_K);
      const rhoStar = ljEosDensity(tStar, pStar).reducedDensity;
      const rho = (rhoStar * molarMassGPerMol * 1e-3) / (AVOGADRO_PER_MOL * sigmaM ** 3);
      const u = Math.max(0.002 * rho, 0.05);
      lines.push(`${(T - 273.15).toFixed(2)},${pBar},${(rho + u * gaussian()).toFixed(3)},${u.toFixed(3)}`);
    }
    out(`${s.file}-density.csv`, header(s, 'fluid densities') + lines.join('\n') + '\n');
  }
}
// Tables added later are written after the first ones, so the seeded scatter of the earlier tables does not change.
for (const s of DEMO_SUBSTANCES) {
  if (!s.tables.vle) continue;
  // Saturation from the Thol et al. (2016) LJ equation of state at the hidden parameters, written in kPa as the cell exports.
  const { epsilonK, sigmaAngstrom, molarMassGPerMol } = s.hidden;
  const sigmaM = sigmaAngstrom * 1e-10;
  const toMass = (rhoStar: number) => (rhoStar * molarMassGPerMol * 1e-3) / (AVOGADRO_PER_MOL * sigmaM ** 3);
  const lines = ['T (K),rho_liq (kg/m3),u(rho_liq) (kg/m3),rho_vap (kg/m3),u(rho_vap) (kg/m3),p_sat (kPa),u(p_sat) (kPa)'];
  for (const T of s.tables.vle) {
    const c = ljCoexistence(T / epsilonK);
    const liq = toMass(c.liquidDensity);
    const vap = toMass(c.vapourDensity);
    const pKPa = (c.saturationPressure * epsilonK * BOLTZMANN_J_PER_K) / sigmaM ** 3 / 1e3;
    const uLiq = 0.002 * liq;
    const uVap = 0.01 * vap;
    const uP = 0.005 * pKPa;
    lines.push(
      `${T},${(liq + uLiq * gaussian()).toFixed(2)},${uLiq.toFixed(2)},${(vap + uVap * gaussian()).toFixed(4)},${uVap.toFixed(4)},${(pKPa + uP * gaussian()).toFixed(3)},${uP.toFixed(3)}`,
    );
  }
  out(`${s.file}-vle.csv`, header(s, 'vapour-liquid equilibrium (saturated densities and vapour pressure)') + lines.join('\n') + '\n');
}
for (const m of DEMO_MIXTURES) {
  const [a, b] = m.substances.map((name) => DEMO_SUBSTANCES.find((s) => s.name === name)!.hidden);
  const lines = ['T (K),B12 (cm3/mol),u(B12) (cm3/mol)'];
  for (const T of m.temperatures) {
    const model = crossB2(T, a, b, m.hidden.kij);
    const u = Math.max(0.5, 0.015 * Math.abs(model));
    lines.push(`${T},${(model + u * gaussian()).toFixed(2)},${u.toFixed(2)}`);
  }
  out(
    `${m.file}.csv`,
    `# Invented demonstration data (Quillmoor Chemicals, Fenwick Thermophysics Laboratory): ${m.substances.join(' + ')}, cross second virial coefficients B12. Not a real measurement.\n` +
      lines.join('\n') +
      '\n',
  );
}
console.log(`wrote demo tables for ${DEMO_SUBSTANCES.map((s) => s.name).join(', ')}`);
