import { plural } from './plural';

/**
 * An audit event in words, for the History tab, the laboratory history page and the exports:
 * "row 14: candidate result 5.2 → 5.4", never raw JSON. Shared by client and server.
 */
export interface AuditEventLike {
  action: string; entity: string; entityId: string | null; before: unknown; after: unknown; reason: string | null;
}

type Obj = Record<string, unknown>;
const isObj = (v: unknown): v is Obj => typeof v === 'object' && v !== null && !Array.isArray(v);
const FIELD: Record<string, string> = {
  comparative: 'comparative result', candidate: 'candidate result', value: 'value', label: 'specimen label', exclusionReason: 'exclusion reason',
  ageBand: 'age band', note: 'note', excluded: 'excluded', sex: 'sex', allowableBiasAbsolute: 'allowable bias', allowableBiasPercent: 'allowable bias %',
  allowableBiasSource: 'source of the allowable bias', decisionLevels: 'decision levels', plannedSpecimens: 'planned specimens', statedLower: 'stated lower limit',
  statedUpper: 'stated upper limit', statedSource: 'source of the stated interval', confidenceLevel: 'confidence level', differenceType: 'difference type',
  demingRatio: 'Deming error ratio', analyteId: 'analyte', comparativeInstrumentId: 'comparative instrument', candidateInstrumentId: 'candidate instrument',
  instrumentId: 'instrument', outlierRule: 'outlier rule', acceptanceRule: 'acceptance rule', intervalMethod: 'interval method', partitionFields: 'partition fields',
  samplePlan: 'plan by simulation',
};
/** A field's name in words: allowableBiasSource → "source of the allowable bias". */
export const fieldWords = (f: string): string => FIELD[f] ?? f.replace(/([A-Z])/g, ' $1').toLowerCase();
const name = fieldWords;
/** A row count in words; an event written before the count was recorded says "0 rows". */
const rows = (n: unknown): string => plural(Number(n ?? 0), 'row');

export function show(v: unknown): string {
  if (v === null || v === undefined || v === '') return '(empty)';
  if (v === true) return 'yes';
  if (v === false) return 'no';
  if (Array.isArray(v)) return v.length ? v.map(show).join(', ') : '(none)';
  if (isObj(v)) return Object.entries(v).map(([k, x]) => `${name(k)} ${show(x)}`).join(', ');
  if (typeof v === 'number') return v.toLocaleString('en-US', { maximumFractionDigits: 10 });
  return String(v);
}

const changesOf = (before: unknown, after: unknown): string[] => {
  const b = isObj(before) ? before : {};
  const a = isObj(after) ? after : {};
  const out: string[] = [];
  for (const k of new Set([...Object.keys(b), ...Object.keys(a)])) {
    if (k === 'settings') out.push(...changesOf(b[k], a[k]));
    else if (JSON.stringify(b[k]) !== JSON.stringify(a[k])) out.push(`${name(k)}: ${show(b[k])} → ${show(a[k])}`);
  }
  return out;
};

function rowLines(after: Obj): string[] {
  const lines: string[] = [];
  for (const c of (after.changes as { row: number; field: string; from: unknown; to: unknown }[]) ?? []) lines.push(`row ${c.row}: ${name(c.field)} ${show(c.from)} → ${show(c.to)}`);
  if (Number(after.moreChanges) > 0) lines.push(`and ${after.moreChanges} more cell changes`);
  for (const r of (after.added as Obj[]) ?? []) { const { row, ...rest } = r; lines.push(`row ${row} added: ${show(rest)}`); }
  for (const r of (after.removed as Obj[]) ?? []) { const { row, ...rest } = r; lines.push(`row ${row} removed (was ${show(rest)})`); }
  return lines.length ? lines : ['no cell changed'];
}

/** A plan's simulation run or an analysis of the rows. */
const runWord = (a: Obj): string => (a.purpose === 'plan' ? 'Plan simulation' : 'Analysis');

