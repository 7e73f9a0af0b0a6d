import { sql, type SQL } from 'drizzle-orm';
import type { MayISign } from '@shared/schemas';
import type { SignedInUser } from '../auth/session-user';
import type { Executor } from '../db/client';
import { laboratories, specimens, studies, users } from '../db/schema';
import type { StudyRow } from '../studies/studies.repository';

/**
 * Who may sign a study, in one place (segregation of duties). A director signs a study awaiting sign-off
 * unless they entered any of its rows; a laboratory that allows one-person sign-off
 * (`laboratories.allow_self_sign`) lets them sign those too, and the signature says so in the history.
 * "Entered" means the rows' `entered_by`: an amendment's copied rows keep the person who entered them.
 *
 * The rule is one SQL condition over the outer `studies` row, so the worklist filters by it and one study
 * is judged by the same words: `signableBy` for lists, `mayISign` for one study (the sign step, the study response).
 */

/** True when the person entered a row of the outer `studies` row. */
const enteredRowsBy = (userId: number): SQL =>
  sql`EXISTS (SELECT 1 FROM ${specimens} r WHERE r.study_id = ${studies.id} AND r.entered_by = ${userId})`;

const labAllowsSelfSign = sql`(SELECT l.allow_self_sign FROM ${laboratories} l WHERE l.id = ${studies.laboratoryId})`;

/** The rule as an SQL condition over the outer `studies` row: this person may sign that study now. */
export function signableBy(me: SignedInUser): SQL {
  if (!me.roles.includes('director')) return sql`FALSE`;
  return sql`(${studies.state} = 'awaiting-signoff' AND (NOT ${enteredRowsBy(me.id)} OR ${labAllowsSelfSign}))`;
}

/** The answer for one study, with what the sign step needs to know besides. */
export interface SigningRight extends MayISign {
  /** The signer entered rows of the study (signing is then allowed only by the laboratory's setting, and audited). */
  enteredRows: boolean;
}

type Facts = { allowed: boolean; enteredRows: boolean; allowSelfSign: boolean; enterers: string[] };

/**
 * Whether this person may sign this study now, and who may sign it and why, in words for the review page.
 * Who entered the rows is looked up only while the study awaits sign-off: a draft or a signed study is
 * answered from its state alone, so opening one reads none of its rows.
 */
export async function mayISign(db: Executor, me: SignedInUser, study: Pick<StudyRow, 'id' | 'state'>): Promise<SigningRight> {
  if (study.state !== 'awaiting-signoff') return { allowed: false, enteredRows: false, why: notAwaiting(study.state) };
  const { rows: [facts] } = await db.execute<Facts>(sql`
    SELECT ${signableBy(me)} AS "allowed", ${enteredRowsBy(me.id)} AS "enteredRows", ${labAllowsSelfSign} AS "allowSelfSign",
           coalesce((SELECT json_agg(e.name ORDER BY e.name) FROM (SELECT DISTINCT u.id, u.name FROM ${specimens} r JOIN ${users} u ON u.id = r.entered_by
                      WHERE r.study_id = ${studies.id}) e), '[]') AS "enterers"
      FROM ${studies} WHERE ${studies.id} = ${study.id}`);
  return { allowed: facts.allowed, enteredRows: facts.enteredRows, why: whyWords(facts, me.roles.includes('director')) };
}

/** "Tomas Reyes", "Tomas Reyes and Priya Nair", "A, B and C". */
const names = (list: string[]): string => (list.length < 2 ? list.join('') : `${list.slice(0, -1).join(', ')} and ${list[list.length - 1]}`);

const notAwaiting = (state: string): string => (state === 'signed'
  ? 'This study is signed; a signed study never changes, and a correction is an amendment that a director signs.'
  : 'A study is signed only after it is submitted for sign-off.');

/** Who may sign a study awaiting sign-off, and whether this person may, in words. */
function whyWords(f: Facts, isDirector: boolean): string {
  const anyone = f.allowSelfSign
    ? 'Any director may sign it: this laboratory allows one-person sign-off.'
    : f.enterers.length ? `Any director but ${names(f.enterers)}, who entered its rows, may sign it.` : 'Any director may sign it.';
  if (!isDirector) return anyone;
  if (f.enteredRows) {
    return f.allowed
      ? 'You entered rows of this study; this laboratory allows one-person sign-off, so you may sign it, and the history records that you did.'
      : 'You entered rows of this study; this laboratory requires another director to sign it (segregation of duties).';
  }
  // Only a study that moved on since it was read (returned or signed meanwhile) is refused to a director who entered nothing.
  return f.allowed ? `You may sign it. ${anyone}` : 'This study no longer awaits sign-off; open it again to see where it stands.';
}
