import { dataStep } from '@shared/types/plot-axes';
import { clipped, dataWidth, drawAxes, makeFrame, type Frame } from '../../reports/plots/frame';
import { band, dataLine, legend, legendRows, levelLine, points, type LegendItem } from '../../reports/plots/marks';
import type { Box } from '../../reports/plots/plot-box';
import { paddedAxis } from '../../reports/plots/scale';
import { drawText, textWidth } from '../../reports/text';
import { COLOR, SIZE } from '../../reports/theme';

export interface DayPlotInput {
  title: string;
  /** The result axis's title, with the unit. */
  yLabel: string;
  /** Each day's included results in the order measured, and the day's mean. */
  days: { day: string; values: number[]; mean: number }[];
  /** The grand mean, drawn across the plot. */
  mean: number;
  /** The within-laboratory SD: a band of ±2 SDs is drawn around the grand mean. */
  withinLabSd: number | null;
  /** Replicates the outlier rule flagged, drawn as diamonds. */
  flagged: { day: string; value: number }[];
  /** The reporting step of the results; read from the values when not given. */
  resolution?: number | null;
}

const SMALL = { size: SIZE.small, color: COLOR.muted };

/**
 * A material's results day by day: the replicates of a day side by side in the order measured (no random
 * jitter), the day's mean as a short bar, the grand mean as a line across and a band of ±2 within-laboratory
 * SDs around it; flagged replicates are diamonds in the warm colour (a shape as well as a colour). Days are
 * named under the axis when their names fit, else numbered in order and the first one named in the axis title.
 */
export function dayPlot(doc: PDFKit.PDFDocument, box: Box, input: DayPlotInput): Frame {
  const k = input.days.length;
  const values = input.days.flatMap((d) => d.values);
  const sd = input.withinLabSd !== null && Number.isFinite(input.withinLabSd) ? input.withinLabSd : null;
  const span = sd !== null ? [input.mean - 2 * sd, input.mean + 2 * sd] : [];
  const resolution = input.resolution ?? (values.length ? dataStep(values) : null);
  const flaggedAny = input.flagged.length > 0;
  const items: LegendItem[] = [
    { label: 'result', color: COLOR.ink, kind: 'point' },
    { label: "day's mean", color: COLOR.ink, kind: 'line' },
    { label: 'grand mean', color: COLOR.accent, kind: 'line' },
    ...(sd !== null ? [{ label: '±2 within-laboratory SDs', color: COLOR.accent, kind: 'band' as const }] : []),
    ...(flaggedAny ? [{ label: 'flagged by the outlier rule', color: COLOR.warm, kind: 'diamond' as const }] : []),
  ];
  const rows = legendRows(doc, items, dataWidth(box)).length;
  const xAxis = { min: 0.5, max: Math.max(1, k) + 0.5, ticks: [] as number[], decimals: 0 };
  const yAxis = paddedAxis([...values, input.mean, ...span].filter(Number.isFinite), { resolution, share: 0.08 });
  const frame = makeFrame(doc, box, xAxis, yAxis, rows);
  const slot = frame.width / Math.max(1, k);
  const named = input.days.every((d) => textWidth(doc, d.day, SMALL) <= slot - 4);
  const xTitle = named || !k ? 'Day' : `Day, in order (1 = ${input.days[0].day})`;
  drawAxes(frame, { title: input.title, x: xTitle, y: input.yLabel });
  input.days.forEach((d, i) => {
    const x = frame.px(i + 1);
    doc.moveTo(x, frame.y + frame.height).lineTo(x, frame.y + frame.height + 3).lineWidth(0.6).strokeColor(COLOR.muted).stroke();
    drawText(doc, named ? d.day : String(i + 1), x - slot / 2, frame.y + frame.height + 4, SMALL, { width: slot, align: 'center', oneLine: true });
  });
  const flagged = new Map<string, number[]>();
  for (const f of input.flagged) flagged.set(f.day, [...(flagged.get(f.day) ?? []), f.value]);
  clipped(frame, () => {
    if (sd !== null) band(frame, [span[0], span[1]], COLOR.accent, 'horizontal', 0.1);
    levelLine(frame, input.mean, { color: COLOR.accent, width: 1 });
    input.days.forEach((d, i) => {
      const at = i + 1;
      const step = Math.min(0.1, 0.6 / Math.max(1, d.values.length));
      const placed = d.values.map((v, j): [number, number] => [at + (j - (d.values.length - 1) / 2) * step, v]);
      const spread = Math.max(0.18, (d.values.length * step) / 2 + 0.06);
      dataLine(frame, [at - spread, d.mean], [at + spread, d.mean], { color: COLOR.ink, width: 1.4 });
      const marked = [...(flagged.get(d.day) ?? [])];
      const plain: [number, number][] = [];
      const diamonds: [number, number][] = [];
      for (const p of placed) {
        const hit = marked.indexOf(p[1]);
        if (hit >= 0) {
          marked.splice(hit, 1);
          diamonds.push(p);
        } else plain.push(p);
      }
      points(frame, plain, { color: COLOR.ink, radius: 1.9 });
      points(frame, diamonds, { color: COLOR.warm, radius: 2.2, shape: 'diamond' });
    });
  });
  legend(frame, items);
  return frame;
}
