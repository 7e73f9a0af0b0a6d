import type { LabelCheck } from '@shared/schemas';
import { labelKey, namedLabels, repeatsSentence } from '@shared/types/repeated-labels';

/** The study's distinct label keys (labelKey), empty labels left out. */
export const studyKeys = (labels: readonly string[]): Set<string> => new Set(labels.map(labelKey).filter((k) => k !== ''));

/**
 * What importing one column of a file as the specimen label would repeat (labels compared as repeated-labels.ts
 * says: trimmed, any case; empty labels never repeat):
 * - file rows whose label the study already has, by any of its rows, excluded ones too (appending them would enter
 *   those specimens again): "1 row repeats a label already in the study (S01)", "45 rows repeat labels already in
 *   the study (S001, S002, S003, S004, S005 and 40 more)";
 * - labels the file itself repeats: "Labels B1, B2 appear more than once in the file (4 rows)";
 * - repeatsMostOfStudy: the file repeats more than half of the study's distinct labels, so it is most likely the
 *   study's rows again and replacing them is the safer default.
 * One pass over the column with a count per label (it runs for every column of files up to 10,000 × 200 cells).
 */
export function labelCheck(fileLabels: readonly string[], studyLabels: readonly string[] | ReadonlySet<string>): LabelCheck {
  const study = studyLabels instanceof Set ? studyLabels : studyKeys(studyLabels as readonly string[]);
  const seen = new Map<string, { label: string; rows: number }>();
  for (const label of fileLabels) {
    const key = labelKey(label);
    if (!key) continue;
    const entry = seen.get(key);
    if (entry) entry.rows++;
    else seen.set(key, { label: label.trim(), rows: 1 });
  }
  let studyRows = 0;
  const inStudy: string[] = [];
  const inFile: string[] = [];
  let fileRows = 0;
  for (const [key, entry] of seen) {
    if (study.has(key)) {
      studyRows += entry.rows;
      inStudy.push(entry.label);
    }
    if (entry.rows > 1) {
      fileRows += entry.rows;
      inFile.push(entry.label);
    }
  }
  const warnings: string[] = [];
  if (studyRows > 0) {
    const verb = studyRows === 1 ? '1 row repeats' : `${studyRows} rows repeat`;
    warnings.push(`${verb} ${inStudy.length === 1 ? 'a label' : 'labels'} already in the study (${namedLabels(inStudy)})`);
  }
  const fileSentence = repeatsSentence(inFile, fileRows, ' in the file');
  if (fileSentence) warnings.push(fileSentence);
  return { warnings, repeatsMostOfStudy: study.size > 0 && inStudy.length * 2 > study.size };
}

/** labelCheck for every column of a table, leaving out the columns that repeat nothing. */
export function labelChecks(columns: readonly string[], rows: readonly string[][], studyLabels: readonly string[]): Record<string, LabelCheck> {
  const checks: Record<string, LabelCheck> = {};
  const study = studyKeys(studyLabels);
  const column: string[] = new Array(rows.length);
  columns.forEach((name, i) => {
    for (let r = 0; r < rows.length; r++) column[r] = rows[r][i] ?? '';
    const check = labelCheck(column, study);
    if (check.warnings.length > 0) checks[name] = check;
  });
  return checks;
}
