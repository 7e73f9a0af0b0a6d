import type { ChartDataset } from 'chart.js';
import type { ComparisonCore } from '../comparison/engine-types';
import type { Markers } from './markers-plugin';
import { PALETTE } from './palette';
import type { PlotPoint } from './plot-points';
import { type XY, pairDatasets } from './scatter-data';

/** The difference plot's pairs: each difference against its pair mean, included and excluded apart. */
export function differenceDatasets(points: readonly PlotPoint[]): ChartDataset<'scatter', XY[]>[] {
  return pairDatasets(points, (p) => ({ x: p.mean, y: p.difference }));
}

/**
 * The difference plot's lines: zero, the mean bias and both limits of agreement, each estimate with its
 * CI as a shaded band (a band is left out when its CI could not be formed).
 */
export function differenceMarkers(core: Pick<ComparisonCore, 'bias' | 'limitsOfAgreement'>, label: (v: number) => string): Markers {
  const markers: Markers = { lines: [{ axis: 'y', value: 0, color: PALETTE.zero, dash: [2, 3] }], bands: [] };
  const add = (name: string, e: { estimate: number | null; ci: [number, number] | null }, color: string, band: string, dash?: number[]): void => {
    if (e.estimate === null) return;
    if (e.ci) markers.bands.push({ axis: 'y', from: e.ci[0], to: e.ci[1], color: band });
    markers.lines.push({ axis: 'y', value: e.estimate, color, dash, label: `${name} ${label(e.estimate)}` });
  };
  add('Mean bias', core.bias.mean, PALETTE.bias, PALETTE.biasBand);
  add('Upper limit', core.limitsOfAgreement.upper, PALETTE.limits, PALETTE.limitsBand, [6, 4]);
  add('Lower limit', core.limitsOfAgreement.lower, PALETTE.limits, PALETTE.limitsBand, [6, 4]);
  return markers;
}
