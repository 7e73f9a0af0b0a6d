import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';

/** The command line is a contract other tools rely on: tests run it as they would, in a child process. */
const root = path.resolve(__dirname, '../..');

/** A scratch folder for a test file's inputs; `file(name, text)` writes one and returns its path. */
export function scratchFiles(prefix: string): (name: string, text: string) => string {
  const dir = mkdtempSync(path.join(tmpdir(), prefix));
  return (name, text) => {
    const p = path.join(dir, name);
    writeFileSync(p, text);
    return p;
  };
}

/** `npm run analyze -- ARGS` in a child process: its status, stdout and stderr. */
export const analyze = (...args: string[]) =>
  spawnSync(path.join(root, 'node_modules/.bin/tsx'), [path.join(root, 'server/cli/analyze.ts'), ...args], { encoding: 'utf8', cwd: root });
