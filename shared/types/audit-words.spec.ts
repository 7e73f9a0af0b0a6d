import { describeEvent } from './audit-words';

describe('audit events in words', () => {
  it('says which cell of which row changed, from what to what', () => {
    const d = describeEvent({
      action: 'specimens.saved', entity: 'specimens', entityId: '4', reason: null, before: { rowCount: 40 },
      after: { rowCount: 41, changes: [{ row: 14, field: 'candidate', from: '5.2', to: '5.4' }], added: [{ row: 41, label: 'S041', comparative: '6.1', candidate: '6.3' }], removed: [] },
    });
    expect(d.headline).toBe('Specimen rows saved (40 → 41 rows)');
    expect(d.details).toEqual(['row 14: candidate result 5.2 → 5.4', 'row 41 added: specimen label S041, comparative result 6.1, candidate result 6.3']);
  });

  it('lists changed settings and the reason of a plan amendment', () => {
    const d = describeEvent({
      action: 'study.plan-amended', entity: 'study', entityId: '2', reason: 'goal revised by the director',
      before: { allowableBiasPercent: 4 }, after: { allowableBiasPercent: 5, afterData: true },
    });
    expect(d.headline).toBe('Plan changed after approval, after data were entered');
    expect(d.details).toEqual(['allowable bias %: 4 → 5', 'reason: goal revised by the director']);
  });

  it('writes one row as "1 row", not "1 rows"', () => {
    const d = describeEvent({ action: 'specimens.imported.replaced', entity: 'specimens', entityId: '4', reason: null, before: null, after: { rowCount: 1 } });
    expect(d.headline).toBe('Rows replaced from an uploaded file (1 row)');
    expect(describeEvent({ action: 'reproduce.checked', entity: 'study', entityId: '4', reason: null, before: null, after: { identical: false, differences: 1, engine: 'e' } }).headline)
      .toBe('Results re-run: 1 field differs (engine e)');
  });

  it('says who asked for a password link and what came of it', () => {
    const d = describeEvent({ action: 'password-reset.requested', entity: 'user', entityId: null, reason: null, before: null, after: { email: 'x@valeharbor.example', outcome: 'unknown e-mail' } });
    expect(d.headline).toBe('Password link asked for with “Forgot your password?” for x@valeharbor.example (unknown e-mail)');
  });

  it('falls back to plain words for an action it has no phrase for', () => {
    expect(describeEvent({ action: 'widget.polished', entity: 'widget', entityId: null, before: null, after: null, reason: null }).headline).toBe('widget polished');
  });
});

describe('a refused e-signature in words', () => {
  const refused = (entity: string, after: object) => describeEvent({ action: 'signature.refused', entity, entityId: '12', reason: null, before: null, after });

  it('says a signature of the study was refused for a wrong password, with the meaning chosen and the count', () => {
    const d = refused('study', { why: 'wrong password', failures: 2, meaning: 'accepted', address: '127.0.0.1' });
    expect(d).toEqual({ headline: 'Signature refused: wrong password', details: ['meaning chosen: accepted for patient testing', 'wrong passwords in a row: 2'] });
  });

  it('names a plan approval, an account already locked, and a record other than a study', () => {
    expect(refused('study', { why: 'wrong password', failures: 1, meaning: 'plan-approved' }).headline).toBe('Plan approval refused: wrong password');
    expect(refused('study', { why: 'account locked', meaning: 'not-accepted' })).toEqual({
      headline: 'Signature refused: account locked', details: ['meaning chosen: not accepted for patient testing'],
    });
    expect(refused('release', { why: 'wrong password', failures: 3, meaning: 'released' })).toEqual({
      headline: 'Signature of release 12 refused: wrong password', details: ['wrong passwords in a row: 3'],
    });
  });

  it('words the wrong passwords recorded on the user instead of showing their keys', () => {
    const on = (action: string, after: object = {}) => describeEvent({ action, entity: 'user', entityId: '3', reason: null, before: null, after }).headline;
    expect(on('sign-in.wrong-password', { failures: 1 })).toBe('Sign-in refused: wrong password');
    expect(on('signature.wrong-password', { failures: 1 })).toBe('Signature refused: wrong password');
    expect(on('plan-approval.wrong-password')).toBe('Plan approval refused: wrong password');
    expect(on('password-change.wrong-password')).toBe('Password change refused: wrong current password');
    expect(on('sign-in.refused', { why: 'inactive' })).toBe('Sign-in refused: account inactive');
    expect(on('sign-in.failed', { why: 'unknown e-mail' })).toBe('Sign-in refused: unknown e-mail');
  });
});
