import { addDays, addMonths, daysBetween, dueStatus, dueWords } from './due-dates';

describe('due dates', () => {
  it('adds calendar months, keeping the day or taking the month\'s last', () => {
    expect(addMonths('2026-12-03', 6)).toBe('2027-06-03');
    expect(addMonths('2026-08-31', 6)).toBe('2027-02-28');
    expect(addMonths('2027-08-31', 6)).toBe('2028-02-29');
    expect(addMonths('2026-11-15', 12)).toBe('2027-11-15');
    expect(addMonths('2026-01-31', 1)).toBe('2026-02-28');
  });

  it('adds days across month and year ends', () => {
    expect(addDays('2026-12-30', 3)).toBe('2027-01-02');
    expect(addDays('2026-03-01', -1)).toBe('2026-02-28');
  });

  it('counts whole days across months and years', () => {
    expect(daysBetween('2026-12-03', '2027-01-02')).toBe(30);
    expect(daysBetween('2027-01-02', '2026-12-03')).toBe(-30);
    expect(daysBetween('2026-03-28', '2026-03-30')).toBe(2);
  });

  it('says overdue, due soon (within 30 days) or later', () => {
    expect(dueStatus('2026-12-02', '2026-12-03')).toBe('overdue');
    expect(dueStatus('2026-12-03', '2026-12-03')).toBe('due-soon');
    expect(dueStatus('2027-01-02', '2026-12-03')).toBe('due-soon');
    expect(dueStatus('2027-01-03', '2026-12-03')).toBe('later');
  });

  it('puts the distance in words', () => {
    expect(dueWords('2026-11-21', '2026-12-03')).toBe('overdue by 12 days');
    expect(dueWords('2026-12-02', '2026-12-03')).toBe('overdue by 1 day');
    expect(dueWords('2026-12-03', '2026-12-03')).toBe('due today');
    expect(dueWords('2026-12-23', '2026-12-03')).toBe('due in 20 days');
  });
});
