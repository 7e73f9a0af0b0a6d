import type { Transporter } from 'nodemailer';
import type { Database } from '../db/client';
import { logFailure } from '../log';
import { deliverOutbox, smtpTransport } from './outbox';

/** Delivers the outbox now and then, and at once when asked (after a commit that queued mail). */
export class MailService {
  private readonly transport: Transporter | null;
  private timer: NodeJS.Timeout | null = null;
  private running: Promise<number> | null = null;
  private stopped = false;

  constructor(private readonly db: Database, smtpUrl: string | undefined, private readonly from: string) {
    this.transport = smtpUrl ? smtpTransport(smtpUrl) : null;
  }

  start(intervalMs = 5000): void {
    if (!this.transport || this.timer) return;
    this.timer = setInterval(() => void this.flush(), intervalMs);
    this.timer.unref();
  }

  /** Sends what is due; resolves with how many went out. */
  flush(): Promise<number> {
    if (!this.transport || this.stopped) return Promise.resolve(0);
    if (!this.running) {
      this.running = deliverOutbox(this.db, this.transport, this.from)
        .catch((err) => {
          logFailure('mail delivery', err);
          return 0;
        })
        .finally(() => (this.running = null));
    }
    return this.running;
  }

  kick(): void {
    void this.flush();
  }

  /** Stops delivering; a send already under way finishes first (await it through the returned promise). */
  stop(): Promise<number> {
    this.stopped = true;
    if (this.timer) clearInterval(this.timer);
    this.timer = null;
    const last = this.running ?? Promise.resolve(0);
    return last.finally(() => this.transport?.close());
  }
}
