import { VERDICTS } from '@shared/schemas';
import { VERDICT_CHOICES, meaningWords, verdictView } from './verdict-view';

describe('verdictView', () => {
  it('gives every verdict of the API its own icon and word', () => {
    const views = VERDICTS.map((v) => verdictView(v));
    expect(new Set(views.map((v) => v.icon)).size).toBe(VERDICTS.length);
    expect(new Set(views.map((v) => v.word)).size).toBe(VERDICTS.length);
    expect(views.map((v) => v.key)).toEqual([...VERDICTS]);
  });

  it('says in words that a comparison beyond its goal exceeds it', () => {
    expect(verdictView('exceeds')).toMatchObject({ icon: 'cancel', word: 'Exceeds goal' });
    expect(verdictView('exceeds').sentence).toContain('beyond the allowable bias');
  });

  it('reads a missing verdict as "No verdict" rather than a pass', () => {
    expect(verdictView(null)).toMatchObject({ key: 'none', word: 'No verdict' });
    expect(verdictView(undefined).word).toBe('No verdict');
  });

  it('offers each verdict once in the search chooser', () => {
    expect(VERDICT_CHOICES.map((v) => v.key)).toEqual([...VERDICTS]);
  });
});

describe('meaningWords', () => {
  it('spells out what a signature means', () => {
    expect(meaningWords('accepted')).toBe('Accepted for patient testing');
    expect(meaningWords('not-accepted')).toBe('Not accepted for patient testing');
    expect(meaningWords(null)).toBe('Not signed');
  });

  it('shows an unknown meaning as it came', () => {
    expect(meaningWords('reviewed')).toBe('reviewed');
  });
});
