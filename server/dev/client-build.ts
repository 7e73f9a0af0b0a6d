import path from 'node:path';
import { log, runInherit } from './run';

const root = path.resolve(__dirname, '../..');

/** Builds the Angular client into dist/client (production configuration). */
export async function buildClient(): Promise<boolean> {
  log('building the client (ng build) ...');
  const code = await runInherit(path.join(root, 'node_modules/.bin/ng'), ['build'], {
    cwd: root,
    env: { ...process.env, NG_CLI_ANALYTICS: 'false', NG_FORCE_TTY: 'false' },
  });
  if (code !== 0) log(`the client build failed (exit ${code})`);
  return code === 0;
}
