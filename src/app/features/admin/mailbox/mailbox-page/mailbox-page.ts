import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatListModule } from '@angular/material/list';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import type { MailMessage } from '@shared/schemas';
import { ErrorBanner } from '../../../../ui/error-banner';
import { ZonedPipe, labZone } from '../../../../ui/lab-time';
import { linkify } from '../linkify';
import { MailboxStore } from '../mailbox-store';

/** Admin › Mailbox: the laboratory's sent e-mails, a list beside a reading pane. */
@Component({
  selector: 'app-mailbox-page',
  templateUrl: './mailbox-page.html',
  styleUrl: './mailbox-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ZonedPipe, MatListModule, MatButtonModule, MatIconModule, MatProgressBarModule, ErrorBanner],
})
export class MailboxPage {
  protected readonly store = inject(MailboxStore);
  protected readonly zone = labZone();
  private readonly chosenId = signal<number | null>(null);

  /** The chosen message, or the newest one when none is chosen. */
  protected readonly open = computed<MailMessage | null>(() => {
    const messages = this.store.items();
    return messages.find((m) => m.id === this.chosenId()) ?? messages[0] ?? null;
  });
  protected readonly parts = computed(() => linkify(this.open()?.text ?? ''));

  constructor() {
    this.store.load();
  }

  protected choose(id: number): void {
    this.chosenId.set(id);
  }

  protected refresh(): void {
    this.store.load();
  }
}
