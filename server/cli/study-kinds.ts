import { readFileSync } from 'node:fs';
import { KIND_METAS, kindMeta } from '@shared/kinds/kinds';
import { parseKindSettings } from '@shared/kinds/settings';
import { runAnalysis } from '../analyses/run-analysis';
import { analysedFields, analysedSettings, type AnalysisInput } from '../specimens/input-hash';
import { validateRows } from '../specimens/row-validation';
import { CsvError, type CsvTable } from './csv';
import { FlagError } from './flags';

/** The study kinds by their stored names ('method-comparison', 'precision', …): each runs as the server runs it. */
export const STUDY_KIND_NAMES: string[] = KIND_METAS.map((m) => m.kind);

/** Reads `--settings FILE.json`: the study's settings object, as the API stores it. */
export function readSettings(file: string): Record<string, unknown> {
  let text: string;
  try {
    text = readFileSync(file, 'utf8');
  } catch (error) {
    throw new FlagError(`--settings: cannot read ${file}: ${(error as NodeJS.ErrnoException).code ?? String(error)}`);
  }
  try {
    const parsed = JSON.parse(text) as unknown;
    if (typeof parsed !== 'object' || parsed === null || Array.isArray(parsed)) throw new Error('not an object');
    return parsed as Record<string, unknown>;
  } catch (error) {
    throw new FlagError(`--settings: ${file} is not a JSON object (${(error as Error).message})`);
  }
}

/**
 * Runs a study kind on a CSV whose columns are named as the kind's row fields (shared/kinds/<kind>/meta.ts, e.g.
 * `material,day,replicate,value` for precision; `excluded`, `exclusionReason` and `note` optional), with the study's
 * settings: the rows are checked as the API checks them (a bad cell names its CSV row and field), then analysed by
 * the same code as a stored study (server/kinds). Results may be negative; the decimal mark is the point.
 */
export function runStudyKind(kind: string, table: CsvTable, settings: Record<string, unknown>): unknown {
  let parsed;
  try {
    parsed = parseKindSettings(kind, settings);
  } catch (error) {
    const issue = (error as { issues?: { path: (string | number)[]; message: string }[] }).issues?.[0];
    if (issue) throw new FlagError(`--settings: ${issue.path.join('.') || 'settings'}: ${issue.message}`);
    throw error;
  }
  const fields = [...kindMeta(kind).rowFields.map((f) => f.field), 'excluded', 'exclusionReason', 'note'];
  const unknown = table.header.find((c) => !fields.includes(c));
  if (unknown !== undefined) throw new CsvError(`column "${unknown}" is not a field of ${kind} rows; the columns are ${fields.join(', ')}`);
  const raw = table.rows.map((r) => {
    const row: Record<string, unknown> = {};
    table.header.forEach((c, i) => {
      const cell = r.cells[i] ?? '';
      if (c === 'excluded') row.excluded = ['1', 'true', 'yes', 'y'].includes(cell.trim().toLowerCase());
      else row[c] = cell === '' && c !== 'note' ? null : cell;
    });
    return row;
  });
  const { rows, issues } = validateRows(kind, raw, true, 'point');
  if (issues.length) {
    const first = issues[0].message.replace(/^row (\d+)/, (_, n) => `row ${n} (line ${table.rows[Number(n) - 1]?.line ?? '?'})`);
    throw new CsvError(first);
  }
  const input: AnalysisInput = {
    kind,
    settings: analysedSettings(parsed, kind),
    rows: rows.map((r, i) => analysedFields({ ...r, position: i + 1 })),
  };
  try {
    return runAnalysis(input);
  } catch (error) {
    if (error instanceof Error && error.constructor === Error) throw new CsvError(error.message);
    throw error;
  }
}
