import { eq } from 'drizzle-orm';
import type { AnalyteBody, InstrumentBody } from '@shared/schemas';
import { recordAudit } from '../audit/audit';
import { actorOf, SignedInUser } from '../auth/session-user';
import type { Database } from '../db/client';
import { scopeOf, type LabScope } from '../db/lab-scope';
import { analytes, instruments } from '../db/schema';
import { invalid, notFound } from '../http/app-error';
import { catalogRows, findCatalogRow, type CatalogTable } from './admin.repository';
import { analyteView, instrumentView } from './views';

/** Create, update and list for one catalog table (analytes, instruments), each change audited. */
function catalog<T extends CatalogTable, Body extends object, View>(table: T, entity: string, label: string, view: (row: T['$inferSelect']) => View) {
  const find = (db: Database, scope: LabScope, id: number) => findCatalogRow(db, scope, table, id);
  const duplicate = (err: unknown) => (err as { code?: string; cause?: { code?: string } }).code === '23505' || (err as { cause?: { code?: string } }).cause?.code === '23505';
  const nameTaken = () => invalid('name', `${label} with this name already exists`);
  return {
    async list(db: Database, me: SignedInUser): Promise<View[]> {
      return (await catalogRows(db, scopeOf(me), table)).map(view);
    },
    async create(db: Database, me: SignedInUser, body: Body): Promise<View> {
      return db.transaction(async (tx) => {
        const [row] = await tx.insert(table as CatalogTable).values(scopeOf(me).values(body) as never).returning();
        await recordAudit(tx, actorOf(me), { action: `${entity}.created`, entity, entityId: row.id, after: view(row as T['$inferSelect']) });
        return view(row as T['$inferSelect']);
      }).catch((err) => { throw duplicate(err) ? nameTaken() : err; });
    },
    async update(db: Database, me: SignedInUser, id: number, body: Body): Promise<View> {
      return db.transaction(async (tx) => {
        const before = await find(tx as unknown as Database, scopeOf(me), id);
        if (!before) throw notFound(label);
        const [row] = await tx.update(table as CatalogTable).set(body as never).where(eq(table.id, id)).returning();
        await recordAudit(tx, actorOf(me), { action: `${entity}.updated`, entity, entityId: id, before: view(before), after: view(row as T['$inferSelect']) });
        return view(row as T['$inferSelect']);
      }).catch((err) => { throw duplicate(err) ? nameTaken() : err; });
    },
    find,
  };
}

export const analyteCatalog = catalog<typeof analytes, AnalyteBody, ReturnType<typeof analyteView>>(analytes, 'analyte', 'An analyte', analyteView);
export const instrumentCatalog = catalog<typeof instruments, InstrumentBody, ReturnType<typeof instrumentView>>(instruments, 'instrument', 'An instrument', instrumentView);
