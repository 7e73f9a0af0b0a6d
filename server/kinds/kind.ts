import type { SQL } from 'drizzle-orm';
import type { KindMeta } from '@shared/kinds/kind';
import type { analytes } from '../db/schema';
import type { Layout } from '../reports/layout';
import type { StudyReport } from '../reports/report-model';
import type { AnalysisInput } from '../specimens/input-hash';
import type { StoredRow } from '../specimens/input-hash';

export type Progress = (fraction: number) => void;

/** A study's settings as a kind reads them: those every study carries, and the kind's own (KindMeta.settings). */
export type { KindSettings } from '@shared/kinds/settings';
import type { KindSettings } from '@shared/kinds/settings';

/** A cell of the Results sheet of the full record's workbook. */
export type SheetCell = number | string | null;
export interface SheetLine { section: string; name: string; cells: Record<string, SheetCell>; formats?: Record<string, string>; words?: string }
export interface SheetColumn { header: string; key: string; width: number; numeric?: boolean }

/**
 * The server's half of a study kind (the shared half is its KindMeta): how it is analysed, what it needs before
 * submission, its part of the PDF, and its Results sheet (the CLI runs `analyse` too). The registry is server/kinds/index.ts;
 * everything else asks it and never names a kind.
 */
export interface ServerKind {
  meta: KindMeta;
  /** Settings a new study of this kind starts with, from its analyte (the caller's own settings win). */
  initialSettings(analyte: typeof analytes.$inferSelect): Record<string, unknown>;
  /** Runs the engine on a stored input (in a worker thread); throws with a message in words when it cannot. */
  analyse(input: AnalysisInput, onProgress: Progress): unknown;
  /** What this kind needs before it may be submitted, beyond what every study needs (current findings, reasons). */
  submissionProblems(settings: KindSettings, rows: StoredRow[]): { path: string; message: string }[];
  /** Stored results with the words of record-only settings the findings show (analyses/recorded-words.ts). */
  recordedWords?(results: Record<string, unknown>, settings: KindSettings): Record<string, unknown>;
  /**
   * The archive's overall verdict of stored results, as SQL over the column `results` (jsonb, never NULL here):
   * one of the kind's verdict keys (KindMeta.verdicts), or NULL when the findings reach none.
   */
  archiveVerdict: SQL;
  /** The report's body: its conclusion first, the sign-off and the plan, then the details. `results` is null without findings. */
  report(layout: Layout, report: StudyReport, results: unknown): void;
  /**
   * A few lines of the stored results' key figures in words, for the release dossier's block of this study
   * (server/releases): the figures a director weighs, e.g. the bias at each decision level with its CI.
   */
  keyFigures(results: unknown, unit: string, decimals: number): string[];
  /** Invented demo studies of this kind that the demo seed creates, analyses and takes as far as `finish` says. */
  demos?: readonly DemoStudy[];
  /** The Results sheet of the full record: its columns at a CI level, and its lines from stored results. */
  resultsSheet: { level(results: unknown): number; columns(level: number): SheetColumn[]; lines(results: unknown, unit: string, decimals: number): SheetLine[] };
}

/** An invented demo study of a kind (server/db/seed-studies.ts creates it through the services, as a person would). */
export interface DemoStudy {
  title: string;
  /** The demo laboratory's analyte and instrument(s) by name. */
  analyte: string;
  instrument: string;
  purpose: string;
  settings: Record<string, unknown>;
  rows: Record<string, unknown>[];
  /** How far it is taken: left a draft with findings, submitted, or signed with `signComment`. */
  finish: 'draft' | 'submitted' | 'signed';
  signComment?: string;
}
