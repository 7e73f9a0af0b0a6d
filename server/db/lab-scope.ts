import { and, eq, sql, type SQL } from 'drizzle-orm';
import type { PgColumn, PgTable } from 'drizzle-orm/pg-core';
import type { SignedInUser } from '../auth/session-user';
import { notFound } from '../http/app-error';
import type { Executor } from './client';

/** A table whose rows belong to one laboratory. */
export type LabOwned = PgTable & { laboratoryId: PgColumn };

/**
 * The laboratory a request may see, made once per request from the signed-in user (`scopeOf`, first called
 * by the route wrapper in server/http/routes.ts). Every query of rows that belong to a laboratory is filtered
 * through it (`where`, `owns`, `oneOr404`) and every insert of such rows is stamped by it (`values`), so
 * another laboratory's record answers 404. The laboratory's id is kept private: services never read it,
 * repositories reach it only through these helpers (or `labIdOf` in the few lower layers that need the number).
 * Work that legitimately acts for a laboratory without a signed-in user (the daily reminder, the demo seed) names
 * itself with `systemScope(laboratoryId, why)`, and mail or times about a row already read use `ownerScope(row)`,
 * so every exception is visible and greppable.
 */
export class LabScope {
  readonly #lab: number;

  private constructor(lab: number, readonly why: string | null) {
    if (!Number.isInteger(lab) || lab <= 0) throw new Error(`A laboratory scope needs a laboratory id, not ${String(lab)}`);
    this.#lab = lab;
  }

  /** @internal use `scopeOf` or `systemScope`. */
  static make(lab: number, why: string | null): LabScope {
    return new LabScope(lab, why);
  }

  /** `table.laboratory_id = <this laboratory>` and every further condition given. */
  where(table: LabOwned, ...conds: (SQL | undefined)[]): SQL {
    return and(eq(table.laboratoryId, this.#lab), ...conds)!;
  }

  /** `<column> = <this laboratory>`, for a column that holds a laboratory id (a join's, or `laboratories.id`), or raw SQL naming one. */
  owns(column: PgColumn | SQL): SQL {
    return sql`${column} = ${this.#lab}`;
  }

  /** A row to insert, stamped with this laboratory (whatever `laboratoryId` it carried is replaced). */
  values<T extends object>(row: T): Omit<T, 'laboratoryId'> & { laboratoryId: number } {
    return { ...row, laboratoryId: this.#lab };
  }

  /** The row of `table` with this id in this laboratory, locked FOR UPDATE when asked; another laboratory's (or none) answers 404 "<what> was not found". */
  async oneOr404<T extends LabOwned & { id: PgColumn }>(db: Executor, table: T, id: number, what: string, lock = false): Promise<T['$inferSelect']> {
    const q = db.select().from(table as PgTable).where(this.where(table, eq(table.id, id)));
    const [row] = lock ? await q.for('update') : await q;
    if (!row) throw notFound(what);
    return row as T['$inferSelect'];
  }

  /** Written in log lines and errors only; never the way to reach the id. */
  toString(): string {
    return this.why === null ? 'the signed-in user\'s laboratory' : `laboratory (system: ${this.why})`;
  }

  static idOf(scope: LabScope): number {
    return scope.#lab;
  }
}

const made = new WeakMap<SignedInUser, LabScope>();

/** The scope of a signed-in user: made on the request's first call (the route wrapper) and the same object after. */
export function scopeOf(user: SignedInUser): LabScope {
  let scope = made.get(user);
  if (!scope) {
    scope = LabScope.make(user.laboratoryId, null);
    made.set(user, scope);
  }
  return scope;
}

/**
 * The scope of the laboratory that owns a row already read through a scope (or by a system job): the mails,
 * times and views about that row are its laboratory's. Not for rows chosen by an id a user sent.
 */
export function ownerScope(row: { laboratoryId: number }): LabScope {
  return LabScope.make(row.laboratoryId, 'the laboratory that owns a row already read');
}

/**
 * A scope for work done for one laboratory with no signed-in user asking: the daily reminders, the demo seed. `why` says which; grep `systemScope(` to see them all.
 */
export function systemScope(laboratoryId: number, why: string): LabScope {
  if (!why.trim()) throw new Error('A system scope says why it spans the laboratory without a user');
  return LabScope.make(laboratoryId, why);
}

/**
 * The bare laboratory id of a scope, for the lower layers that must hand it on as a number (the audit chain's
 * name, mail rows, checks that compare a stored id). Allowed only where server/db/lab-scope.spec.ts lists it.
 */
export const labIdOf = (scope: LabScope): number => LabScope.idOf(scope);
