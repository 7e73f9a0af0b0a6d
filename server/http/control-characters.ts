import type { RequestHandler } from 'express';
import type { ApiIssue } from '@shared/schemas';
import { AppError } from './app-error';

/**
 * C0 control characters and DEL, except tab, line feed and carriage return (multi-line comments and
 * notes keep those). NUL in particular makes PostgreSQL fail the whole statement.
 */
const CONTROL = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F]/;
const CONTROL_ALL = new RegExp(CONTROL.source, 'g');
/** Enough issues to fix a pasted block at once; the walk stops there. */
const MAX_ISSUES = 20;

const codePoint = (c: string) => `U+${c.charCodeAt(0).toString(16).toUpperCase().padStart(4, '0')}`;
/** A field name fit to print: its control characters written as \u0000. */
const printable = (key: string) => key.replace(CONTROL_ALL, (c) => `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`);
/** "rows.2.label" is named as the grid numbers it, "row 3: label"; other paths as they are. */
const named = (path: string): string => {
  const row = /^rows\.(\d+)\.(.+)$/.exec(path);
  return row ? `row ${Number(row[1]) + 1}: ${row[2]}` : `${path}:`;
};

/** The first control character of a text, if any (e.g. "\u0000"). */
export function controlCharacterIn(text: string): string | null {
  return CONTROL.exec(text)?.[0] ?? null;
}

/**
 * Every control character in a value (strings, arrays and objects, keys included), as issues naming
 * the field by its path: `{ path: 'title', message: 'title: contains a control character (U+0000); remove it' }`.
 * Walks without recursion, so a deeply nested body cannot overflow the stack.
 */
export function controlCharacterIssues(value: unknown, root = ''): ApiIssue[] {
  const issues: ApiIssue[] = [];
  // [value, path, a control character in the value's own name]: names are reported in their place, in order
  const stack: [unknown, string, string | null][] = [[value, root, null]];
  const report = (path: string, c: string, what: string) =>
    issues.push({ path: path || 'body', message: `${named(path || 'body')} ${what} a control character (${codePoint(c)}); remove it` });
  while (stack.length && issues.length < MAX_ISSUES) {
    const [item, path, inName] = stack.pop()!;
    if (inName) report(path, inName, 'has a name with');
    else if (typeof item === 'string') {
      const c = controlCharacterIn(item);
      if (c) report(path, c, 'contains');
    } else if (item !== null && typeof item === 'object') {
      const entries = Array.isArray(item) ? item.map((v, i) => [String(i), v] as const) : Object.entries(item);
      for (let i = entries.length - 1; i >= 0; i--) {
        const [key, child] = entries[i];
        stack.push([child, path ? `${path}.${printable(key)}` : printable(key), controlCharacterIn(key)]);
      }
    }
  }
  return issues.slice(0, MAX_ISSUES);
}

/** Throws a 400 naming each field that holds a control character (the AppError shape: `{ error, issues }`). */
export function refuseControlCharacters(value: unknown, root = ''): void {
  const issues = controlCharacterIssues(value, root);
  if (!issues.length) return;
  const more = issues.length > 1 ? ` (and ${issues.length - 1} more)` : '';
  throw new AppError('invalid_request', `${issues[0].message}${more}`, issues);
}

/**
 * Refuses a request whose address, query or JSON body (keys and values, nested) holds a control
 * character, with a 400 that names the field, before any of it reaches the database. Mounted on the
 * API router after express.json; route parameters are checked again in parseRequest.
 */
export const controlCharacters: RequestHandler = (req, _res, next) => {
  try {
    const c = controlCharacterIn(decodedPath(req.path));
    if (c) throw new AppError('invalid_request', `The address contains a control character (${codePoint(c)}); remove it`, [
      { path: 'path', message: `the address contains a control character (${codePoint(c)}); remove it` },
    ]);
    refuseControlCharacters(req.query);
    refuseControlCharacters(req.body);
    next();
  } catch (err) {
    next(err);
  }
};

/** The path as the routes will read it; a malformed escape is left to the router. */
function decodedPath(path: string): string {
  try {
    return decodeURIComponent(path);
  } catch {
    return path;
  }
}
