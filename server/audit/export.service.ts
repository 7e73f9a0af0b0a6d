import { serverKind } from '../kinds';
import ExcelJS from 'exceljs';
import { and, desc, eq } from 'drizzle-orm';
import { StudySettings, type ArchiveQuery } from '@shared/schemas';
import { withRecordedWords } from '../analyses/recorded-words';
import type { SignedInUser } from '../auth/session-user';
import type { Database } from '../db/client';
import { labTimeZone } from '../db/lab-zone';
import { laboratoryTime } from '@shared/types/lab-time';
import { analyses } from '../db/schema';
import { listSignatures } from '../signoff/report.service';
import { loadRows } from '../specimens/input-hash';
import { findStudy } from '../studies/studies.repository';
import { studyView } from '../studies/study-view';
import { searchArchive } from './archive.service';
import { studyHistory } from './history.service';
import { resultsSheet } from './results-sheet';
import type { FindingsStatus } from '@shared/schemas';
import { scopeOf } from '../db/lab-scope';

/** Whether the exported findings still match the study's rows and settings, in words. */
const FINDINGS_WORDS: Record<FindingsStatus, string> = {
  none: 'No analysis yet',
  queued: 'An analysis is queued',
  running: 'An analysis is running',
  current: 'Current: they match the rows and settings as they are now',
  'out-of-date': 'Out of date: rows or settings changed after this analysis',
  failed: 'The latest analysis failed; see its error on the study',
};

/**
 * Text that a spreadsheet could take for a formula (it begins with =, +, -, @, or a tab or carriage
 * return) is written with a leading apostrophe, so no spreadsheet evaluates what a user typed into a
 * label, note or comment (the OWASP advice against formula injection). Numbers, and results kept as
 * text such as "-0.4", stay as they are: a plain number is no formula.
 */
export const inertText = (v: unknown): unknown =>
  typeof v === 'string' && /^[=+\-@\t\r]/.test(v) && !/^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i.test(v) ? `'${v}` : v;

function sheet(wb: ExcelJS.Workbook, name: string, columns: [string, string, number][], rows: Record<string, unknown>[]) {
  const ws = wb.addWorksheet(name);
  ws.columns = columns.map(([header, key, width]) => ({ header, key, width }));
  ws.getRow(1).font = { bold: true };
  ws.views = [{ state: 'frozen', ySplit: 1 }];
  rows.forEach((r) => ws.addRow(Object.fromEntries(Object.entries(r).map(([k, v]) => [k, inertText(v)]))));
  return ws;
}

/**
 * Every time is exported twice, side by side: as the laboratory reads it, with its zone named
 * ("2026-12-02 09:14 America/Halifax (UTC−04:00)"), and as the UTC instant in ISO 8601.
 */
const timeColumns = (header: string, key: string): [string, string, number][] => [[`${header} (laboratory time)`, `${key}Local`, 38], [`${header} (UTC)`, key, 26]];
function localTimes<T extends object>(row: T, keys: (keyof T & string)[], zone: string): Record<string, string> {
  return Object.fromEntries(keys.map((k) => [`${k}Local`, laboratoryTime(row[k] as string | null, zone)]));
}

const buffer = async (wb: ExcelJS.Workbook) => Buffer.from(await wb.xlsx.writeBuffer());

function newBook(): ExcelJS.Workbook {
  const wb = new ExcelJS.Workbook();
  wb.creator = 'Parallax';
  wb.created = new Date(0);
  return wb;
}

/** The archive result list (same filters as the page, every match, not one page). */
export async function exportArchive(db: Database, me: SignedInUser, q: ArchiveQuery): Promise<Buffer> {
  const all = await searchArchive(db, me, { ...q, page: 1, pageSize: 100_000 });
  const zone = await labTimeZone(db, scopeOf(me));
  const wb = newBook();
  sheet(wb, 'Studies', [
    ['Study', 'id', 8], ['Kind', 'kind', 20], ['Title', 'title', 44], ['Analyte', 'analyte', 16], ['Instruments', 'instruments', 32], ['n', 'n', 6],
    ['State', 'state', 16], ['Verdict', 'verdict', 14], ['Signed by', 'signerName', 22], ['Meaning', 'meaning', 14], ...timeColumns('Signed at', 'signedAt'),
    ...timeColumns('Created', 'createdAt'), ['Superseded', 'superseded', 11], ['Supersedes', 'supersedesId', 11],
  ], all.items.map((i) => ({ ...i, ...localTimes(i, ['signedAt', 'createdAt'], zone), superseded: i.superseded ? 'yes' : 'no' })));
  return buffer(wb);
}

