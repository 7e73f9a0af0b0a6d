/**
 * The plots' colours: Parallax's teal ink and an ochre, with greys. No red, amber or green: nothing reads as
 * a traffic light. Every pair that must be told apart also differs in lightness, line style or marker shape
 * (solid against dashed, circle against cross, dark against light), so a plot reads in grey print and to a
 * reader who does not see one of the hues.
 */
export const PALETTE = {
  point: 'rgba(42, 102, 113, 0.7)',
  pointBorder: '#123f46',
  excluded: '#6b4f22',
  identity: '#727879',
  regression: '#8a6128',
  regressionBand: 'rgba(176, 137, 74, 0.16)',
  bias: '#0b4852',
  biasBand: 'rgba(42, 102, 113, 0.18)',
  limits: '#8a6128',
  limitsBand: 'rgba(176, 137, 74, 0.2)',
  allowable: 'rgba(95, 101, 102, 0.1)',
  allowableEdge: '#4a5153',
  level: '#4a5153',
  zero: '#8c9293',
  bar: 'rgba(95, 101, 102, 0.4)',
  barInCi: 'rgba(42, 102, 113, 0.72)',
  /** Bars beyond a cut-off or a limit: light ochre against the darker teal of the others. */
  tail: 'rgba(190, 150, 84, 0.55)',
  tailBand: 'rgba(190, 150, 84, 0.12)',
  observed: '#1d2731',
  /** The ring round the selected specimen's point. */
  selected: '#1d2731',
} as const;
