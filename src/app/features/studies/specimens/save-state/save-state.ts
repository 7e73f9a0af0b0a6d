import { ChangeDetectionStrategy, Component, DestroyRef, computed, effect, inject, output, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { SaveStatus, saveStatusText } from '../save-status';
import { SpecimensStore } from '../specimens-store';

const ICONS: Record<SaveStatus, string> = {
  saved: 'cloud_done', pending: 'edit_note', saving: 'cloud_upload', invalid: 'error', offline: 'cloud_off', conflict: 'sync_problem', failed: 'error',
};

/** The rows' save state in words with an icon, and the button that fits it (Retry now, Reload). */
@Component({
  selector: 'app-save-state',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatIconModule],
  template: `
    <div class="save-state" [attr.data-status]="store.status()" role="status" aria-live="polite">
      <mat-icon aria-hidden="true">{{ icon() }}</mat-icon>
      <span data-testid="save-state">{{ text() }}</span>
      @if (store.status() === 'offline' || store.status() === 'failed') {
        <button mat-button type="button" (click)="store.save()" data-testid="save-retry">Retry now</button>
      }
      @if (store.status() === 'conflict') {
        <button mat-stroked-button type="button" (click)="reload.emit()" data-testid="save-reload">Reload</button>
      }
    </div>
  `,
  styles: `
    .save-state { display: flex; align-items: center; gap: 8px; min-height: 40px; font: var(--mat-sys-body-medium); }
    .save-state[data-status='invalid'], .save-state[data-status='failed'] { color: var(--mat-sys-error); }
    .save-state[data-status='offline'], .save-state[data-status='conflict'] { color: var(--mat-sys-tertiary); }
    .save-state[data-status='saved'] mat-icon { color: var(--mat-sys-primary); }
  `,
})
export class SaveState {
  protected readonly store = inject(SpecimensStore);
  readonly reload = output<void>();
  private readonly now = signal(Date.now());
  protected readonly icon = computed(() => ICONS[this.store.status()]);
  protected readonly text = computed(() =>
    saveStatusText({ status: this.store.status(), message: this.store.message(), retryAt: this.store.retryAt() }, this.now()),
  );

  constructor() {
    // Count down to the next retry while offline.
    let tick: ReturnType<typeof setInterval> | null = null;
    effect(() => {
      const offline = this.store.status() === 'offline';
      if (offline && !tick) tick = setInterval(() => this.now.set(Date.now()), 1000);
      if (!offline && tick) {
        clearInterval(tick);
        tick = null;
      }
      this.now.set(Date.now());
    });
    inject(DestroyRef).onDestroy(() => tick && clearInterval(tick));
  }
}
