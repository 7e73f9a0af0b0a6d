import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { asc, eq, ne } from 'drizzle-orm';
import { PgDialect } from 'drizzle-orm/pg-core';
import type { SignedInUser } from '../auth/session-user';
import { AppError } from '../http/app-error';
import { startHarness, type Harness } from '../test/harness';
import { labIdOf, ownerScope, scopeOf, systemScope } from './lab-scope';
import { analytes, laboratories, studies } from './schema';

const render = (q: Parameters<PgDialect['sqlToQuery']>[0]) => { const { sql, params } = new PgDialect().sqlToQuery(q); return { sql, params }; };
const user = (laboratoryId: number): SignedInUser => ({ id: 1, laboratoryId, name: 'A Person', email: 'a@example.test', roles: ['technologist'] });

describe('LabScope', () => {
  it('filters by its laboratory first, then by every further condition given', () => {
    const scope = scopeOf(user(7));
    expect(render(scope.where(studies))).toEqual({ sql: '"studies"."laboratory_id" = $1', params: [7] });
    expect(render(scope.where(studies, eq(studies.id, 42), eq(studies.state, 'draft'))))
      .toEqual({ sql: '("studies"."laboratory_id" = $1 and "studies"."id" = $2 and "studies"."state" = $3)', params: [7, 42, 'draft'] });
    expect(render(scope.owns(laboratories.id))).toEqual({ sql: '"laboratories"."id" = $1', params: [7] });
  });

  it('stamps an insert with its laboratory, replacing whatever laboratory the row carried', () => {
    const scope = scopeOf(user(7));
    expect(scope.values({ title: 'T' })).toEqual({ title: 'T', laboratoryId: 7 });
    expect(scope.values({ title: 'T', laboratoryId: 99 })).toEqual({ title: 'T', laboratoryId: 7 });
  });

  it('is made once per signed-in user object (one request) and not shared between two', () => {
    const a = user(3);
    expect(scopeOf(a)).toBe(scopeOf(a));
    expect(scopeOf(a)).not.toBe(scopeOf(user(3)));
    expect(labIdOf(scopeOf(a))).toBe(3);
    expect(labIdOf(scopeOf(user(4)))).toBe(4);
  });

  it('keeps the laboratory id out of its enumerable state and its text', () => {
    const scope = scopeOf(user(12345));
    expect(JSON.stringify(scope)).not.toContain('12345');
    expect(String(scope)).not.toContain('12345');
    expect(Object.values(scope)).not.toContain(12345);
  });

  it('refuses a scope without a laboratory, and a system scope that does not say why', () => {
    expect(() => scopeOf(user(0))).toThrow('A laboratory scope needs a laboratory id, not 0');
    expect(() => scopeOf({ ...user(1), laboratoryId: undefined as unknown as number })).toThrow('not undefined');
    expect(() => systemScope(2, '  ')).toThrow('says why');
    expect(systemScope(2, 'the nightly job').why).toBe('the nightly job');
    expect(labIdOf(ownerScope({ laboratoryId: 5 }))).toBe(5);
  });

  describe('oneOr404 on the database', () => {
    let h: Harness;
    beforeAll(async () => { h = await startHarness(); });
    afterAll(() => h.close());

    it('finds a row of its own laboratory and answers 404 for the same id asked from another laboratory', async () => {
      const [own, other] = await h.database.db.select().from(laboratories).orderBy(asc(laboratories.id)).limit(2);
      expect(other).toBeDefined();
      const [study] = await h.database.db.select().from(studies).where(eq(studies.laboratoryId, own.id)).limit(1);
      const found = await scopeOf(user(own.id)).oneOr404(h.database.db, studies, study.id, 'Study');
      expect(found).toMatchObject({ id: study.id, laboratoryId: own.id, title: study.title });
      const refused = await scopeOf(user(other.id)).oneOr404(h.database.db, studies, study.id, 'Study').catch((e: unknown) => e);
      expect(refused).toBeInstanceOf(AppError);
      expect(refused).toMatchObject({ code: 'not_found', message: 'Study was not found' });
      const [analyte] = await h.database.db.select().from(analytes).where(ne(analytes.laboratoryId, own.id)).limit(1);
      await expect(scopeOf(user(own.id)).oneOr404(h.database.db, analytes, analyte.id, 'Analyte')).rejects.toMatchObject({ code: 'not_found', message: 'Analyte was not found' });
      await expect(scopeOf(user(own.id)).oneOr404(h.database.db, studies, 2_000_000_000, 'Study')).rejects.toMatchObject({ code: 'not_found' });
    });
  });
});

/*
 * The rule kept by a test: the caller's laboratory is read from the signed-in user in one place (lab-scope.ts),
 * and every service reaches it only as a LabScope. A read of `.laboratoryId` on a user, session, account or
 * actor object anywhere else in server/ (specs aside) fails this test, as does taking the bare id out of a scope
 * (`labIdOf`) or making a scope by hand (`LabScope.make`) outside the files listed here with their reasons.
 */
const SERVER = path.resolve(__dirname, '..');

