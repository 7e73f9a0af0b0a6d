import type { Request, Response } from 'express';
import type { AnalysisChange } from './analysis-events';
import type { SignedInUser } from '../auth/session-user';
import type { AppContext } from '../context';
import { AppError, notFound } from '../http/app-error';
import { logFailure } from '../log';
import { scopeOf } from '../db/lab-scope';
import { labAnalysisState } from './analyses.repository';

const ENDED = new Set(['done', 'failed']);
/** A comment line now and then keeps proxies from closing a quiet stream. */
const KEEP_ALIVE_MS = 15_000;
/** No stream is held open longer than this; the page reconnects or polls. */
const LONGEST_MS = 30 * 60_000;

/**
 * `GET /api/v1/analyses/:id/events`: server-sent events for one analysis. The first event is its state as
 * stored; then every change pushed by the worker (analysis-events.ts) until it is done or failed, when the
 * stream ends. The page reads the results once, at the end. When this process has no notification
 * connection the answer is 503 and the page polls instead.
 */
export async function streamAnalysis(ctx: AppContext, me: SignedInUser, id: number, req: Request, res: Response): Promise<void> {
  const events = ctx.jobs.events;
  if (!events.listening) {
    res.setHeader('Retry-After', '2');
    throw new AppError('unavailable', 'Progress cannot be pushed just now; the page asks for it instead');
  }
  let open = true;
  const waiting: AnalysisChange[] = [];
  let started = false;
  const send = (c: AnalysisChange) => {
    if (!open) return;
    res.write(`event: state\ndata: ${JSON.stringify({ id: c.id, state: c.state, progress: c.progress })}\n\n`);
    if (ENDED.has(c.state)) close();
  };
  const onChange = (c: AnalysisChange) => {
    if (c.id !== id) return;
    if (started) send(c);
    else waiting.push(c);
  };
  const reread = () => {
    current().then((c) => c && send(c)).catch((err) => logFailure('re-reading an analysis for its stream', err));
  };
  const current = async (): Promise<AnalysisChange | null> => {
    return (await labAnalysisState(ctx.db, scopeOf(me), id)) ?? null;
  };
  let keepAlive: NodeJS.Timeout | undefined;
  let longest: NodeJS.Timeout | undefined;
  function close() {
    if (!open) return;
    open = false;
    events.off('change', onChange);
    events.off('reconnected', reread);
    clearInterval(keepAlive);
    clearTimeout(longest);
    if (started) res.end();
  }
  // Listen before reading, so no change between the read and the first event is lost.
  events.on('change', onChange);
  events.on('reconnected', reread);
  req.on('close', close);
  const first = await current().catch((err) => {
    close();
    throw err;
  });
  if (!first) {
    close();
    throw notFound('Analysis');
  }
  if (!open) return;
  res.status(200).set({ 'Content-Type': 'text/event-stream; charset=utf-8', 'Cache-Control': 'no-cache, no-transform', 'X-Accel-Buffering': 'no' });
  res.flushHeaders();
  started = true;
  res.write('retry: 2000\n\n');
  send(first);
  for (const c of waiting) send(c);
  if (!open) return;
  keepAlive = setInterval(() => res.write(': still here\n\n'), KEEP_ALIVE_MS);
  longest = setTimeout(close, LONGEST_MS);
}
