/** The plots' colours, from the Parallax palette (teal ink, ochre, cool grey, and red only for tails). */
export const PALETTE = {
  point: 'rgba(42, 102, 113, 0.75)',
  pointBorder: '#1b5a64',
  excluded: '#927241',
  identity: '#727879',
  regression: '#77592b',
  bias: '#064e58',
  biasBand: 'rgba(42, 102, 113, 0.16)',
  limits: '#927241',
  limitsBand: 'rgba(146, 114, 65, 0.18)',
  zero: '#8c9293',
  bar: 'rgba(95, 101, 102, 0.45)',
  barInCi: 'rgba(42, 102, 113, 0.7)',
  tail: 'rgba(186, 26, 26, 0.6)',
  tailBand: 'rgba(186, 26, 26, 0.08)',
  observed: '#ba1a1a',
} as const;
