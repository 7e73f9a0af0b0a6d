import { createHash, createHmac, randomBytes } from 'node:crypto';
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';

/** The server's secret that keys the history chains; the database never holds it. */
export interface AuditKey { id: string; secret: Buffer; source: string }

const DEFAULT_FILE = path.resolve(__dirname, '../../.data/audit-key');
let cached: AuditKey | null = null;

/**
 * The key from `AUDIT_KEY` (at least 32 characters; every process of one installation must share it),
 * or else from `AUDIT_KEY_FILE` (default `.data/audit-key`, git-ignored), created with 32 random bytes
 * on first start (mode 600). Someone who can write the database but not read this key cannot re-make
 * a chain's hashes after changing an event.
 */
export function auditKey(): AuditKey {
  if (cached) return cached;
  const given = process.env.AUDIT_KEY?.trim();
  let secret: Buffer;
  let source: string;
  if (given) {
    if (given.length < 32) throw new Error('configuration error: AUDIT_KEY must be at least 32 characters');
    secret = Buffer.from(given, 'utf8');
    source = 'AUDIT_KEY';
  } else {
    const file = process.env.AUDIT_KEY_FILE?.trim() || DEFAULT_FILE;
    secret = Buffer.from(readOrCreate(file), 'utf8');
    source = file;
  }
  cached = { id: createHash('sha256').update(secret).digest('hex').slice(0, 16), secret, source };
  return cached;
}

function readOrCreate(file: string): string {
  try {
    return readFileSync(file, 'utf8').trim();
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code !== 'ENOENT') throw err;
  }
  mkdirSync(path.dirname(file), { recursive: true });
  try {
    // 'wx': of two processes starting at once, one creates the key and the other reads it.
    writeFileSync(file, `${randomBytes(32).toString('hex')}\n`, { flag: 'wx', mode: 0o600 });
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code !== 'EEXIST') throw err;
  }
  return readFileSync(file, 'utf8').trim();
}

/** HMAC-SHA-256 of a text with the server key, hex. */
export const keyedHash = (text: string, key: AuditKey = auditKey()): string => createHmac('sha256', key.secret).update(text).digest('hex');
