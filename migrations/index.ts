import type { Migration } from 'kysely';
import * as m20261201_0001 from './20261201_0001_people_sessions_audit';
import * as m20261201_0002 from './20261201_0002_substances_datasets';
import * as m20261201_0003 from './20261201_0003_jobs_fits';
import * as m20261201_0004 from './20261201_0004_parameter_sets';
import * as m20261201_0005 from './20261201_0005_mail_follows';
import * as m20261201_0006 from './20261201_0006_tokens_preferences';
import * as m20261202_0007 from './20261202_0007_session_hash_sign_in_failures';
import * as m20261202_0008 from './20261202_0008_simulation_frames';
import * as m20261202_0009 from './20261202_0009_job_queue_dispatch';
import * as m20261202_0010 from './20261202_0010_notices';
import * as m20261202_0012 from './20261202_0012_pair_sets';
import * as m20261202_0013 from './20261202_0013_mie_parameter_sets';
import * as m20261202_0014 from './20261202_0014_measurement_set_vocabulary';

/**
 * Every migration, by name, in the order they run. Listed statically so the same code runs under
 * tsx, vitest and a bundler; tests/unit/migrations.test.ts checks that no file is missing here.
 */
export const MIGRATIONS: Record<string, Migration> = {
  '20261201_0001_people_sessions_audit': m20261201_0001,
  '20261201_0002_substances_datasets': m20261201_0002,
  '20261201_0003_jobs_fits': m20261201_0003,
  '20261201_0004_parameter_sets': m20261201_0004,
  '20261201_0005_mail_follows': m20261201_0005,
  '20261201_0006_tokens_preferences': m20261201_0006,
  '20261202_0007_session_hash_sign_in_failures': m20261202_0007,
  '20261202_0008_simulation_frames': m20261202_0008,
  '20261202_0009_job_queue_dispatch': m20261202_0009,
  '20261202_0010_notices': m20261202_0010,
  '20261202_0012_pair_sets': m20261202_0012,
  '20261202_0013_mie_parameter_sets': m20261202_0013,
  '20261202_0014_measurement_set_vocabulary': m20261202_0014,
};