const HEADLINES: Record<string, (a: Obj, b: Obj, e: AuditEventLike) => string> = {
  'study.created': (a) => `Study created: "${a.title ?? ''}"`,
  'study.updated': () => 'Setup changed',
  'study.plan-amended': (a) => `Plan changed after approval${a.afterData ? ', after data were entered' : ''}`,
  'study.submitted': () => 'Submitted for sign-off',
  'study.returned': () => 'Returned to draft by the director',
  'study.signed': (a) => `Signed: ${a.meaning === 'accepted' ? 'accepted for patient testing' : 'not accepted for patient testing'}`,
  'study.amended': (a) => `Amendment started; it supersedes study ${a.supersedes} once signed`,
  'study.amendment-started': (a) => `An amendment was started as study ${a.amendment}`,
  'plan.approved': () => 'Plan approved by the director',
  'specimens.saved': (a, b) => `Specimen rows saved (${b.rowCount ?? 0} → ${rows(a.rowCount)})`,
  'specimens.imported.replaced': (a) => `Rows replaced from an uploaded file (${rows(a.rowCount)})`,
  'specimens.imported.appended': (a) => `Rows appended from an uploaded file (now ${rows(a.rowCount)})`,
  'upload.received': (a) => `File "${a.fileName}" uploaded (${rows(a.rows)}, SHA-256 ${String(a.sha256 ?? '').slice(0, 12)}…)`,
  'analysis.queued': (a) => `Analysis queued (seed ${a.seed}, ${show(a.resamples)} resamples, ${a.engineVersion})`,
  'analysis.done': (a) => `${runWord(a)} finished in ${show(a.durationMs)} ms`,
  'analysis.failed': (a) => `${runWord(a)} failed: ${a.error ?? 'unknown error'}`,
  'analysis.requeued': (a) => `${runWord(a)} queued again (attempt ${a.attempt}): ${a.reason}`,
  'plan.queued': (a) => `Plan simulation queued (${show(a.simulations)} simulated studies per n, n = ${Array.isArray(a.n) ? a.n.join(', ') : '?'}; seed ${a.seed})`,
  'signature.self-sign-allowed': () => 'The director signed rows they entered, as the laboratory setting allows',
  'signature.refused': (a, _b, e) => `${a.meaning === 'plan-approved' ? 'Plan approval' : e.entity === 'study' ? 'Signature' : `Signature of ${e.entity} ${e.entityId ?? ''}`.trim()} refused: ${a.why ?? 'wrong password'}`,
  // Wrong passwords as recorded on the user, with no study (signatures before they were recorded on the study, sign-ins, password changes).
  'signature.wrong-password': () => 'Signature refused: wrong password',
  'plan-approval.wrong-password': () => 'Plan approval refused: wrong password',
  'sign-in.wrong-password': () => 'Sign-in refused: wrong password',
  'sign-in.failed': (a) => `Sign-in refused: ${a.why ?? 'unknown e-mail'}`,
  'sign-in.refused': (a) => `Sign-in refused: account ${a.why ?? 'locked'}`,
  'password-change.wrong-password': () => 'Password change refused: wrong current password',
  'integrity.checked': (a) => `Integrity re-checked: ${a.passed ? 'every check passed' : `failed (${show(a.failed)})`}`,
  'history.checked': (a) => `History chains re-checked: ${a.passed ? 'intact' : `failed (${show(a.failed)})`}`,
  'reproduce.checked': (a) => `Results re-run: ${a.identical ? 'identical' : `${plural(Number(a.differences ?? 0), 'field')} ${Number(a.differences) === 1 ? 'differs' : 'differ'}`} (engine ${a.engine})`,
  'laboratory.updated': () => 'Laboratory settings changed',
  'sign-in': () => 'Signed in',
  'sign-out': () => 'Signed out',
  'user.locked': () => 'Account locked after five wrong passwords',
  'user.unlocked': () => 'Account unlocked',
  'user.invited': (a) => `User invited: ${a.name} <${a.email}>`,
  'password.changed': () => 'Password changed',
  'password.set-by-link': () => 'Password chosen with the invitation link',
  'password.reset': () => 'New password chosen with a one-time link; other sessions ended',
  'password-reset.requested': (a) => `Password link asked for with “Forgot your password?” for ${a.email} (${a.outcome})`,
  'password-reset.sent': (a) => `Password link sent by an administrator to ${a.email}`,
  'password-reset.rate-limited': (a) => `Password link refused for ${a.email}: too many requests ${a.which}`,
  'user.link-sent': () => 'Invitation sent again',
  'release.created': (a) => `Release created: "${a.title ?? ''}"`,
  'release.updated': () => 'Release changed',
  'release.study-linked': (a) => `Study ${a.study} linked to "${a.requirement}"`,
  'release.study-unlinked': (a, b) => `Study ${b.study ?? a.study ?? ''} unlinked`,
  'release.waived': (a) => `"${a.requirement}" waived by the director`,
  'release.signed': (a) => `Release signed: ${a.meaning === 'released' ? `released for patient testing${a.goLiveDate ? `, go-live ${a.goLiveDate}` : ''}` : 'not released for patient testing'}`,
  'release.needs-review': (a) => `Needs review: study ${a.amended} was amended (study ${a.amendment})`,
  'release-template.updated': () => 'Release template changed',
  'due.set': (a) => `Re-verification set due: ${show(a.items)}`,
  'due.moved': (a, b) => `Due date of "${a.label}" moved: ${b.dueDate} → ${a.dueDate}`,
  'due.started': (a) => `"${a.label ?? 'Re-verification'}" started as ${a.study ? `study ${a.study}` : `release ${a.release}`}`,
  'due.done': (a) => `"${a.label}" done by ${a.by}`,
  'due.reminded': (a) => `Daily reminder of ${plural(Array.isArray(a.items) ? a.items.length : 0, 'due item')} sent`,
};

