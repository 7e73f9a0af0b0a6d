import type { InstrumentInfo } from '../reports/report-model';

/**
 * Everything the release PDF prints, as plain data (the server builds it from the database at signing, or for a
 * DRAFT preview). The renderer does no I/O and reads no clock: the same ReleaseReport always gives the same bytes.
 * Times are Date objects, printed in the laboratory's time zone.
 */
export interface ReleaseReport {
  laboratory: { name: string; timeZone: string };
  release: {
    id: number;
    title: string;
    /** "New measuring system", … (CHANGE_TYPE_LABELS). */
    changeTypeLabel: string;
    analyte: { name: string; unit: string };
    instrument: InstrumentInfo;
    comparativeInstrument: InstrumentInfo | null;
    reagentLot: string;
    note: string;
    createdBy: string;
    createdAt: Date;
  };
  /** The director's decision; null on a DRAFT preview. */
  decision: ReleaseDecision | null;
  requirements: ReleaseReportRequirement[];
  /** Re-verification this release sets due (from its go-live date). */
  due: { label: string; rule: string; dueDate: string }[];
  /** SHA-256 over the release and every component signature's content hash, 64 hex digits. */
  contentHash: string;
  verificationCode: string;
  draft: boolean;
  generatedAt: Date;
}

export interface ReleaseDecision {
  meaning: 'released' | 'not-released';
  /** "Released for patient testing" / "Not released for patient testing". */
  meaningWords: string;
  signerName: string;
  signedAt: Date;
  /** yyyy-mm-dd, or null when not given (always null for "not released"). */
  goLiveDate: string | null;
  comment: string;
}

export interface ReleaseReportRequirement {
  label: string;
  /** The rule the requirement follows, as the template notes it. */
  rule: string;
  /** The kinds of study that meet it, in words: "Method comparison". */
  kinds: string[];
  /** 'met', 'not-met', 'waived', 'missing', 'in-progress'. */
  status: string;
  /** "Met", "Waived", … (REQUIREMENT_STATUS_LABELS). */
  statusLabel: string;
  study: ReleaseReportStudy | null;
  waiver: { reason: string; by: string; at: Date } | null;
}

export interface ReleaseReportStudy {
  id: number;
  title: string;
  kindLabel: string;
  /** The archive's verdict word and sentence ("Within the goal", …), or null when the findings reach none. */
  verdictWord: string | null;
  verdictSentence: string | null;
  /** Included results. */
  n: number;
  /** The study's key figures in words (a few short lines), from its signed findings. */
  keyFigures: string[];
  signerName: string;
  signedAt: Date;
  /** "Accepted for patient testing" / "Not accepted for patient testing". */
  meaningWords: string;
  verificationCode: string;
  contentHash: string;
}
