import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import type { Signature } from '@shared/schemas';
import { SignatureList } from '../../archive/signature-list/signature-list';
import { reportUrl } from '../../signoff/signoff-api';

/** The director's signature on a signed study, as it was given, with the signed PDF beside it. */
@Component({
  selector: 'app-signature-block',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatIconModule, SignatureList],
  template: `
    <section class="block" aria-labelledby="signature-title" data-testid="signature-block">
      <h2 id="signature-title">Electronic signature</h2>
      <app-signature-list [signatures]="[signature()]" />
      <div class="actions">
        <a mat-flat-button [href]="pdf()" target="_blank" rel="noopener" data-testid="open-signed-pdf">
          <mat-icon>picture_as_pdf</mat-icon> Open the signed PDF
        </a>
        <a mat-stroked-button [href]="pdf()" [attr.download]="fileName()" data-testid="download-signed-pdf">
          <mat-icon>download</mat-icon> Download it
        </a>
        <span class="muted">The PDF’s SHA-256 above lets anyone check that a copy is this exact file.</span>
      </div>
    </section>
  `,
  styles: `
    .block { margin: 16px 0; padding: 16px; border: 2px solid var(--mat-sys-primary); border-radius: 12px; break-inside: avoid; }
    .actions { display: flex; flex-wrap: wrap; gap: 12px; align-items: center; }
  `,
})
export class SignatureBlock {
  readonly studyId = input.required<number>();
  readonly signature = input.required<Signature>();
  protected readonly pdf = computed(() => reportUrl(this.studyId()));
  protected readonly fileName = computed(() => `parallax-study-${this.studyId()}-signed.pdf`);
}
