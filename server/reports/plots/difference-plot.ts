import type { Estimate } from '../../../shared/stats';
import { COLOR } from '../theme';
import { clipped, drawAxes, makeFrame } from './frame';
import { band, legend, levelLine, points } from './marks';
import type { Box } from './plot-box';
import { extent, niceAxis } from './scale';

export interface DifferenceInput {
  included: [number, number][];
  excluded: [number, number][];
  bias: Estimate;
  lower: Estimate;
  upper: Estimate;
  xLabel: string;
  yLabel: string;
}

/** Differences against the pair mean: zero, the mean bias and the limits of agreement, each with its CI band. */
export function differencePlot(doc: PDFKit.PDFDocument, box: Box, input: DifferenceInput): void {
  const all = [...input.included, ...input.excluded];
  const lines = [input.bias, input.lower, input.upper];
  const yValues = [0, ...all.map(([, y]) => y), ...lines.flatMap((e) => [e.estimate ?? NaN, ...(e.ci ?? [])])];
  const frame = makeFrame(doc, box, niceAxis(...extent(all.map(([x]) => x))), niceAxis(...extent(yValues, 0.06)));
  drawAxes(frame, { title: 'Difference plot', x: input.xLabel, y: input.yLabel });
  clipped(frame, () => {
    levelLine(frame, 0, { color: COLOR.muted, width: 0.6 });
    if (input.bias.ci) band(frame, input.bias.ci, COLOR.accent, 'horizontal');
    for (const limit of [input.lower, input.upper]) if (limit.ci) band(frame, limit.ci, COLOR.warm, 'horizontal', 0.18);
    if (input.bias.estimate !== null) levelLine(frame, input.bias.estimate, { color: COLOR.accent, width: 1.2 });
    for (const limit of [input.lower, input.upper]) {
      if (limit.estimate !== null) levelLine(frame, limit.estimate, { color: COLOR.warm, width: 1.1, dash: 4 });
    }
    points(frame, input.included, { color: COLOR.ink, radius: 1.6 });
    points(frame, input.excluded, { color: COLOR.bad, hollow: true, radius: 2.2 });
  });
  legend(frame, [
    { label: 'mean bias', color: COLOR.accent, kind: 'line' },
    { label: 'limits of agreement', color: COLOR.warm, kind: 'dash' },
    { label: 'CI', color: COLOR.accent, kind: 'band' },
  ]);
}
