import type { Logger } from 'pino';
import type { Config } from './config';
import type { Db } from './db/database';
import type { DerivativeJobs } from './jobs/job-boss';
import type { Mailer } from './mail/mailer';
import type { Storage } from './storage/storage';

/** What the app is built from; tests pass their own. */
export interface AppDeps {
  db: Db;
  storage: Storage;
  config: Config;
  logger: Logger;
  /** Where uploads send their derivative jobs (pg-boss in the server; the same in API tests). */
  jobs: DerivativeJobs;
  /** Where mails go; createApp makes one over SMTP_URL when none is given. */
  mailer?: Mailer;
}
