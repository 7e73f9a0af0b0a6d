import { DestroyRef, Injectable, computed, effect, inject, signal, untracked } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { Observable, Subject, Subscription, debounceTime, map, tap, timer } from 'rxjs';
import type { SpecimenRows } from '@shared/schemas';
import type { DecimalMark } from '@shared/schemas/result-text';
import { ApiError } from '../../../core/http/api-error';
import { SpecimensApi } from '../api/specimens-api';
import { StudyStore } from '../study/study-store';
import { PasteOutcome, PasteTarget, applyPaste } from './apply-paste';
import { normaliseDecimal, rewriteForMark } from './result-number';
import { EMPTY_HISTORY, EditHistory, deleteRows, insertRow, moveRow, recordEdit, redoEdit, setCell, undoEdit } from './row-edits';
import { RowIssue, SentRows, rowsToSend } from './rows-to-send';
import { refusalOf } from './save-refusal';
import { SaveStatus, retryDelay } from './save-status';
import { COMPARISON_LAYOUT, GridRow, SpecimenLayout, blankRow, fromStored } from './specimen-layout';

/** The pause in typing after which changes are saved. */
export const AUTOSAVE_DEBOUNCE_MS = 800;

interface SpecimensState {
  studyId: number | null;
  version: number;
  rows: GridRow[];
  loading: boolean;
  loadError: string | null;
  status: SaveStatus;
  message: string | null;
  issues: RowIssue[];
  retryAt: number | null;
  /** The decimal mark the rows' results are written with: the study's (settings.decimalMark). */
  decimalMark: DecimalMark;
  /** The steps Undo and Redo walk through (edits on this page since the rows were loaded or imported). */
  history: EditHistory;
}

const INITIAL: SpecimensState = {
  studyId: null, version: 0, rows: [], loading: false, loadError: null, status: 'saved', message: null, issues: [], retryAt: null,
  decimalMark: 'auto', history: EMPTY_HISTORY,
};

/**
 * The specimen rows of one study, kept on screen as typed, and saved by themselves: after a pause in
 * typing, the whole list goes to PUT /specimens with the version it was edited from. Nothing typed is
 * lost when a save fails: a refused row waits for the next edit, a network failure retries with growing
 * pauses, and a conflict (someone else saved first) keeps the rows until the user chooses to reload.
 */
@Injectable()
export class SpecimensStore {
  private readonly api = inject(SpecimensApi);
  private readonly study = inject(StudyStore, { optional: true });
  private readonly state = signal<SpecimensState>(INITIAL);
  private layoutOf: SpecimenLayout = COMPARISON_LAYOUT;
  private readonly changes = new Subject<void>();
  private revision = 0;
  private savedRevision = 0;
  private inFlight: Subscription | null = null;
  private retry: Subscription | null = null;
  private failures = 0;

  readonly rows = computed(() => this.state().rows);
  readonly loading = computed(() => this.state().loading);
  readonly loadError = computed(() => this.state().loadError);
  readonly status = computed(() => this.state().status);
  readonly message = computed(() => this.state().message);
  readonly issues = computed(() => this.state().issues);
  readonly retryAt = computed(() => this.state().retryAt);
  readonly version = computed(() => this.state().version);
  readonly dirty = computed(() => this.state().status !== 'saved');
  /** How the rows' results are written and read (the study's decimal mark); the grid checks cells with it. */
  readonly decimalMark = computed(() => this.state().decimalMark);
  readonly canUndo = computed(() => this.state().history.past.length > 0);
  readonly canRedo = computed(() => this.state().history.future.length > 0);
  private readonly studyMark = computed<DecimalMark>(() => this.study?.study()?.settings?.decimalMark ?? 'auto');

