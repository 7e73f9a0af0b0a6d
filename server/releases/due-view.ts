import { asc, eq, type SQL } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import type { DueItem } from '@shared/schemas';
import { daysBetween, dueStatus, dueWords } from '@shared/types/due-dates';
import { laboratoryDate } from '@shared/types/lab-time';
import type { Executor } from '../db/client';
import type { LabScope } from '../db/lab-scope';
import { labTimeZone } from '../db/lab-zone';
import { analytes, dueItems, instruments, releases, studies } from '../db/schema';

/** The laboratory's today, yyyy-mm-dd, at `now` (the reminder check passes its own clock). */
export async function labToday(db: Executor, scope: LabScope, now: Date = new Date()): Promise<string> {
  return laboratoryDate(now, await labTimeZone(db, scope));
}

const started = alias(releases, 'started_release');

/** Due items of a laboratory matching `where`, earliest first, with their standing as of the laboratory's today. */
export async function dueView(db: Executor, scope: LabScope, where: SQL, now: Date = new Date()): Promise<DueItem[]> {
  const today = await labToday(db, scope, now);
  const rows = await db.select({
    item: dueItems, releaseTitle: releases.title, dueRules: releases.dueRules, analyteName: analytes.name, instrumentName: instruments.name,
    startedReleaseTitle: started.title, startedStudyTitle: studies.title,
  }).from(dueItems)
    .innerJoin(releases, eq(releases.id, dueItems.releaseId))
    .innerJoin(analytes, eq(analytes.id, dueItems.analyteId))
    .innerJoin(instruments, eq(instruments.id, dueItems.instrumentId))
    .leftJoin(started, eq(started.id, dueItems.startedReleaseId))
    .leftJoin(studies, eq(studies.id, dueItems.startedStudyId))
    .where(scope.where(dueItems, where))
    .orderBy(asc(dueItems.dueDate), asc(dueItems.id));
  return rows.map(({ item, ...r }) => ({
    id: item.id, releaseId: item.releaseId, releaseTitle: r.releaseTitle, analyte: { id: item.analyteId, name: r.analyteName },
    instrument: { id: item.instrumentId, name: r.instrumentName }, ruleKey: item.ruleKey, label: item.label, rule: item.rule,
    kinds: ((r.dueRules as { key: string; kinds?: DueItem['kinds'] }[]).find((d) => d.key === item.ruleKey)?.kinds) ?? [],
    dueDate: item.dueDate, state: item.state as DueItem['state'],
    status: item.state === 'open' ? dueStatus(item.dueDate, today) : (item.state as 'started' | 'done'),
    daysLeft: daysBetween(today, item.dueDate),
    dueWords: item.state === 'done' ? 'done' : dueWords(item.dueDate, today),
    startedRelease: item.startedReleaseId ? { id: item.startedReleaseId, name: r.startedReleaseTitle ?? '' } : null,
    startedStudy: item.startedStudyId ? { id: item.startedStudyId, name: r.startedStudyTitle ?? '' } : null,
    version: item.version,
  }));
}
