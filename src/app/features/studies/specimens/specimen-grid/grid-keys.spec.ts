import { gridCommand } from './grid-keys';

const key = (k: string, mods: Partial<{ altKey: boolean; ctrlKey: boolean; metaKey: boolean; shiftKey: boolean }> = { altKey: true }) => ({
  key: k, altKey: false, ctrlKey: false, metaKey: false, shiftKey: false, ...mods,
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

  it('reads Ctrl+Z as undo, and Ctrl+Y or Ctrl+Shift+Z as redo (⌘ on a Mac)', () => {
    expect(gridCommand(key('z', { ctrlKey: true }))).toBe('undo');
    expect(gridCommand(key('z', { metaKey: true }))).toBe('undo');
    expect(gridCommand(key('y', { ctrlKey: true }))).toBe('redo');
    expect(gridCommand(key('Z', { ctrlKey: true, shiftKey: true }))).toBe('redo');
    expect(gridCommand(key('z', { metaKey: true, shiftKey: true }))).toBe('redo');
  });

  it('leaves other Ctrl keys, and Ctrl+Alt (AltGr) with Z, to the grid and the browser', () => {
    expect(gridCommand(key('v', { ctrlKey: true }))).toBeNull();
    expect(gridCommand(key('z', { ctrlKey: true, altKey: true }))).toBeNull();
    expect(gridCommand(key('z', {}))).toBeNull();
    expect(gridCommand(key('Y', { ctrlKey: true, shiftKey: true }))).toBeNull();
  });
});
