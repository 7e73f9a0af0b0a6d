import type { AnalysisJobs } from './analyses/analysis-jobs';
import type { Config } from './config';
import type { Pool } from 'pg';
import type { Database } from './db/client';
import type { MailService } from './mail/mail-service';

/** What every feature's routes and services are given: the database (and its pool), the settings, the mailer and the job queue. */
export interface AppContext { db: Database; pool: Pool; config: Config; mail: MailService; jobs: AnalysisJobs }
