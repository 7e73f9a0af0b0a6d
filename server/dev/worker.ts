import { runWorkers } from '../analyses/worker-process';

/** `npm run worker`: extra analysis-job workers against DATABASE_URL (the same database as the app). */
export async function main(): Promise<void> {
  if (!process.env.DATABASE_URL) throw new Error('set DATABASE_URL to the database the app uses (npm start prints it)');
  await runWorkers();
}
