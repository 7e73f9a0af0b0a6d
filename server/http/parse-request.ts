import type { z } from 'zod';
import { AppError } from './app-error';
import { refuseControlCharacters } from './control-characters';

/**
 * Parses a body, query or params with its zod schema; a bad one is a 400 that names each field.
 * A control character is refused here too: route parameters (and multipart fields) are only parsed
 * after the API router's own check has run.
 */
export function parseRequest<S extends z.ZodType>(schema: S, input: unknown, where: 'body' | 'query' | 'params'): z.infer<S> {
  refuseControlCharacters(input);
  const result = schema.safeParse(input ?? {});
  if (result.success) return result.data;
  const issues = result.error.issues.map((i) => ({ path: i.path.map(String).join('.') || where, message: i.message }));
  const first = issues[0];
  throw new AppError('invalid_request', `Invalid ${where}: ${first.path}: ${first.message}`, issues);
}
