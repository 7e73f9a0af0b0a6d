import { ValidatorFn } from '@angular/forms';
import type { ZodType } from 'zod';
import type { ApiIssue } from '@shared/schemas';

/** A form validator that applies one shared zod schema, so a field says what the server would say. */
export function schemaRule(schema: ZodType): ValidatorFn {
  return (control) => {
    const result = schema.safeParse(control.value);
    return result.success ? null : { rule: result.error.issues[0]?.message ?? 'Not valid' };
  };
}

/** Checks a whole request body with its shared schema; the issues come out in the API's own shape. */
export function schemaIssues(schema: ZodType, body: unknown): ApiIssue[] {
  const result = schema.safeParse(body);
  if (result.success) return [];
  return result.error.issues.map((issue) => ({ path: issue.path.map(String).join('.'), message: issue.message }));
}
