import type { Config } from './config';
import type { Database } from './db/client';
import type { MailService } from './mail/mail-service';

/** What every feature's routes and services are given: the database, the settings and the mailer. */
export interface AppContext { db: Database; config: Config; mail: MailService }
