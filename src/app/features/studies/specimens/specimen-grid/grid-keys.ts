/** What a key press on the grid asks for, when it is one of the grid's own shortcuts. */
export type GridCommand = 'insert-row' | 'delete-rows' | 'move-up' | 'move-down';

/** The shortcuts, as the toolbar names them in its tooltips. */
export const SHORTCUTS: Record<GridCommand, string> = {
  'insert-row': 'Alt+N',
  'delete-rows': 'Alt+Delete',
  'move-up': 'Alt+↑',
  'move-down': 'Alt+↓',
};

/** Reads a key press: Alt+N adds a row, Alt+Delete deletes, Alt+↑ / Alt+↓ move the row; anything else is null. */
export function gridCommand(event: Pick<KeyboardEvent, 'key' | 'altKey' | 'ctrlKey' | 'metaKey'>): GridCommand | null {
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
