import type { Pool } from 'pg';
import { RateLimiterPostgres, RateLimiterRes } from 'rate-limiter-flexible';
import { plural } from '@shared/types/plural';
import { recordAudit } from '../audit/audit';
import type { Database } from '../db/client';
import { AppError } from '../http/app-error';

const WINDOW_SECONDS = 60 * 60;
/** Requests for a password link one e-mail address may receive per hour. */
export const RESETS_PER_EMAIL = 3;

/**
 * Requests for a password link ("Forgot your password?"), counted per address and per e-mail in
 * PostgreSQL beside the sign-in counts (`sign_in_limits`, other key prefixes), so every API process sees
 * the same ones. Every request counts, whether or not the e-mail has an account: the limit then says
 * nothing about the address, and nobody can flood one person's mailbox or the outbox.
 */
export class ResetLimits {
  private readonly byAddress: RateLimiterPostgres;
  private readonly byEmail: RateLimiterPostgres;

  constructor(pool: Pool, private readonly db: Database, private readonly perAddress: number, private readonly perEmail = RESETS_PER_EMAIL) {
    const common = { storeClient: pool, storeType: 'pool', tableName: 'sign_in_limits', tableCreated: true, duration: WINDOW_SECONDS };
    this.byAddress = new RateLimiterPostgres({ ...common, keyPrefix: 'reset-address', points: perAddress });
    this.byEmail = new RateLimiterPostgres({ ...common, keyPrefix: 'reset-email', points: perEmail });
  }

  /** Counts one request; over either limit it is refused (429, audited) with words naming the limit. */
  async consume(address: string, email: string): Promise<void> {
    const outcomes = await Promise.allSettled([this.byAddress.consume(address), this.byEmail.consume(email.toLowerCase())]);
    const refused: { res: RateLimiterRes; words: string }[] = [];
    for (const [i, o] of outcomes.entries()) {
      if (o.status === 'fulfilled') continue;
      if (!(o.reason instanceof RateLimiterRes)) throw o.reason; // the database itself failed
      refused.push({ res: o.reason, words: i === 0 ? `from this address (at most ${this.perAddress} an hour)` : `for this e-mail address (at most ${this.perEmail} an hour)` });
    }
    if (!refused.length) return;
    const minutes = Math.max(1, Math.ceil(Math.max(...refused.map((r) => r.res.msBeforeNext)) / 60_000));
    const which = refused.map((r) => r.words).join(' and ');
    await this.db.transaction((tx) => recordAudit(tx, { id: null, name: null, laboratoryId: null }, {
      action: 'password-reset.rate-limited', entity: 'user', after: { email, address, which },
    }));
    throw new AppError('too_many', `Too many requests for a password link ${which}; wait ${plural(minutes, 'minute')} and try again`);
  }
}
