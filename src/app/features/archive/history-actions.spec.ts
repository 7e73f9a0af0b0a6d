import { ACTION_CHOICES, actionIcon } from './history-actions';

describe('actionIcon', () => {
  it('picks the most specific prefix an action starts with', () => {
    expect(actionIcon('study.signed')).toBe('draw');
    expect(actionIcon('study.created')).toBe('description');
    expect(actionIcon('sign-in.failed')).toBe('login');
    expect(actionIcon('signature.self-sign-allowed')).toBe('person_pin');
    expect(actionIcon('signature.refused')).toBe('gpp_bad');
    expect(actionIcon('password-reset.requested')).toBe('lock_reset');
    expect(actionIcon('password.reset')).toBe('key');
  });

  it('gives a plain dot to an action it does not know', () => {
    expect(actionIcon('mail.sent')).toBe('circle');
  });
});

describe('ACTION_CHOICES', () => {
  it('offers each prefix once, each within what the API accepts', () => {
    const prefixes = ACTION_CHOICES.map((c) => c.prefix);
    expect(new Set(prefixes).size).toBe(prefixes.length);
    expect(prefixes.every((p) => p.length > 0 && p.length <= 60 && !/[%_\\]/.test(p))).toBe(true);
  });
});
