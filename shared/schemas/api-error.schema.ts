import * as z from 'zod';

/** Every error the API answers has this shape. */
export const ApiIssue = z.object({ path: z.string(), message: z.string() });
export type ApiIssue = z.infer<typeof ApiIssue>;

export const ApiErrorBody = z.object({ error: z.string(), issues: z.array(ApiIssue) });
export type ApiErrorBody = z.infer<typeof ApiErrorBody>;
