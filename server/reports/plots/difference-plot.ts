import type { Estimate } from '@shared/stats';
import { allowableBand, bandReach, type AllowableGoal } from '@shared/types/allowable-band';
import { COLOR } from '../theme';
import { clipped, dataWidth, drawAxes, makeFrame, type Frame } from './frame';
import { area, axisTriangle, band, legend, legendRows, levelLine, markerLine, points, type LegendItem } from './marks';
import type { Box } from './plot-box';
import { paddedAxis } from './scale';

export interface DifferenceInput {
  included: [number, number][];
  excluded: [number, number][];
  bias: Estimate;
  lower: Estimate;
  upper: Estimate;
  xLabel: string;
  yLabel: string;
  /** The study's difference type: how the allowable bias turns into the plotted unit. */
  type?: 'absolute' | 'percent-mean' | 'percent-x';
  /** The allowable bias as stated (absolute, percent or both); none drawn without it. */
  goal?: AllowableGoal;
  /** The decision levels, marked on the x axis. */
  levels?: number[];
  /** How the legend writes a difference, a result and the goal; and the reporting steps of x and y (for the ticks). */
  format?: { difference: (v: number) => string; value: (v: number) => string; goal: (v: number) => string };
  resolution?: { x?: number | null; y?: number | null };
  /** At least this many rows of legend (to line up with the plot beside it). */
  legendRows?: number;
}

const ALLOWABLE = '#4a5560';

/**
 * Differences against the pair mean: zero, the mean bias and the limits of agreement (each with its CI band),
 * the allowable-bias band as the goal is stated (dotted edges), and the decision levels as triangles on the x
 * axis. The axes are padded so no point sits on the frame. Every line is named with its value in the legend
 * under the plot, never in a margin beside it.
 */
export function differencePlot(doc: PDFKit.PDFDocument, box: Box, input: DifferenceInput): Frame {
  const all = [...input.included, ...input.excluded];
  const type = input.type ?? 'absolute';
  const goal = input.goal ?? { absolute: null, percent: null };
  const levels = (input.levels ?? []).filter(Number.isFinite);
  const fmt = input.format ?? { difference: String, value: String, goal: String };
  const lines = [input.bias, input.lower, input.upper];
  const xs = [...all.map(([x]) => x), ...levels];
  const yValues = [0, ...all.map(([, y]) => y), ...lines.flatMap((e) => [e.estimate ?? NaN, ...(e.ci ?? [])])].filter(Number.isFinite);
  const reach = Math.max(...yValues.map(Math.abs));
  const dataBand = xs.length ? allowableBand(Math.min(...xs), Math.max(...xs), goal, type, fmt.goal) : null;
  const half = bandReach(dataBand, reach);
  if (half !== null) yValues.push(-half, half);

  const items = differenceLegend(input);
  const xAxis = paddedAxis(xs, { resolution: input.resolution?.x });
  const yAxis = paddedAxis(yValues, { resolution: input.resolution?.y });
  const frame = makeFrame(doc, box, xAxis, yAxis, Math.max(input.legendRows ?? 1, legendRows(doc, items, dataWidth(box)).length));
  drawAxes(frame, { title: 'Difference plot', x: input.xLabel, y: input.yLabel });
  const shown = allowableBand(xAxis.min, xAxis.max, goal, type, fmt.goal);
  clipped(frame, () => {
    if (shown) area(frame, shown.points.map((p) => ({ x: p.x, lower: -p.half, upper: p.half })), { fill: ALLOWABLE, edge: ALLOWABLE });
    levelLine(frame, 0, { color: COLOR.muted, width: 0.6 });
    if (input.bias.ci) band(frame, input.bias.ci, COLOR.accent, 'horizontal');
    for (const limit of [input.lower, input.upper]) if (limit.ci) band(frame, limit.ci, COLOR.warm, 'horizontal', 0.18);
    for (const level of levels) markerLine(frame, level, { color: COLOR.muted, width: 0.6, dash: 1, space: 2 });
    if (input.bias.estimate !== null) levelLine(frame, input.bias.estimate, { color: COLOR.accent, width: 1.2 });
    for (const limit of [input.lower, input.upper]) {
      if (limit.estimate !== null) levelLine(frame, limit.estimate, { color: COLOR.warm, width: 1.1, dash: 4 });
    }
    points(frame, input.included, { color: COLOR.ink, radius: 1.6 });
    points(frame, input.excluded, { color: COLOR.warm, shape: 'cross', radius: 2 });
  });
  for (const level of levels) axisTriangle(frame, level, COLOR.ink);
  legend(frame, items);
  return frame;
}

/** The difference plot's legend: the points, each line with its value, the CIs, the allowable bias and the decision levels. */
export function differenceLegend(input: DifferenceInput): LegendItem[] {
  const fmt = input.format ?? { difference: String, value: String, goal: String };
  const allowable = allowableBand(0, 1, input.goal ?? { absolute: null, percent: null }, input.type ?? 'absolute', fmt.goal)?.words ?? null;
  const levels = (input.levels ?? []).filter(Number.isFinite);
  const items: LegendItem[] = [{ label: 'pairs', color: COLOR.ink, kind: 'point' }];
  if (input.excluded.length) items.push({ label: 'excluded', color: COLOR.warm, kind: 'cross' });
  if (input.bias.estimate !== null) items.push({ label: `mean bias ${fmt.difference(input.bias.estimate)}`, color: COLOR.accent, kind: 'line' });
  const loa = [input.lower.estimate, input.upper.estimate].filter((v): v is number => v !== null);
  if (loa.length) items.push({ label: `limits of agreement ${loa.map(fmt.difference).join(' and ')}`, color: COLOR.warm, kind: 'dash' });
  if ([input.bias, input.lower, input.upper].some((e) => e.ci)) items.push({ label: 'CIs', color: COLOR.accent, kind: 'band' });
  if (allowable) items.push({ label: `allowable bias ${allowable}`, color: ALLOWABLE, kind: 'area' });
  if (levels.length) items.push({ label: `decision ${levels.length === 1 ? 'level' : 'levels'} ${levels.map(fmt.value).join(', ')}`, color: COLOR.ink, kind: 'triangle' });

  return items;
}
