import { loadConfig } from '../config';
import { openDatabase } from '../db/client';
import { keepRunningOnStrayRejections } from '../main';
import { AnalysisJobs, jobTiming } from './analysis-jobs';

/** `npm run worker`: a process that only takes analysis jobs from the shared PostgreSQL queue. */
export async function runWorkers(): Promise<void> {
  keepRunningOnStrayRejections();
  const config = loadConfig();
  const database = openDatabase(config.databaseUrl, 4, 'parallax-worker');
  const jobs = new AnalysisJobs(database.db, config.databaseUrl, jobTiming(config.analysisStaleSeconds, config.analysisThreads));
  await jobs.start({ work: true });
  console.log('[parallax] analysis worker is taking jobs; Ctrl-C stops it');
  const stop = async () => {
    await jobs.stop();
    await database.close();
    process.exit(0);
  };
  process.once('SIGINT', () => void stop());
  process.once('SIGTERM', () => void stop());
}
