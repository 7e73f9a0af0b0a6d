import { kindsWords, metWords, releaseStateBadge, requirementBadge, studyLink } from './release-words';

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
