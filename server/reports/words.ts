import { BIAS_CI_WORDS } from '@shared/types/findings-rows';
import { REGRESSION_NAMES } from '@shared/types/regression-words';

/** The report's fixed wording. The caution (shared/text/caution.ts) is printed in full near the findings and again at the end. */
export { CAUTION } from '@shared/text/caution';

/** A verdict in words, as the findings page and the workbook say it: shared/text/verdict-words.ts. */
export { VERDICT_WORDS } from '@shared/text/verdict-words';

export const MEANING_WORDS = { accepted: 'Accepted for patient testing', 'not-accepted': 'Not accepted for patient testing' } as const;

export const REGRESSION_WORDS: Record<string, string> = REGRESSION_NAMES;

export const DIFFERENCE_WORDS: Record<string, string> = {
  absolute: 'Absolute: candidate − comparative',
  'percent-mean': 'Percent of the pair mean: 100·(y − x)/((x + y)/2)',
  'percent-x': 'Percent of the comparative result: 100·(y − x)/x',
};

const capital = (text: string): string => text.charAt(0).toUpperCase() + text.slice(1);

/** CI methods by name; the bootstrap kinds of bias and limits in the findings page's words. */
export const CI_WORDS: Record<string, string> = {
  percentile: capital(BIAS_CI_WORDS.percentile),
  bca: capital(BIAS_CI_WORDS.bca),
  rank: 'Rank-based',
  bootstrap: 'Bootstrap',
  jackknife: 'Jackknife',
};

export const STATE_WORDS = { draft: 'Draft', 'awaiting-signoff': 'Awaiting sign-off', signed: 'Signed' } as const;

export const INTERVAL_METHOD_WORDS: Record<string, { name: string; why: string }> = {
  nonparametric: {
    name: 'Nonparametric (rank p(n + 1))',
    why: 'Makes no assumption about the shape of the distribution; needs about 120 reference values per partition for 90% CIs of the limits.',
  },
  robust: {
    name: 'Robust (biweight after Box–Cox; Horn, Pesce & Copeland 1998)',
    why: 'Suited to small samples (from 20 values), where ranks cannot give usable limits; resists outlying values.',
  },
  parametric: {
    name: 'Parametric (mean ± z·SD after Box–Cox transformation)',
    why: 'Assumes the values are Gaussian after the transformation; efficient when that holds.',
  },
};

export const PARTITION_WORDS: Record<string, string> = { sex: 'Sex', ageBand: 'Age band', group: 'Group' };
