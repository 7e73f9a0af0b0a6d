import * as z from 'zod';

export const AnalysisState = z.enum(['queued', 'running', 'done', 'failed']);
export type AnalysisState = z.infer<typeof AnalysisState>;

/**
 * An analysis run. `results` has the shape that `npm run analyze` prints for the study's kind
 * (shared/stats), so the command line, the API, the page and the PDF read one result schema.
 */
export const Analysis = z.object({
  id: z.number(),
  studyId: z.number(),
  state: AnalysisState,
  progress: z.number(),
  engineVersion: z.string(),
  seed: z.string(),
  resamples: z.number(),
  inputHash: z.string(),
  current: z.boolean(),
  results: z.unknown().nullable(),
  error: z.string().nullable(),
  queuedAt: z.string(),
  startedAt: z.string().nullable(),
  finishedAt: z.string().nullable(),
  durationMs: z.number().nullable(),
});
export type Analysis = z.infer<typeof Analysis>;