  constructor() {
    this.changes.pipe(debounceTime(AUTOSAVE_DEBOUNCE_MS), takeUntilDestroyed()).subscribe(() => this.save());
    // A Setup save on this page moves the shared version; rows edited from the old one may follow it.
    this.study?.versionMoves.pipe(takeUntilDestroyed()).subscribe(({ from, to }) =>
      this.state.update((s) => (s.version === from ? { ...s, version: to } : s)),
    );
    // The study's decimal mark changed (Setup): the same numbers, written for the new mark, so nothing is re-read differently.
    effect(() => {
      const mark = this.studyMark();
      untracked(() => this.useMark(mark));
    });
    inject(DestroyRef).onDestroy(() => {
      this.retry?.unsubscribe();
      if (this.revision !== this.savedRevision && this.state().status !== 'conflict') this.save();
    });
  }

  get layout(): SpecimenLayout {
    return this.layoutOf;
  }

  /** Reads the rows of a study from the server; what is on screen is replaced. */
  load(studyId: number, layout: SpecimenLayout = COMPARISON_LAYOUT): Observable<void> {
    this.layoutOf = layout;
    this.retry?.unsubscribe();
    this.state.update((s) => ({ ...s, studyId, loading: true, loadError: null }));
    return this.api.get(studyId).pipe(
      tap({
        next: (answer) => this.adopt(answer),
        error: (err: ApiError) => this.state.update((s) => ({ ...s, loading: false, loadError: err.message })),
      }),
      map(() => undefined),
    );
  }

  /** Loads the rows unless this study's rows are already here (or on their way), so tabs share them. */
  ensureLoaded(studyId: number, layout: SpecimenLayout): void {
    const s = this.state();
    if (s.studyId === studyId && (s.loading || s.version > 0)) return;
    this.load(studyId, layout).subscribe({ error: () => undefined });
  }

  /** Rows imported from a file: the server's answer replaces the grid, and the study follows the new version. */
  imported(answer: SpecimenRows): void {
    const from = this.state().version;
    this.adopt(answer);
    this.study?.followVersion(from, answer.version);
  }

  /** Takes rows the server answered (after a load or an import) as the saved state. */
  adopt(answer: SpecimenRows): void {
    this.revision = this.savedRevision = this.revision + 1;
    this.failures = 0;
    const mark = untracked(this.studyMark);
    const rows = this.rewritten(answer.rows.map((row) => fromStored(row, this.layoutOf)), 'point', mark);
    // An empty study shows one blank row, so there is a cell to click and paste into (blank rows are not sent).
    if (rows.length === 0) rows.push(blankRow(this.layoutOf));
    this.state.update((s) => ({
      ...s, version: answer.version, rows, decimalMark: mark, history: EMPTY_HISTORY,
      loading: false, status: 'saved', message: null, issues: [], retryAt: null,
    }));
  }

  /** Puts back a whole list of rows (Undo after a delete). */
  replaceRows(rows: GridRow[]): void {
    this.change([...rows]);
  }

  /** One edited cell; a result that reads is kept written with the study's decimal mark, as a paste would be. */
  setCell(uid: number, field: string, value: string | boolean): void {
    const kind = this.layoutOf.fields.find((f) => f.field === field)?.kind;
    const mark = this.decimalMark();
    const written = kind === 'result' && typeof value === 'string' ? normaliseDecimal(value, mark) : value;
    if (this.rows().find((row) => row.uid === uid)?.[field] === written) return;
    this.change(setCell(this.rows(), uid, field, written));
  }

  /**
   * Steps back one change (a typed cell, a paste, a deletion...); the rows as they were are saved the way
   * any edit is. False when there is nothing to undo.
   */
  undo(): boolean {
    const step = undoEdit(this.state().history, this.rows());
    if (step) this.change(step.rows, step.history);
    return step !== null;
  }

  /** Makes an undone change again; false when there is nothing to redo. */
  redo(): boolean {
    const step = redoEdit(this.state().history, this.rows());
    if (step) this.change(step.rows, step.history);
    return step !== null;
  }

  /** Undo of one deletion (the snack bar's button): a step back while it is the last change, else the rows put back as a new change. */
  undoDeletion(before: readonly GridRow[]): void {
    if (this.state().history.past.at(-1) === before) this.undo();
    else this.replaceRows([...before]);
  }

  insertRow(index?: number): void {
    this.change(insertRow(this.rows(), this.layoutOf, index));
  }

