import type { ErrorRequestHandler, RequestHandler } from 'express';
import { AppError, STATUS } from './app-error';

export const notFoundHandler: RequestHandler = (req, res) => {
  res.status(404).json({ error: `No such route: ${req.method} ${req.path}`, issues: [] });
};

/** Registered last: AppError → its status; malformed JSON → 400; anything else → a logged 500 without a stack. */
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  if (err instanceof AppError) {
    res.status(STATUS[err.code]).json({ error: err.message, issues: err.issues });
    return;
  }
  if (err?.type === 'entity.parse.failed') {
    res.status(400).json({ error: 'The request body is not valid JSON', issues: [{ path: 'body', message: 'not valid JSON' }] });
    return;
  }
  if (err?.code === 'LIMIT_FILE_SIZE') {
    res.status(413).json({ error: 'The file is larger than 5 MB', issues: [{ path: 'file', message: 'at most 5 MB' }] });
    return;
  }
  if (err?.code?.startsWith?.('LIMIT_')) {
    res.status(400).json({ error: `The upload was refused: ${err.message}`, issues: [{ path: err.field ?? 'file', message: err.message }] });
    return;
  }
  if (err?.type === 'entity.too.large') {
    res.status(413).json({ error: 'The request is too large', issues: [] });
    return;
  }
  console.error(`[parallax] ${req.method} ${req.path} failed:`, err);
  const mutating = !['GET', 'HEAD', 'OPTIONS'].includes(req.method);
  res.status(500).json({ error: `Something went wrong on the server${mutating ? '; the change was not saved' : ''}`, issues: [] });
};
