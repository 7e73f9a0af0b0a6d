/** What a key press on the grid asks for, when it is one of the grid's own shortcuts. */
export type GridCommand = 'insert-row' | 'delete-rows' | 'move-up' | 'move-down' | 'undo' | 'redo';

/** The shortcuts, as the toolbar names them in its tooltips. */
export const SHORTCUTS: Record<GridCommand, string> = {
  'insert-row': 'Alt+N',
  'delete-rows': 'Alt+Delete',
  'move-up': 'Alt+↑',
  'move-down': 'Alt+↓',
  undo: 'Ctrl+Z',
  redo: 'Ctrl+Y',
};

type Keys = Pick<KeyboardEvent, 'key' | 'altKey' | 'ctrlKey' | 'metaKey'> & Partial<Pick<KeyboardEvent, 'shiftKey'>>;

/**
 * Reads a key press: Alt+N adds a row, Alt+Delete deletes, Alt+↑ / Alt+↓ move the row; Ctrl+Z undoes,
 * Ctrl+Y and Ctrl+Shift+Z redo (⌘ in place of Ctrl on a Mac); anything else is null.
 */
export function gridCommand(event: Keys): GridCommand | null {
  if ((event.ctrlKey || event.metaKey) && !event.altKey) {
    const key = event.key.toLowerCase();
    if (key === 'z') return event.shiftKey ? 'redo' : 'undo';
    if (key === 'y' && !event.shiftKey) return 'redo';
    return null;
  }
  if (!event.altKey || event.ctrlKey || event.metaKey) return null;
  switch (event.key) {
    case 'n':
    case 'N':
      return 'insert-row';
    case 'Delete':
    case 'Backspace':
      return 'delete-rows';
    case 'ArrowUp':
      return 'move-up';
    case 'ArrowDown':
      return 'move-down';
    default:
      return null;
  }
}
