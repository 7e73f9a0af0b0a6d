import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { Signature } from '@shared/schemas';
import { ZonedPipe, labZone } from '../../../ui/lab-time';

const ICONS: Record<Signature['meaning'], string> = { accepted: 'verified', 'not-accepted': 'block', 'plan-approved': 'task_alt' };

/** Each electronic signature as it was given: printed name, meaning in words, date and time with the zone, comment and the hashes it is bound to. */
@Component({
  selector: 'app-signature-list',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatIconModule, ZonedPipe],
  templateUrl: './signature-list.html',
  styleUrl: './signature-list.scss',
})
export class SignatureList {
  readonly signatures = input.required<readonly Signature[]>();
  protected readonly zone = labZone();
  protected readonly icons = ICONS;
}
