import { gridCommand } from './grid-keys';

const key = (k: string, mods: Partial<{ altKey: boolean; ctrlKey: boolean; metaKey: boolean }> = { altKey: true }) => ({
  key: k, altKey: false, ctrlKey: false, metaKey: false, ...mods,
});

describe('gridCommand', () => {
  it('reads the Alt shortcuts', () => {
    expect(gridCommand(key('n'))).toBe('insert-row');
    expect(gridCommand(key('N'))).toBe('insert-row');
    expect(gridCommand(key('Delete'))).toBe('delete-rows');
    expect(gridCommand(key('ArrowUp'))).toBe('move-up');
    expect(gridCommand(key('ArrowDown'))).toBe('move-down');
  });

  it('leaves keys without Alt, or with Ctrl as well, to the grid', () => {
    expect(gridCommand(key('n', {}))).toBeNull();
    expect(gridCommand(key('ArrowUp', { altKey: true, ctrlKey: true }))).toBeNull();
    expect(gridCommand(key('x'))).toBeNull();
  });
});
