import { DrizzleQueryError } from 'drizzle-orm/errors';
import { DatabaseError } from 'pg';
import { describeForLog, logFailure } from './log';

/** The server log must name what failed without printing row data or SQL parameters. */
describe('describeForLog', () => {
  const driverError = () => {
    const e = new DatabaseError('invalid input syntax for type double precision: "Mrs Jane Doe 5.4"', 0, 'error');
    Object.assign(e, { code: '22P02', table: 'specimens', routine: 'float8in_internal' });
    return e;
  };

  it('keeps the statement, the code and the table of a failed query, and drops its parameters and quoted values', () => {
    const err = new DrizzleQueryError('insert into "specimens" ("label", "candidate") values ($1, $2)', ['Mrs Jane Doe', 'secret-label-77'], driverError());
    const line = describeForLog(err);
    expect(line).toContain('insert into "specimens" ("label", "candidate") values ($1, $2)');
    expect(line).toContain('code=22P02');
    expect(line).toContain('table=specimens');
    expect(line).not.toMatch(/Jane|secret-label-77|5\.4/);
  });

  it('masks the key values of a constraint violation', () => {
    const e = new DatabaseError('duplicate key value violates unique constraint "users_email_key"', 0, 'error');
    Object.assign(e, { code: '23505', constraint: 'users_email_key', detail: 'Key (email)=(someone@example.org) already exists.' });
    const line = describeForLog(e);
    expect(line).toContain('constraint=users_email_key');
    expect(line).not.toContain('someone@example.org');
  });

  it('writes one line per kind of failure per interval, so a database that is away does not flood the log', () => {
    const spy = jest.spyOn(console, 'error').mockImplementation(() => undefined);
    try {
      for (let i = 0; i < 5; i++) logFailure('a test poller', new Error('connect ECONNREFUSED'));
      expect(spy).toHaveBeenCalledTimes(1);
      expect(String(spy.mock.calls[0][0])).toMatch(/^\[parallax\] a test poller failed: Error connect ECONNREFUSED/);
    } finally {
      spy.mockRestore();
    }
  });
});

describe('the error handler', () => {
  it('answers 500 in words and logs the failed query without its parameters', async () => {
    const { errorHandler } = await import('./http/error-handler');
    const spy = jest.spyOn(console, 'error').mockImplementation(() => undefined);
    const sent: { status?: number; body?: unknown } = {};
    const res = { status(s: number) { sent.status = s; return this; }, json(b: unknown) { sent.body = b; return this; }, setHeader() { return this; } };
    try {
      const err = new DrizzleQueryError('update "specimens" set "note" = $1 where "id" = $2', ['patient name Jane Roe', 7], new Error('boom'));
      errorHandler(err, { method: 'PUT', path: '/api/v1/studies/7/specimens' } as never, res as never, () => undefined);
      expect(sent).toEqual({ status: 500, body: { error: 'Something went wrong on the server; the change was not saved', issues: [] } });
      const logged = spy.mock.calls.map((c) => c.map(String).join(' ')).join('\n');
      expect(logged).toContain('PUT /api/v1/studies/7/specimens failed');
      expect(logged).not.toContain('Jane Roe');
    } finally {
      spy.mockRestore();
    }
  });
});
