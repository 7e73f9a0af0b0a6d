import { spawn, spawnSync, SpawnOptions } from 'node:child_process';

/** Runs a command to completion; throws with its name when it fails. */
export function runSync(cmd: string, args: string[], options: SpawnOptions = {}): string {
  const r = spawnSync(cmd, args, { encoding: 'utf8', ...options });
  if (r.error) throw new Error(`${cmd} could not start: ${r.error.message}`);
  if (r.status !== 0) {
    throw new Error(`${cmd} ${args.join(' ')} failed (exit ${r.status}):\n${(r.stderr || r.stdout || '').toString().trim()}`);
  }
  return (r.stdout ?? '').toString();
}

/** Runs a command with inherited output and resolves with its exit code. */
export function runInherit(cmd: string, args: string[], options: SpawnOptions = {}): Promise<number> {
  return new Promise((resolve, reject) => {
    const child = spawn(cmd, args, { stdio: 'inherit', ...options });
    child.on('error', reject);
    child.on('exit', (code, signal) => resolve(code ?? (signal ? 1 : 0)));
  });
}

export const isRoot = (): boolean => typeof process.getuid === 'function' && process.getuid() === 0;

export const log = (message: string): void => console.log(`[parallax] ${message}`);
