import { readFileSync } from 'node:fs';
import { join } from 'node:path';

/** Reads a committed fixture (made once by make-fixtures/; see README.md). */
export function fixture<T = any>(name: string): T {
  return JSON.parse(readFileSync(join(__dirname, 'fixtures', name), 'utf8')) as T;
}

export function dataFile(...parts: string[]): string {
  return readFileSync(join(__dirname, 'data', ...parts), 'utf8');
}

/**
 * A NIST StRD univariate file: in NIST's .dat layout (the data after "Data: Y"), or in the commented layout
 * of the shared copy of Lew ("mean = ...", "standardDeviation = ...", the data after the "# Data" block).
 */
export function nistUnivariate(name: string): { values: number[]; mean: number; sd: number } {
  const text = dataFile('nist-strd-univariate', `${name}.txt`);
  const lines = text.split(/\r?\n/);
  if (/^standardDeviation\s*=/m.test(text)) {
    const after = lines.findIndex((l) => /^#\s*Data\s*$/.test(l));
    return {
      values: lines.slice(after + 1).map((l) => l.trim()).filter((l) => /^[-+]?\d/.test(l)).map(Number),
      mean: Number(/^mean\s*=\s*(\S+)/m.exec(text)![1]),
      sd: Number(/^standardDeviation\s*=\s*(\S+)/m.exec(text)![1]),
    };
  }
  const start = lines.findIndex((l) => /^\s*Data:\s*Y/.test(l));
  const values = lines.slice(start + 1).map((l) => l.trim()).filter((l) => /^[-+]?\d/.test(l)).map(Number);
  const mean = Number(/Sample Mean\s+ybar:\s+(\S+)/.exec(text)![1]);
  const sd = Number(/Sample Standard Deviation.*s:\s+(\S+)/.exec(text)![1]);
  return { values, mean, sd };
}

/** Correct significant digits of a computed value against a certified one (NIST's LRE), capped at 15. */
export function logRelativeError(computed: number, certified: number): number {
  if (computed === certified) return 15;
  return Math.min(15, -Math.log10(Math.abs(computed - certified) / Math.abs(certified)));
}
