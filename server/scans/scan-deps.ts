import type { Db } from '../db/database';
import type { DerivativeJobs } from '../jobs/job-boss';
import type { Storage } from '../storage/storage';

/** What the scan services work with. */
export interface ScanDeps {
  db: Db;
  storage: Storage;
  jobs: DerivativeJobs;
}
