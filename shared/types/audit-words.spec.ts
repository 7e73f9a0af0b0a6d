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

  it('falls back to plain words for an action it has no phrase for', () => {
    expect(describeEvent({ action: 'widget.polished', entity: 'widget', entityId: null, before: null, after: null, reason: null }).headline).toBe('widget polished');
  });
});
