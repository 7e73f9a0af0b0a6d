import { CONFLICT_TEXT, retryDelay, saveStatusText } from './save-status';

describe('saveStatusText', () => {
  const at = (status: Parameters<typeof saveStatusText>[0]['status'], message: string | null = null, retryAt: number | null = null) =>
    saveStatusText({ status, message, retryAt }, 10_000);

  it('says saved, saving and waiting in plain words', () => {
    expect(at('saved')).toBe('Saved');
    expect(at('saving')).toBe('Saving…');
    expect(at('pending')).toBe('Changes not saved yet');
  });

  it("shows the server's message naming the row when a save is refused", () => {
    expect(at('invalid', 'row 14: candidate result is not a number')).toBe('Not saved: row 14: candidate result is not a number');
  });

  it('counts down to the next retry while offline', () => {
    expect(at('offline', null, 13_200)).toBe('Offline: not saved, retrying in 4 s');
    expect(at('offline')).toBe('Offline: not saved');
  });

  it('asks to reload on a conflict', () => {
    expect(at('conflict')).toBe(CONFLICT_TEXT);
  });
});

describe('retryDelay', () => {
  it('doubles from one second up to thirty', () => {
    expect([1, 2, 3, 4, 5, 6, 7].map(retryDelay)).toEqual([1000, 2000, 4000, 8000, 16000, 30000, 30000]);
  });
});
