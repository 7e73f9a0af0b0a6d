import type { Analyte } from '@shared/schemas';

/** The allowable bias in words: "± 0.3 mmol/L", "± 5 %", or both joined with "or". */
export function allowableBiasText(analyte: Pick<Analyte, 'allowableBiasAbsolute' | 'allowableBiasPercent' | 'unit'>): string {
  const parts: string[] = [];
  if (analyte.allowableBiasAbsolute !== null) parts.push(`± ${analyte.allowableBiasAbsolute} ${analyte.unit}`);
  if (analyte.allowableBiasPercent !== null) parts.push(`± ${analyte.allowableBiasPercent} %`);
  return parts.length > 0 ? parts.join(' or ') : '—';
}
