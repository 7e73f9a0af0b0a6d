import { daysBetween, dueWords, kindsWords, metWords, releaseStateBadge, requirementBadge, studyLink } from './release-words';

describe('dueWords', () => {
  it('says how long ago an overdue item fell due, in days', () => {
    expect(dueWords('2026-03-01', '2026-03-13')).toBe('overdue by 12 days');
    expect(dueWords('2026-03-12', '2026-03-13')).toBe('overdue by 1 day');
  });

  it('says how soon an item falls due, and "due today" on the day', () => {
    expect(dueWords('2026-04-02', '2026-03-13')).toBe('due in 20 days');
    expect(dueWords('2026-03-14', '2026-03-13')).toBe('due in 1 day');
    expect(dueWords('2026-03-13', '2026-03-13')).toBe('due today');
  });

  it('counts calendar days across a change of summer time and a leap day', () => {
    expect(daysBetween('2026-03-28', '2026-03-30')).toBe(2);
    expect(daysBetween('2028-02-28', '2028-03-01')).toBe(2);
  });
});

describe('release words', () => {
  it('gives every state and status an icon and words of its own', () => {
    expect(releaseStateBadge('released')).toEqual({ icon: 'verified', word: 'Released for patient testing' });
    expect(releaseStateBadge('needs-review').word).toBe('Needs review');
    expect(requirementBadge('missing')).toEqual({ icon: 'radio_button_unchecked', word: 'Missing' });
    expect(requirementBadge('waived').word).toBe('Waived');
    const icons = (['missing', 'in-progress', 'met', 'not-met', 'waived'] as const).map((s) => requirementBadge(s).icon);
    expect(new Set(icons).size).toBe(5);
  });

  it('opens a draft study at its Setup and a submitted or signed one at its review', () => {
    expect(studyLink({ id: 4, state: 'draft' })).toEqual(['/studies', 4, 'setup']);
    expect(studyLink({ id: 4, state: 'awaiting-signoff' })).toEqual(['/studies', 4, 'review']);
    expect(studyLink({ id: 4, state: 'signed' })).toEqual(['/studies', 4, 'review']);
  });

  it('names the kinds that meet a requirement and counts what is met', () => {
    expect(kindsWords(['method-comparison'])).toBe('Method comparison');
    expect(kindsWords(['method-comparison', 'precision', 'reportable-range'])).toBe('Method comparison, Precision verification or Reportable range');
    expect(metWords(2, 3)).toBe('2 of 3 met');
    expect(metWords(0, 0)).toBe('No requirements');
  });
});
