import type { Generated } from 'kysely';

export interface FitTable {
  id: Generated<number>;
  substanceId: number;
  number: number;
  jobId: number;
  model: string;
  measurementSetsJson: string;
  optionsJson: string;
  codeVersion: string;
  createdBy: string;
  createdAt: string;
}
