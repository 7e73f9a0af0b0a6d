import { parseKindSettings } from '@shared/kinds/settings';
import { serverKind } from '../kinds';
import { repeatedLabels, repeatedLabelsSentence } from '@shared/types/repeated-labels';
import type { Executor } from '../db/client';
import { loadRows } from '../specimens/input-hash';
import type { StudyRow } from '../studies/studies.repository';
import { findingsOf } from '../studies/study-view';

/** Reasons a draft cannot be submitted yet, in words; empty when it can. */
export async function submissionProblems(db: Executor, study: StudyRow): Promise<{ path: string; message: string }[]> {
  const problems: { path: string; message: string }[] = [];
  const s = parseKindSettings(study.kind, study.settings);
  const findings = await findingsOf(db, study);
  if (findings.status !== 'current') {
    problems.push({ path: 'findings', message: findings.status === 'none' ? 'Run the analysis first' : 'The findings are out of date or not finished; run the analysis again' });
  }
  const rows = await loadRows(db, study.id);
  for (const r of rows) if (r.excluded && !r.exclusionReason) problems.push({ path: `rows.${r.position - 1}.exclusionReason`, message: `row ${r.position}: excluded without a reason` });
  // Unresolved repeats: two or more included rows with one label (trimmed, any case); excluding a row resolves its repeat.
  const repeats = repeatedLabelsSentence(repeatedLabels(rows), ' among the included rows');
  if (repeats) problems.push({ path: 'rows', message: `${repeats}; give each specimen its own label, or exclude the extra rows with a reason` });
  // What the kind itself needs (server/kinds/<kind>): goals, a stated interval, a population, materials with claims.
  problems.push(...serverKind(study.kind).submissionProblems(s, rows));
  return problems;
}
