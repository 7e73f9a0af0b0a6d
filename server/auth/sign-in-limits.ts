import type { Pool } from 'pg';
import { RateLimiterPostgres, RateLimiterRes } from 'rate-limiter-flexible';
import { recordAudit } from '../audit/audit';
import type { Database } from '../db/client';
import { AppError } from '../http/app-error';
import { plural } from '@shared/types/plural';

const WINDOW_SECONDS = 15 * 60;

/**
 * Failed sign-ins counted per address and per account (e-mail), never successes, so a busy laboratory
 * behind one address does not lock itself out. The counts live in PostgreSQL (rate-limiter-flexible's
 * table `sign_in_limits`), so every API process sees the same ones. Over the limit, a sign-in is refused
 * before the password is even checked, for the rest of the 15-minute window.
 */
export class SignInLimits {
  private readonly byAddress: RateLimiterPostgres;
  private readonly byAccount: RateLimiterPostgres;

  constructor(pool: Pool, private readonly db: Database, private readonly perAddress: number, private readonly perAccount = 10) {
    const common = { storeClient: pool, storeType: 'pool', tableName: 'sign_in_limits', tableCreated: true, duration: WINDOW_SECONDS };
    this.byAddress = new RateLimiterPostgres({ ...common, keyPrefix: 'address', points: perAddress });
    this.byAccount = new RateLimiterPostgres({ ...common, keyPrefix: 'account', points: perAccount });
  }

  /** Refuses (429, audited) when this address or this account has used up its failures. */
  async assertAllowed(address: string, email: string): Promise<void> {
    const [a, b] = await Promise.all([this.byAddress.get(address), this.byAccount.get(email.toLowerCase())]);
    const over = [a && a.consumedPoints >= this.perAddress ? a : null, b && b.consumedPoints >= this.perAccount ? b : null].filter((r): r is RateLimiterRes => !!r);
    if (!over.length) return;
    const minutes = Math.max(1, Math.ceil(Math.max(...over.map((r) => r.msBeforeNext)) / 60_000));
    const which = over.length === 2 ? 'from this address and for this account' : a && over[0] === a ? 'from this address' : 'for this account';
    await this.db.transaction((tx) => recordAudit(tx, { id: null, name: null, laboratoryId: null }, { action: 'sign-in.rate-limited', entity: 'session', after: { address, which } }));
    throw new AppError('too_many', `Too many failed sign-ins ${which}; wait ${plural(minutes, 'minute')} and try again`);
  }

  /** Counts one failure against the address and the account. */
  async failed(address: string, email: string): Promise<void> {
    await Promise.all([this.byAddress.penalty(address, 1), this.byAccount.penalty(email.toLowerCase(), 1)]);
  }

  /** A right password clears the account's count (not the address's: others may share it). */
  async succeeded(email: string): Promise<void> {
    await this.byAccount.delete(email.toLowerCase());
  }
}