const MEANING_CHOSEN: Record<string, string> = { accepted: 'accepted for patient testing', 'not-accepted': 'not accepted for patient testing' };

/** A refused signature: the meaning that was chosen, and how many wrong passwords in a row (the fifth locks the account). */
function refusalLines(a: Obj): string[] {
  const lines: string[] = [];
  if (typeof a.meaning === 'string' && MEANING_CHOSEN[a.meaning]) lines.push(`meaning chosen: ${MEANING_CHOSEN[a.meaning]}`);
  if (a.failures !== undefined) lines.push(`wrong passwords in a row: ${show(a.failures)}`);
  return lines;
}

/** A headline and detail lines for one event. */
export function describeEvent(e: AuditEventLike): { headline: string; details: string[] } {
  const a = isObj(e.after) ? e.after : {};
  const b = isObj(e.before) ? e.before : {};
  const headline = HEADLINES[e.action]?.(a, b, e) ?? `${e.entity} ${e.action.split('.').slice(1).join(' ') || e.action}`;
  let details: string[];
  if (e.action.startsWith('specimens.')) details = rowLines(a);
  else if (['study.updated', 'study.plan-amended', 'user.updated', 'analyte.updated', 'instrument.updated', 'laboratory.updated'].includes(e.action)) details = changesOf(b, a).filter((l) => !l.startsWith('after data'));
  else if (e.action === 'study.submitted' && typeof a.note === 'string') details = [`note for the director: ${a.note}`];
  else if (e.action === 'release.signed') details = [`content hash ${a.contentHash}`, ...(a.comment ? [`comment: ${a.comment}`] : [])];
  else if (['study.signed', 'study.submitted', 'study.returned'].includes(e.action)) details = a.contentHash ? [`content hash ${a.contentHash}`, ...(a.comment ? [`comment: ${a.comment}`] : [])] : [];
  else if (e.action === 'signature.refused') details = refusalLines(a);
  else details = [];
  if (e.reason) details.push(`reason: ${e.reason}`);
  return { headline, details };
}
