import { and, eq, inArray } from 'drizzle-orm';
import { addDays } from '@shared/types/due-dates';
import { laboratoryDate } from '@shared/types/lab-time';
import type { SignedInUser } from '../auth/session-user';
import type { AppContext } from '../context';
import { labTimeZone } from '../db/lab-zone';
import { analytes, dueItems, instruments, releases, studies } from '../db/schema';
import { DEMO_PASSWORD } from '../db/seed-data';
import { updateDue } from './due.service';
import { signRelease } from './release-sign.service';
import { createRelease, linkStudy } from './releases.service';
import { systemScope } from '../db/lab-scope';

/** The glucose studies the released new system is made of (their demos are signed by the seed), by requirement. */
const NEW_SYSTEM_STUDIES: Record<string, string> = {
  comparison: 'Glucose: Chemistry line 2 against line 1',
  precision: 'Glucose precision: Chemistry line 2, two controls',
  'reportable-range': 'Glucose reportable range: Chemistry line 2, nine mixtures',
  'reference-interval': 'Glucose: verify the stated interval (Chemistry line 2)',
};

export const DEMO_RELEASES = {
  newSystem: 'Glucose on Chemistry line 2: new measuring system',
  lotChange: 'Glucose reagent lot GLU-4610 on Chemistry line 2',
} as const;

/**
 * The demo laboratory's glucose change, through the services as people would make it (invented scenario): the new
 * chemistry line released for patient testing on its four signed studies, its calibration verification brought
 * forward by the director so that it is now overdue, and an open reagent-lot change awaiting its comparison.
 * Skipped when the releases exist.
 */
export async function seedDemoReleases(ctx: AppContext, labId: number, tech: SignedInUser, director: SignedInUser): Promise<void> {
  const seed = systemScope(labId, 'the demo seed');
  const { db } = ctx;
  const existing = await db.select({ id: releases.id }).from(releases).where(seed.where(releases, inArray(releases.title, Object.values(DEMO_RELEASES))));
  if (existing.length) return;
  const [glucose] = await db.select().from(analytes).where(seed.where(analytes, eq(analytes.name, 'Glucose')));
  const labInstruments = await db.select().from(instruments).where(seed.where(instruments));
  const line = (name: string) => labInstruments.find((i) => i.name === name)!.id;
  const release = await createRelease(db, tech, {
    changeType: 'new-system', title: DEMO_RELEASES.newSystem, analyteId: glucose.id, instrumentId: line('Chemistry line 2'), comparativeInstrumentId: line('Chemistry line 1'),
    reagentLot: 'GLU-4502', note: 'Chemistry line 2 takes over glucose from line 1 (invented demo release).',
  });
  for (const [requirement, title] of Object.entries(NEW_SYSTEM_STUDIES)) {
    const [study] = await db.select({ id: studies.id }).from(studies).where(seed.where(studies, eq(studies.title, title)));
    await linkStudy(db, tech, release.id, { requirement, studyId: study.id });
  }
  const today = laboratoryDate(new Date(), await labTimeZone(db, seed));
  await signRelease(ctx, director, release.id, {
    meaning: 'released', goLiveDate: today, password: DEMO_PASSWORD,
    comment: 'All four verifications accepted; results above 28.3 mmol/L are diluted as the reportable range study found.',
  }, 'demo seed');
  const [calibration] = await db.select().from(dueItems).where(and(eq(dueItems.releaseId, release.id), eq(dueItems.ruleKey, 'calibration-verification')));
  await updateDue(db, director, calibration.id, {
    version: calibration.version, dueDate: addDays(today, -3),
    reason: 'Brought forward: a quality-control shift on the new line calls for calibration verification now (invented).',
  });
  await createRelease(db, tech, {
    changeType: 'reagent-lot', title: DEMO_RELEASES.lotChange, analyteId: glucose.id, instrumentId: line('Chemistry line 2'),
    reagentLot: 'GLU-4610', note: 'The next glucose reagent lot, compared against GLU-4502 with patient specimens before use (invented demo release).',
  });
}
