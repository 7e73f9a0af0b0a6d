import { Injectable, signal } from '@angular/core';

/**
 * One channel for short messages to the user ("Saved", "Your roles do not include that page").
 * The shell shows them in a snack bar; the sign-in page shows a waiting one inline.
 */
@Injectable({ providedIn: 'root' })
export class Notices {
  private readonly current = signal<string | null>(null);
  readonly message = this.current.asReadonly();

  post(text: string): void {
    this.current.set(text);
  }

  /** Drops a waiting message unread: at sign-in, so one person's notice never greets the next. */
  clear(): void {
    this.current.set(null);
  }

  /** Returns the waiting message, if any, and removes it. */
  take(): string | null {
    const text = this.current();
    this.current.set(null);
    return text;
  }
}