  deleteRows(uids: ReadonlySet<number>): void {
    if (uids.size > 0) this.change(deleteRows(this.rows(), uids));
  }

  moveRow(uid: number, delta: -1 | 1): void {
    this.change(moveRow(this.rows(), uid, delta));
  }

  paste(target: PasteTarget, text: string): PasteOutcome {
    const outcome = applyPaste(this.rows(), this.layoutOf, target, text, this.decimalMark());
    if (outcome.written > 0) this.change(outcome.rows);
    return outcome;
  }

  /** Marks a row excluded with its reason and saves at once (no pause). */
  exclude(rowIndex: number, reason: string): void {
    const row = this.rows()[rowIndex];
    if (!row) return;
    this.change(this.rows().map((r) => (r === row ? { ...r, excluded: true, exclusionReason: reason } : r)));
    this.save();
  }

  /** Saves now: the Retry button, or leaving the page. */
  save(): void {
    const s = this.state();
    if (s.studyId === null || s.status === 'conflict' || this.inFlight) return;
    if (this.revision === this.savedRevision) return;
    this.retry?.unsubscribe();
    const revision = this.revision;
    const sent = rowsToSend(s.rows, this.layoutOf);
    this.state.update((st) => ({ ...st, status: 'saving', retryAt: null }));
    this.inFlight = this.api.put(s.studyId, { version: s.version, rows: sent.rows }).subscribe({
      next: (answer) => this.accepted(answer, revision),
      error: (err: ApiError) => this.refused(err, sent, revision),
    });
  }

  /** Rows written for another mark rewritten for `mark`; not an edit (the numbers stay), so nothing is saved for it. */
  private useMark(mark: DecimalMark): void {
    const s = this.state();
    if (s.decimalMark === mark) return;
    const rewrite = (rows: readonly GridRow[]): GridRow[] => this.rewritten([...rows], s.decimalMark, mark);
    const history = { past: s.history.past.map(rewrite), future: s.history.future.map(rewrite) };
    this.state.set({ ...s, rows: rewrite(s.rows), decimalMark: mark, history });
  }

  /** Every result cell written for `from` rewritten for `to` (stored texts are written for 'point'). */
  private rewritten(rows: GridRow[], from: DecimalMark, to: DecimalMark): GridRow[] {
    const results = this.layoutOf.fields.filter((f) => f.kind === 'result').map((f) => f.field);
    return rows.map((row) => {
      const out = { ...row };
      for (const field of results) out[field] = rewriteForMark(String(row[field] ?? ''), from, to);
      return out;
    });
  }

  /** New rows on screen, to be saved: one step in the history (or the step given, for Undo and Redo). */
  private change(rows: GridRow[], history?: EditHistory): void {
    this.revision++;
    this.state.update((s) => ({ ...s, rows, history: history ?? recordEdit(s.history, s.rows), status: s.status === 'conflict' ? 'conflict' : s.status === 'saving' ? 'saving' : 'pending' }));
    this.changes.next();
  }

  private accepted(answer: SpecimenRows, revision: number): void {
    const from = this.state().version;
    this.inFlight = null;
    this.failures = 0;
    this.savedRevision = revision;
    const more = this.revision !== revision;
    this.state.update((s) => ({ ...s, version: answer.version, status: more ? 'pending' : 'saved', message: null, issues: [], retryAt: null }));
    this.study?.followVersion(from, answer.version);
    if (more) this.save();
  }

  /** Keeps the rows whatever happened; saves again after a pause when offline, or at once if edited meanwhile. */
  private refused(err: ApiError, sent: SentRows, revision: number): void {
    this.inFlight = null;
    const refusal = refusalOf(err, sent);
    const delay = refusal.retryLater ? retryDelay(++this.failures) : null;
    this.state.update((s) => ({
      ...s, status: refusal.status, message: refusal.message, issues: refusal.issues, retryAt: delay === null ? null : Date.now() + delay,
    }));
    if (delay !== null) this.retry = timer(delay).subscribe(() => this.save());
    else if (refusal.status !== 'conflict' && this.revision !== revision) this.save();
  }
}
