import { eq } from 'drizzle-orm';
import { recordAudit } from '../audit/audit';
import { hashPassword } from '../auth/passwords';
import type { Database } from './client';
import { analytes, instruments, laboratories, users } from './schema';
import { DEMO_LABS, DEMO_PASSWORD } from './seed-data';
import { seedDemoStudies } from './seed-studies';

const SYSTEM = (laboratoryId: number) => ({ id: null, name: 'demo seed', laboratoryId });

/** Seeds the demo laboratories once; running it again changes nothing. */
export async function seedDemo(db: Database, publicUrl = 'http://127.0.0.1:3000'): Promise<void> {
  const hash = await hashPassword(DEMO_PASSWORD);
  for (const lab of DEMO_LABS) {
    await db.transaction(async (tx) => {
      const existing = await tx.select().from(laboratories).where(eq(laboratories.name, lab.name));
      if (existing.length) return;
      const [row] = await tx.insert(laboratories).values({ name: lab.name, timeZone: lab.timeZone }).returning();
      await recordAudit(tx, SYSTEM(row.id), { action: 'laboratory.created', entity: 'laboratory', entityId: row.id, after: { name: lab.name } });
      for (const u of lab.users) {
        const [user] = await tx.insert(users).values({ ...u, roles: [...u.roles], laboratoryId: row.id, passwordHash: hash }).returning();
        await recordAudit(tx, SYSTEM(row.id), { action: 'user.created', entity: 'user', entityId: user.id, after: { name: u.name, email: u.email, roles: u.roles } });
      }
      for (const a of lab.analytes) {
        const [analyte] = await tx.insert(analytes).values({ ...a, decisionLevels: [...a.decisionLevels], laboratoryId: row.id }).returning();
        await recordAudit(tx, SYSTEM(row.id), { action: 'analyte.created', entity: 'analyte', entityId: analyte.id, after: a });
      }
      for (const i of lab.instruments) {
        const [inst] = await tx.insert(instruments).values({ ...i, laboratoryId: row.id }).returning();
        await recordAudit(tx, SYSTEM(row.id), { action: 'instrument.created', entity: 'instrument', entityId: inst.id, after: i });
      }
    });
  }
  const [demo] = await db.select().from(laboratories).where(eq(laboratories.name, DEMO_LABS[0].name));
  await seedDemoStudies(db, demo.id, publicUrl);
}

export const demoSignIns = (): string[] =>
  DEMO_LABS[0].users.map((u) => `${u.email.padEnd(30)} ${u.roles.join(' + ')}`);