/** `me.laboratoryId`, `req.user!.laboratoryId`, `user?.laboratoryId`, `session.laboratoryId`, `const { laboratoryId } = me` ... */
const CALLER_LAB = /\b(?:me|user|u|account|actor|caller|session|signedIn|currentUser|req\s*\.\s*user)\s*[!?]?\s*\??\.\s*laboratoryId\b|\{[^{}]*\blaboratoryId\b[^{}]*\}\s*=\s*(?:me|user|u|account|actor|caller|session|req\s*\.\s*user)\b/;
const BARE_ID = /\blabIdOf\s*\(|\bLabScope\s*\.\s*(?:make|idOf)\s*\(/;

/** Files that may read a caller's `.laboratoryId`, each with why. Everything else goes through the scope. */
const READS_ALLOWED: Record<string, string> = {
  'db/lab-scope.ts': 'the scope module: it reads the signed-in user\'s laboratory once to make the request\'s scope',
  'auth/session.ts': 'builds the signed-in user from the account row read with the session, and keys the read cache by it',
  'auth/session-user.ts': 'actorOf: an audit event carries its actor\'s laboratory (the chain it joins)',
  'auth/auth.service.ts': 'sign-in and the account\'s own password: the account row becomes the signed-in user and the audit actor before any scope exists',
  'auth/password-links.ts': 'a password link acts for the account it names (its actor and its mail), with no signed-in user',
  'auth/password-resets.ts': 'a reset request names an account by e-mail, with no signed-in user; its audit actor carries the account\'s laboratory',
  'audit/audit.ts': 'recordAudit: the event joins its actor\'s laboratory\'s chain',
};

/** Files that may take the bare id out of a scope or make one by hand, each with why. */
const BARE_ID_ALLOWED: Record<string, string> = {
  'db/lab-scope.ts': 'the scope module itself',
  'audit/audit.ts': 'chainOfScope: a chain is named by its laboratory\'s id ("lab:<id>")',
};

function serverFiles(dir = SERVER): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const full = path.join(dir, e.name);
    if (e.isDirectory()) return e.name === 'node_modules' ? [] : serverFiles(full);
    return e.name.endsWith('.ts') && !e.name.endsWith('.spec.ts') && !e.name.endsWith('.d.ts') ? [full] : [];
  });
}

/** Lines that break the rule, as "file:line: text"; comments are not code and are skipped. */
function offences(files: { name: string; text: string }[]): string[] {
  const out: string[] = [];
  for (const { name, text } of files) {
    const repository = name.endsWith('.repository.ts');
    text.split('\n').forEach((line, i) => {
      const code = line.replace(/\/\/.*$/, '');
      if (/^\s*(\*|\/\*)/.test(code)) return;
      if (CALLER_LAB.test(code) && !repository && !(name in READS_ALLOWED)) out.push(`${name}:${i + 1}: ${line.trim()}`);
      if (BARE_ID.test(code) && !(name in BARE_ID_ALLOWED)) out.push(`${name}:${i + 1}: ${line.trim()}`);
    });
  }
  return out;
}

describe('the laboratory is read from the caller in one place', () => {
  const files = serverFiles().map((f) => ({ name: path.relative(SERVER, f).split(path.sep).join('/'), text: readFileSync(f, 'utf8') }));

  it('finds the server files it checks', () => {
    expect(files.length).toBeGreaterThan(100);
    expect(files.map((f) => f.name)).toEqual(expect.arrayContaining(['studies/studies.service.ts', 'releases/releases.service.ts', 'db/lab-scope.ts']));
  });

  it('no service, route or helper reads the laboratory of a user, session or actor outside the scope and the allowed files', () => {
    expect(offences(files)).toEqual([]);
  });

  it('catches a service that reads me.laboratoryId, in any of its spellings', () => {
    const service = (text: string) => offences([{ name: 'studies/studies.service.ts', text }]);
    expect(service('  const study = await findStudy(db, me.laboratoryId, id);')).toHaveLength(1);
    expect(service('  res.json(await listMail(ctx.db, req.user!.laboratoryId));')).toHaveLength(1);
    expect(service('  const lab = user?.laboratoryId ?? null;')).toHaveLength(1);
    expect(service('  const { id, laboratoryId } = me;')).toHaveLength(1);
    expect(service('  const lab = labIdOf(scopeOf(me));')).toHaveLength(1);
    expect(service('  const scope = LabScope.make(3, null);')).toHaveLength(1);
    // What is allowed: the scope, a row's own laboratory, a table's column, and comments.
    expect(service('  const study = await findStudy(db, scopeOf(me), id);')).toEqual([]);
    expect(service('  await notify(tx, study.laboratoryId);')).toEqual([]);
    expect(service('  .where(eq(users.laboratoryId, release.laboratoryId))')).toEqual([]);
    expect(service('  // once read me.laboratoryId here')).toEqual([]);
    // A repository takes the scope and may be handed a number by the lower layers; it is not a service.
    expect(offences([{ name: 'studies/studies.repository.ts', text: 'x(me.laboratoryId)' }])).toEqual([]);
  });

  it('allows only files that exist and still need it (no stale exception)', () => {
    const names = new Set(files.map((f) => f.name));
    for (const name of [...Object.keys(READS_ALLOWED), ...Object.keys(BARE_ID_ALLOWED)]) expect(names.has(name) ? name : `missing: ${name}`).toBe(name);
    for (const name of Object.keys(READS_ALLOWED)) {
      const text = files.find((f) => f.name === name)!.text;
      expect(CALLER_LAB.test(text) ? name : `${name} no longer reads a caller's laboratory; take it off the list`).toBe(name);
    }
  });
});
