import * as z from 'zod';
import { Analysis } from './analysis.schema';

/** One method's imprecision as a signed precision study of the same analyte and instrument found it. */
export const ImprecisionSuggestion = z.object({
  studyId: z.number(),
  title: z.string(),
  instrument: z.string(),
  signedAt: z.string(),
  /** Per material: its mean and within-laboratory SD and CV (%). */
  materials: z.array(z.object({ name: z.string(), mean: z.number(), sd: z.number(), cv: z.number() })),
  /** What the Plan panel fills in: the largest within-laboratory CV (proportional) and the largest SD (constant). */
  cv: z.number(),
  sd: z.number(),
});
export type ImprecisionSuggestion = z.infer<typeof ImprecisionSuggestion>;

/** A study's plan by simulation as the API answers it (GET /studies/:id/plan). */
export const StudyPlan = z.object({
  /** Problems that keep the plan from running, each naming its Setup field ("settings.samplePlan.low: …"). */
  problems: z.array(z.object({ path: z.string(), message: z.string() })),
  /** The latest simulation run of the plan (an analysis with purpose 'plan'), with its results when done. */
  latest: Analysis.nullable(),
  /** Whether the latest finished run was made from the plan as it is now set. */
  current: z.boolean(),
  imprecision: z.object({ comparative: ImprecisionSuggestion.nullable(), candidate: ImprecisionSuggestion.nullable() }),
  /** Method comparisons of the same analyte whose comparative values may shape the planned range (shape 'earlier-study'). */
  earlierStudies: z.array(z.object({ id: z.number(), title: z.string(), n: z.number() })),
});
export type StudyPlan = z.infer<typeof StudyPlan>;
