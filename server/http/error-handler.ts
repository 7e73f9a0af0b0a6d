import type { ErrorRequestHandler, RequestHandler } from 'express';
import { AppError, STATUS } from './app-error';
import { logFailure } from '../log';
import { isDatabaseUnavailable, RETRY_AFTER_SECONDS } from './database-errors';

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
  // busboy (under multer) refuses a multipart body it cannot read, e.g. a NUL in a file name.
  if (/^(Malformed part header|Unexpected end of form|Multipart: Boundary not found)/.test(err?.message ?? '')) {
    const message = 'The upload could not be read: its form or the file\'s name is malformed (for example a control character in the name); rename the file and try again';
    res.status(400).json({ error: message, issues: [{ path: 'file', message }] });
    return;
  }
  if (err?.type === 'entity.too.large') {
    res.status(413).json({ error: 'The request is too large', issues: [] });
    return;
  }
  if (isDatabaseUnavailable(err)) {
    res.setHeader('Retry-After', String(RETRY_AFTER_SECONDS));
    res.status(503).json({
      error: `The database is not answering at the moment${mutating(req.method) ? ', so nothing was saved' : ''}; try again in a few seconds`,
      issues: [],
    });
    return;
  }
  // Never the error object itself: drizzle's message carries the SQL parameters, i.e. row data.
  logFailure(`${req.method} ${req.path}`, err, 0);
  res.status(500).json({ error: `Something went wrong on the server${mutating(req.method) ? '; the change was not saved' : ''}`, issues: [] });
};

const mutating = (method: string) => !['GET', 'HEAD', 'OPTIONS'].includes(method);
