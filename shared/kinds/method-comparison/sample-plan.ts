import * as z from 'zod';
import type { ComparisonPlanOptions } from '../../stats/plan-comparison';
import type { StudySettings } from '../../schemas/study.schema';

const num = (what: string) => z.number({ error: `${what} must be a number` }).finite(`${what} must be a finite number`);

/**
 * The plan of a method comparison before data (the Plan panel on Setup): the stated truth the study is simulated
 * under and the grid of sizes. The regression, the decision levels, the allowable bias, the Deming ratio, the
 * reporting decimals and the seed are the study's own settings, so the plan simulates the analysis as planned.
 */
export const SamplePlan = z.object({
  errorModel: z.enum(['constant', 'proportional'], { error: 'Choose constant (SD) or proportional (CV) error' }).default('proportional'),
  /** SD in the unit (constant) or CV in % (proportional). */
  cvComparative: num('The comparative method\'s imprecision').positive('The comparative method\'s imprecision must be above 0'),
  cvCandidate: num('The candidate method\'s imprecision').positive('The candidate method\'s imprecision must be above 0'),
  low: num('The low end of the range'),
  high: num('The high end of the range'),
  shape: z.enum(['uniform', 'log-uniform', 'earlier-study'], { error: 'Choose uniform, log-uniform or an earlier study\'s values' }).default('uniform'),
  /** For shape 'earlier-study': the study whose comparative values are drawn. */
  earlierStudyId: z.number().int().positive().nullable().default(null),
  n: z.array(z.number().int('Each n must be a whole number').min(5, 'Each n must be at least 5').max(2000, 'Each n must be at most 2,000'))
    .min(1, 'List at least one number of specimens').max(12, 'List at most 12 numbers of specimens').default([40, 60, 80, 100, 120, 160, 200]),
  simulations: z.number().int().min(100, 'At least 100 simulated studies').max(20000, 'At most 20,000 simulated studies').default(1000),
  targetPower: z.number().min(0.5, 'The target power must be at least 50%').max(0.99, 'The target power must be at most 99%').default(0.8),
  maxFalsePass: z.number().min(0.001, 'The false-pass limit must be at least 0.1%').max(0.5, 'The false-pass limit must be at most 50%').default(0.05),
}).refine((p) => p.shape === 'earlier-study' || p.high > p.low, { message: 'The high end of the range must be above the low end', path: ['high'] })
  .refine((p) => p.shape !== 'log-uniform' || p.low > 0, { message: 'A log-uniform range needs a low end above 0', path: ['low'] })
  .refine((p) => p.shape !== 'earlier-study' || p.earlierStudyId !== null, { message: 'Choose the earlier study whose values are drawn', path: ['earlierStudyId'] });
export type SamplePlan = z.infer<typeof SamplePlan>;

/** The method comparison's own settings: the plan, which no analysis reads (record-only) and the director approves. */
export const MethodComparisonSettings = z.object({
  samplePlan: SamplePlan.nullable().default(null),
});

/** The engine's plan options for a study's settings (and the earlier study's comparative values, for that shape). */
export function planOptionsFor(settings: StudySettings & { samplePlan?: SamplePlan | null }, earlierValues: number[] | null = null): ComparisonPlanOptions | null {
  const p = settings.samplePlan;
  if (!p) return null;
  return {
    cvComparative: p.cvComparative, cvCandidate: p.cvCandidate, errorModel: p.errorModel,
    ...(p.shape === 'earlier-study' ? { shape: 'values' as const, values: earlierValues ?? [] } : { shape: p.shape, low: p.low, high: p.high }),
    regression: settings.regression, differenceType: settings.differenceType, demingRatio: settings.demingRatio,
    decisionLevels: settings.decisionLevels, allowableBias: settings.allowableBiasAbsolute, allowableBiasPercent: settings.allowableBiasPercent,
    n: p.n, simulations: p.simulations, seed: settings.seed, level: settings.confidenceLevel, decimals: settings.decimals,
    targetPower: p.targetPower, maxFalsePass: p.maxFalsePass,
  };
}

/** The engine's option names as Setup's fields: "decisionLevels" → settings.decisionLevels, "cvComparative" → settings.samplePlan.cvComparative. */
export function planOptionPath(option: string): string {
  const own: Record<string, string> = {
    regression: 'settings.regression', differenceType: 'settings.differenceType', demingRatio: 'settings.demingRatio', decisionLevels: 'settings.decisionLevels',
    allowableBias: 'settings.allowableBiasAbsolute', allowableBiasPercent: 'settings.allowableBiasPercent', seed: 'settings.seed', level: 'settings.confidenceLevel',
    decimals: 'settings.decimals', values: 'settings.samplePlan.earlierStudyId',
  };
  return own[option] ?? `settings.samplePlan.${option}`;
}
