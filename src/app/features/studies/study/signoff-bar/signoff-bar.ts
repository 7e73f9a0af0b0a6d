import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { Router, RouterLink } from '@angular/router';
import { catchError, distinctUntilChanged, filter, map, of, switchMap } from 'rxjs';
import type { Signature, Study, SubmitBody } from '@shared/schemas';
import { AuthStore } from '../../../../core/auth/auth-store';
import { ApiError } from '../../../../core/http/api-error';
import { Notices } from '../../../../core/notify/notices';
import { ZonedPipe, labZone } from '../../../../ui/lab-time';
import { StudyStore } from '../study-store';
import { ReasonData, ReasonDialog } from '../../../signoff/dialogs/reason-dialog';
import { SignatureData, SignatureDialog } from '../../../signoff/dialogs/signature-dialog';
import { SubmitData, SubmitDialog } from '../../../signoff/dialogs/submit-dialog';
import { StepId, nextStep } from '../../../signoff/next-step';
import { planApprovalOf, signOffOf } from '../../../signoff/signatures';
import { SignoffApi, reportUrl } from '../../../signoff/signoff-api';

/**
 * Above the study's tabs: its sign-off state in words and the next step this user may take — submit,
 * approve the plan, open the review, amend — with the director's return comment and the signature.
 * Mounted by the study page, whose StudyStore it shares.
 */
@Component({
  selector: 'app-signoff-bar',
  templateUrl: './signoff-bar.html',
  styleUrl: './signoff-bar.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatIconModule, RouterLink, ZonedPipe],
})
export class SignoffBar {
  private readonly store = inject(StudyStore);
  private readonly api = inject(SignoffApi);
  private readonly auth = inject(AuthStore);
  private readonly dialogs = inject(MatDialog);
  private readonly notices = inject(Notices);
  private readonly router = inject(Router);
  protected readonly zone = labZone();
  protected readonly study = this.store.study;
  protected readonly busy = signal(false);
  /** The server's refusal of a submission: its sentence and each issue in words. */
  protected readonly refusal = signal<{ message: string; issues: string[] } | null>(null);
  /** The note of a refused submission, offered again with the next try. */
  private note = '';

  /** The signatures, read again whenever the study's state or version moves. */
  private readonly signatures = toSignal(
    toObservable(computed(() => this.study() && `${this.study()!.id}:${this.study()!.version}`)).pipe(
      distinctUntilChanged(),
      filter((key): key is string => !!key),
      switchMap(() => this.api.signatures(this.study()!.id).pipe(catchError(() => of<Signature[]>([])))),
      map((list) => ({ approval: planApprovalOf(list), signOff: signOffOf(list) })),
    ),
    { initialValue: { approval: null, signOff: null } },
  );
  protected readonly approval = computed(() => this.signatures().approval);
  protected readonly signOff = computed(() => this.signatures().signOff);
  protected readonly step = computed(() => (this.study() ? nextStep(this.study()!, this.auth.roles(), this.approval() !== null) : null));
  protected readonly pdf = computed(() => (this.study() ? reportUrl(this.study()!.id) : ''));

  protected take(id: StepId, study: Study): void {
    this.refusal.set(null);
    if (id === 'submit') this.submit(study);
    else if (id === 'approve-plan') this.approvePlan(study);
    else if (id === 'amend') this.amend(study);
    else void this.router.navigate(['/studies', study.id, 'review']);
  }

  /** Asks first (what submission does, and an optional note for the director), then submits. */
  private submit(study: Study): void {
    const data: SubmitData = { title: study.title, note: this.note };
    this.dialogs
      .open<SubmitDialog, SubmitData, SubmitBody>(SubmitDialog, { data, width: '560px', maxWidth: '95vw' })
      .afterClosed()
      .pipe(filter((body): body is SubmitBody => !!body))
      .subscribe((body) => this.send(study, body));
  }

  private send(study: Study, body: SubmitBody): void {
    this.note = body.note;
    this.busy.set(true);
    this.api.submit(study.id, body).subscribe({
      next: (submitted) => {
        this.busy.set(false);
        this.note = '';
        this.store.adopt(submitted);
        this.notices.post('Submitted for sign-off. The laboratory’s directors are told by e-mail.');
      },
      error: (err: ApiError) => {
        this.busy.set(false);
        const issues = err.issues.map((i) => i.message);
        this.refusal.set({ message: issues.length ? 'The study cannot be submitted yet:' : err.message, issues });
      },
    });
  }

  private approvePlan(study: Study): void {
    const data: SignatureData = { kind: 'plan', studyId: study.id, title: study.title };
    this.dialogs
      .open<SignatureDialog, SignatureData, Study>(SignatureDialog, { data, width: '600px', maxWidth: '95vw' })
      .afterClosed()
      .pipe(filter((s): s is Study => !!s))
      .subscribe((approved) => {
        this.store.adopt(approved);
        this.notices.post('Plan approved. Later changes to its criteria will need a reason and are shown at sign-off.');
      });
  }

  private amend(study: Study): void {
    const data: ReasonData = { step: 'amend', studyId: study.id, title: study.title };
    this.dialogs
      .open<ReasonDialog, ReasonData, Study>(ReasonDialog, { data, width: '560px', maxWidth: '95vw' })
      .afterClosed()
      .pipe(filter((s): s is Study => !!s))
      .subscribe((draft) => {
        this.notices.post(`Study ${draft.id} is a new draft that supersedes study ${study.id} once it is signed.`);
        void this.router.navigate(['/studies', draft.id]);
      });
  }
}