/** Flattens a results object to path → value rows (histogram bins left out: they are plot data). */
function flatten(v: unknown, path = '', out: { field: string; value: unknown }[] = []) {
  if (v && typeof v === 'object') {
    if (path.endsWith('bins')) return out;
    for (const [k, x] of Object.entries(v)) flatten(x, Array.isArray(v) ? `${path}[${k}]` : path ? `${path}.${k}` : k, out);
  } else out.push({ field: path, value: v ?? '' });
  return out;
}

/**
 * One study's whole record: settings, rows with exclusions and reasons, the results laid out as a report
 * (results-sheet.ts) and every stored result field, signatures, history.
 */
export async function exportStudy(db: Database, me: SignedInUser, studyId: number): Promise<Buffer> {
  const row = await findStudy(db, scopeOf(me), studyId);
  const study = await studyView(db, row, me);
  const wb = newBook();
  const about = [
    ['Study', study.id], ['Kind', study.kind], ['Title', study.title], ['Purpose', study.purpose], ['Analyte', `${study.analyte.name} (${study.analyteUnit})`],
    ['Instruments', study.instruments], ['State', study.state], ['Version', study.version], ['Supersedes', study.supersedesId ?? ''],
    ...Object.entries(StudySettings.parse(row.settings)).map(([k, v]) => [`setting: ${k}`, Array.isArray(v) ? v.join(', ') : v ?? '']),
  ];
  sheet(wb, 'Study', [['Field', 'field', 30], ['Value', 'value', 70]], about.map(([field, value]) => ({ field, value })));
  sheet(wb, 'Rows', [
    ['#', 'position', 6], ['Specimen', 'label', 14], ['Comparative', 'comparativeText', 12], ['Candidate', 'candidateText', 12], ['Value', 'valueText', 10],
    ['Sex', 'sex', 6], ['Age band', 'ageBand', 10], ['Excluded', 'excluded', 9], ['Exclusion reason', 'exclusionReason', 36], ['Note', 'note', 30], ['Upload', 'uploadId', 8],
  ], (await loadRows(db, studyId)).map((r) => ({ ...r, excluded: r.excluded ? 'yes' : 'no' })));
  const signatureRows = await listSignatures(db, me, studyId);
  const signedId = signatureRows.filter((s) => s.meaning !== 'plan-approved').pop()?.analysisId;
  const [analysis] = signedId
    ? await db.select().from(analyses).where(eq(analyses.id, signedId))
    : await db.select().from(analyses).where(and(eq(analyses.studyId, studyId), eq(analyses.purpose, 'findings'))).orderBy(desc(analyses.id)).limit(1);
  const settings = StudySettings.parse(row.settings);
  const results = withRecordedWords(analysis?.results ?? null, row.settings);
  resultsSheet(wb, serverKind(study.kind), results, {
    unit: settings.unit || study.analyteUnit, decimals: settings.decimals,
    heading: {
      analysis: !analysis ? 'None: the study has not been analysed' : signedId ? `Analysis ${analysis.id}, the one the signature binds` : `Analysis ${analysis.id}, the latest`,
      findings: FINDINGS_WORDS[study.findings],
    },
  });
  sheet(wb, 'All result fields', [['Field', 'field', 50], ['Value', 'value', 40]], [
    { field: 'analysis', value: analysis?.id ?? '(none)' }, { field: 'engine version', value: analysis?.engineVersion ?? '' },
    { field: 'seed', value: analysis?.seed ?? '' }, { field: 'resamples', value: analysis?.resamples ?? '' }, { field: 'input hash', value: analysis?.inputHash ?? '' },
    ...flatten(results ?? {}),
  ]);
  const zone = await labTimeZone(db, scopeOf(me));
  sheet(wb, 'Signatures', [['Meaning', 'meaningWords', 30], ['Signed by', 'signerName', 24], ...timeColumns('Signed at', 'signedAt'), ['Comment', 'comment', 40], ['Content hash', 'contentHash', 70], ['Verification code', 'verificationCode', 16], ['PDF SHA-256', 'pdfSha256', 70]], signatureRows.map((s) => ({ ...s, ...localTimes(s, ['signedAt'], zone) })));
  const history = await studyHistory(db, me, studyId);
  sheet(wb, 'Audit history', [...timeColumns('Time', 'at'), ['Who', 'userName', 22], ['What', 'headline', 50], ['Details', 'details', 90]], history.map((h) => ({ ...h, ...localTimes(h, ['at'], zone), details: h.details.join('\n') })));
  return buffer(wb);
}
