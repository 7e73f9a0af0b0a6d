import { historyFilterFrom } from './history-query';

describe('historyFilterFrom', () => {
  it('reads the action prefix, study, dates and page from the address', () => {
    expect(historyFilterFrom({ action: 'study.', studyId: '12', from: '2026-01-01', to: '2026-01-31', page: '3', pageSize: '100' })).toEqual({
      action: 'study.', studyId: 12, from: '2026-01-01', to: '2026-01-31', page: 3, pageSize: 100,
    });
  });

  it('drops a study id, user id or page size the API would refuse', () => {
    expect(historyFilterFrom({ studyId: 'abc', pageSize: '5000', from: '1/2/2026', userId: 'x' })).toEqual({});
  });

  it('keeps the person chosen', () => {
    expect(historyFilterFrom({ userId: '4' })).toEqual({ userId: 4 });
  });
});
