/** The report's page geometry, type sizes and colours (a calm palette of our own). */
export const PAGE = { size: 'A4', left: 56, right: 56, top: 54, bottom: 78 } as const;

export const SIZE = { title: 17, heading: 12.5, subheading: 10, body: 9, table: 8, small: 7.5, footer: 7 } as const;

export const COLOR = {
  ink: '#1d2731',
  muted: '#5b6770',
  accent: '#1e5f74',
  accentSoft: '#d8e7ec',
  warm: '#a4541c',
  warmSoft: '#f4e1d2',
  rule: '#c4ced4',
  tint: '#f1f5f7',
  good: '#2f6b3a',
  bad: '#9b2c2c',
  draft: '#b03a2e',
} as const;
