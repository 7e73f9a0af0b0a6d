/**
 * Where the rows on screen stand against the server:
 * saved · pending (changed, waiting for a pause in typing) · saving · invalid (the server refused a row)
 * · offline (the server cannot be reached; retrying) · conflict (someone else saved first) · failed (refused otherwise).
 */
export type SaveStatus = 'saved' | 'pending' | 'saving' | 'invalid' | 'offline' | 'conflict' | 'failed';

export interface SaveStatusView {
  status: SaveStatus;
  /** The server's words for the last failed save. */
  message: string | null;
  /** When the next automatic retry runs (ms since the epoch), while offline. */
  retryAt: number | null;
}

export const CONFLICT_TEXT = 'Someone else changed these specimens; reload to see their change. Your edits stay on screen until you reload.';

/** The save state in words, as the toolbar shows it. */
export function saveStatusText(view: SaveStatusView, now: number): string {
  switch (view.status) {
    case 'saved':
      return 'Saved';
    case 'pending':
      return 'Changes not saved yet';
    case 'saving':
      return 'Saving…';
    case 'invalid':
      return `Not saved: ${view.message ?? 'the server refused a row'}`;
    case 'offline': {
      const seconds = view.retryAt === null ? null : Math.max(0, Math.ceil((view.retryAt - now) / 1000));
      return seconds === null ? 'Offline: not saved' : `Offline: not saved, retrying in ${seconds} s`;
    }
    case 'conflict':
      return CONFLICT_TEXT;
    case 'failed':
      return `Not saved: ${view.message ?? 'the server refused the change'}`;
  }
}

/** The wait before the n-th retry in a row (n from 1): 1 s, 2 s, 4 s … at most 30 s. */
export function retryDelay(attempt: number): number {
  return Math.min(30_000, 1000 * 2 ** Math.max(0, attempt - 1));
}
