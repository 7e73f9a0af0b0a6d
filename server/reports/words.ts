import type { Verdict } from '../../shared/stats';

/** The report's fixed wording. The caution is printed in full near the findings and again at the end. */
export const CAUTION =
  "Decision support only. These findings do not by themselves make a verification compliant: final acceptance follows local accreditation rules and the laboratory director's professional judgement. They hold only for the specimen types, measuring range, population and lots studied.";

export const VERDICT_WORDS: Record<Verdict, string> = {
  within: 'Within the allowable bias',
  inconclusive: 'Inconclusive: the CI crosses the allowable bias',
  exceeds: 'Exceeds the allowable bias',
};

export const MEANING_WORDS = { accepted: 'Accepted for patient testing', 'not-accepted': 'Not accepted for patient testing' } as const;

export const KIND_TITLES = {
  'method-comparison': 'Method comparison',
  'interval-establish': 'Reference interval: establishment',
  'interval-verify': 'Reference interval: verification (transference)',
} as const;

/** The document's own title per kind of study. */
export const REPORT_TITLES = {
  'method-comparison': 'Method comparison: verification report',
  'interval-establish': 'Reference interval establishment: study report',
  'interval-verify': 'Reference interval verification: study report',
} as const;

export const REGRESSION_WORDS: Record<string, string> = {
  'passing-bablok': 'Passing–Bablok',
  deming: 'Deming',
  'weighted-deming': 'Weighted Deming',
  ols: 'Ordinary least squares',
};

export const DIFFERENCE_WORDS: Record<string, string> = {
  absolute: 'Absolute: candidate − comparative',
  'percent-mean': 'Percent of the pair mean: 100·(y − x)/((x + y)/2)',
  'percent-x': 'Percent of the comparative result: 100·(y − x)/x',
};

export const CI_WORDS: Record<string, string> = {
  percentile: 'Percentile bootstrap',
  bca: 'BCa bootstrap (bias-corrected and accelerated)',
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
