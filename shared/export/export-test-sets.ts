/**
 * Parameter sets used by the export tests. Invented values of the Quillmoor demo scenario (not published
 * data); the tests check conversions and formats, not these numbers.
 */
import type { ExportableParameterSet } from './parameter-set-export';

export const brindleShifted: ExportableParameterSet = {
  id: 12,
  version: 3,
  substance: { id: 1, name: 'Brindle gas', formula: 'Bd', molarMassGPerMol: 41.25 },
  model: 'lj-12-6',
  epsilonK: 127.5,
  sigmaAngstrom: 3.42,
  stdErr: { epsilonK: 0.4, sigmaAngstrom: 0.003 },
  correlation: -0.82,
  scheme: 'truncated-shifted',
  cutoffSigma: 2.5,
  validity: { temperatureMinK: 90, temperatureMaxK: 300, pressureMinMPa: 0.1, pressureMaxMPa: 10 },
  approvedAt: '2026-11-30T10:00:00Z',
  approvedBy: 'R. Ostrova',
  state: 'approved',
  fitId: 7,
  measurementSets: [
    { id: 4, version: 2, kind: 'b2', name: 'Brindle gas B2, Quillmoor cell A', source: 'Quillmoor lab notebook 3', doi: null },
    { id: 5, version: 1, kind: 'viscosity', name: 'Brindle gas dilute-gas viscosity', source: null, doi: '10.0000/quillmoor.example.5' },
  ],
};

export const oskaneTail: ExportableParameterSet = {
  ...brindleShifted,
  id: 15,
  version: 1,
  substance: { id: 2, name: 'Oskane', formula: 'Ok', molarMassGPerMol: 83.25 },
  epsilonK: 171,
  sigmaAngstrom: 3.6,
  stdErr: { epsilonK: null, sigmaAngstrom: null },
  correlation: null,
  scheme: 'truncated-tail',
  cutoffSigma: 3,
  validity: { temperatureMinK: 120, temperatureMaxK: 400 },
  fitId: 9,
  measurementSets: [],
};

export const tarrowFull: ExportableParameterSet = {
  ...brindleShifted,
  id: 21,
  version: 1,
  substance: { id: 3, name: 'Tarrow bead (united atom)', formula: 'Tw', molarMassGPerMol: 16.25 },
  epsilonK: 148.6,
  sigmaAngstrom: 3.758,
  scheme: 'full-potential',
  cutoffSigma: null,
  validity: { temperatureMinK: 200, temperatureMaxK: 500, pressureMinMPa: null, pressureMaxMPa: null },
  fitId: 11,
  measurementSets: [
    { id: 8, version: 1, kind: 'b2', name: 'Tarrow bead B2, Quillmoor cell B', source: 'Quillmoor lab notebook 5', doi: null },
  ],
};

/** Same scheme and cutoff as brindleShifted, so a mixture of the two is consistent. */
export const oskaneShifted: ExportableParameterSet = {
  ...oskaneTail,
  id: 16,
  scheme: 'truncated-shifted',
  cutoffSigma: 2.5,
  validity: { temperatureMinK: 120, temperatureMaxK: 400, pressureMinMPa: 0.5, pressureMaxMPa: 20 },
};
