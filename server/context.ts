import type { AnalysisJobs } from './analyses/analysis-jobs';
import type { Config } from './config';
import type { Database } from './db/client';
import type { MailService } from './mail/mail-service';

/** What every feature's routes and services are given: the database, the settings, the mailer and the job queue. */
export interface AppContext { db: Database; config: Config; mail: MailService; jobs: AnalysisJobs }
