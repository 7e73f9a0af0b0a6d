import { allowableBand, bandReach, type AllowableGoal } from '@shared/types/allowable-band';
import { paddedAxis, type PlotAxis } from '@shared/types/plot-axes';
import type { ComparisonCore } from '../comparison/engine-types';
import type { MarkerArea, MarkerLine, Markers } from './markers-plugin';
import { markerRange } from './markers-plugin';
import { PALETTE } from './palette';
import type { PlotPoint } from './plot-points';
import { type PairTip, type PointDataset, pairDatasets } from './scatter-data';

export type DifferenceType = 'absolute' | 'percent-mean' | 'percent-x';

/** The x of a pair on the difference plot: the pair mean, or the comparative result for a percentage of x. */
export function differenceX(p: PlotPoint, type: DifferenceType): number {
  return type === 'percent-x' ? p.x : p.mean;
}

/** The difference plot's pairs: each difference against its x, included and excluded apart, the selected one ringed. */
export function differenceDatasets(points: readonly PlotPoint[], options: { type?: DifferenceType; tip?: PairTip; selected?: number | null } = {}): PointDataset[] {
  const type = options.type ?? 'absolute';
  return pairDatasets(points, (p) => ({ x: differenceX(p, type), y: p.difference }), options.tip, options.selected);
}

/**
 * The difference plot's lines: zero, the mean bias and both limits of agreement, each estimate with its
 * CI as a shaded band (a band is left out when its CI could not be formed). Every line is named with its
 * value in the legend.
 */
export function differenceMarkers(core: Pick<ComparisonCore, 'bias' | 'limitsOfAgreement'>, label: (v: number) => string, level = ''): Markers {
  const markers: Markers = { lines: [{ axis: 'y', value: 0, color: PALETTE.zero, dash: [2, 3], width: 1 }], bands: [], areas: [] };
  const ci = level ? `${level} CI` : 'CI';
  const add = (name: string, e: { estimate: number | null; ci: [number, number] | null }, color: string, band: string, bandLabel: string | undefined, dash?: number[]): void => {
    if (e.estimate === null) return;
    if (e.ci) markers.bands.push({ axis: 'y', from: e.ci[0], to: e.ci[1], color: band, ...(bandLabel ? { label: bandLabel } : {}) });
    markers.lines.push({ axis: 'y', value: e.estimate, color, dash, width: 2, label: `${name} ${label(e.estimate)}` });
  };
  add('Mean bias', core.bias.mean, PALETTE.bias, PALETTE.biasBand, `${ci} of the mean bias`);
  add('Upper limit of agreement', core.limitsOfAgreement.upper, PALETTE.limits, PALETTE.limitsBand, `${ci} of each limit`, [6, 4]);
  const upperBand = markers.bands.some((b) => b.color === PALETTE.limitsBand);
  add('Lower limit of agreement', core.limitsOfAgreement.lower, PALETTE.limits, PALETTE.limitsBand, upperBand ? undefined : `${ci} of each limit`, [6, 4]);
  return markers;
}

/** The decision levels as dotted lines standing on triangles on the x axis, named once in the legend. */
export function decisionLevelMarks(levels: readonly number[], label: (v: number) => string): MarkerLine[] {
  const words = levels.length === 1 ? 'Decision level' : 'Decision levels';
  return levels.filter(Number.isFinite).map((value, k) => ({
    axis: 'x', value, color: PALETTE.level, dash: [2, 3], width: 1, axisMark: true,
    ...(k === 0 ? { label: `${words} ${levels.map(label).join(', ')}` } : {}),
  }));
}

/** The allowable-bias band across the x axis, ± the goal as stated (absolute, percent, or the greater of both). */
export function allowableArea(axis: PlotAxis, goal: AllowableGoal, type: DifferenceType, format: (v: number) => string): MarkerArea | null {
  const band = allowableBand(axis.min, axis.max, goal, type, format);
  if (!band) return null;
  return {
    points: band.points.map((p) => ({ x: p.x, lower: -p.half, upper: p.half })),
    color: PALETTE.allowable, edge: PALETTE.allowableEdge, dash: [1, 2.5], label: `Allowable bias ${band.words}`,
  };
}

/**
 * Both axes of the difference plot, padded so no point sits on an edge. x reaches every pair and every
 * decision level; y every difference, zero and every line and CI. The allowable band counts too, unless it
 * is far wider than all of these (then it fills the plot, and its edges lie beyond it).
 */
export function differenceAxes(
  points: readonly PlotPoint[], markers: Markers, type: DifferenceType, levels: readonly number[],
  goal: AllowableGoal, resolution: { x?: number | null; y?: number | null } = {},
): { x: PlotAxis; y: PlotAxis } {
  const xs = [...points.map((p) => differenceX(p, type)), ...levels];
  const x = paddedAxis(xs, { resolution: resolution.x });
  const ys = [0, ...points.map((p) => p.difference), ...(markerRange(markers, 'y') ?? [])];
  const reach = Math.max(...ys.map(Math.abs).filter(Number.isFinite));
  const half = bandReach(allowableBand(Math.min(...xs), Math.max(...xs), goal, type, String), reach);
  if (half !== null) ys.push(-half, half);
  return { x, y: paddedAxis(ys, { resolution: resolution.y }) };
}
