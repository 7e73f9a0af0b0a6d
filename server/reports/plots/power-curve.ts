import { COLOR } from '../theme';
import { clipped, dataWidth, drawAxes, makeFrame, type Frame } from './frame';
import { legend, legendRows, points, referenceDash, type LegendItem, type PointShape } from './marks';
import type { Box } from './plot-box';
import { paddedAxis, type Axis } from './scale';

/** One decision level's figures at one n of the plan's grid (shares of simulated studies, 0 to 1). */
export interface PowerPoint { n: number; powerAtZero: number; powerAtHalf: number; falsePass: number }

export interface PowerCurveInput {
  title: string;
  /** One entry per decision level: its name in the legend ("at 3.0 mmol/L") and its figures over the grid. */
  levels: { label: string; points: PowerPoint[] }[];
  targetPower: number;
  maxFalsePass: number;
}

/** The three truths each level is simulated under, as line styles: solid, dashed, dotted (so no colour is needed to tell them apart). */
export const SCENARIOS = [
  { key: 'powerAtHalf', label: 'true bias half the allowable (power)', legend: 'line', dash: null, width: 1.3 },
  { key: 'falsePass', label: 'true bias equal to the allowable (false pass)', legend: 'dash', dash: [3, 2], width: 1.1 },
  { key: 'powerAtZero', label: 'true bias 0', legend: 'dots', dash: [1, 1.6], width: 1 },
] as const;

/** Each level's colour and marker: five colours and five shapes, paired so no two of the ten levels look alike. */
const COLORS = [COLOR.accent, COLOR.warm, COLOR.ink, COLOR.good, COLOR.muted];
const SHAPES: { shape: PointShape; legend: LegendItem['kind'] }[] = [
  { shape: 'dot', legend: 'point' }, { shape: 'ring', legend: 'ring' }, { shape: 'diamond', legend: 'diamond' },
  { shape: 'cross', legend: 'cross' }, { shape: 'triangle', legend: 'triangle' },
];
export const levelStyle = (k: number): { color: string; shape: PointShape; legend: LegendItem['kind'] } => {
  const s = SHAPES[(k + Math.floor(k / SHAPES.length)) % SHAPES.length];
  return { color: COLORS[k % COLORS.length], ...s };
};

/** The reference lines' grey: lighter than the data, darker than the grid. */
const REFERENCE = '#7d8a93';

const percent = (v: number): string => `${Math.round(v * 1000) / 10}%`;

/** The legend: a marker per level, then the three line styles, then the reference lines of the targets. */
export function powerCurveLegend(input: PowerCurveInput): LegendItem[] {
  return [
    ...input.levels.map((l, k) => ({ label: l.label, color: levelStyle(k).color, kind: levelStyle(k).legend })),
    ...SCENARIOS.map((s) => ({ label: s.label, color: COLOR.ink, kind: s.legend as LegendItem['kind'] })),
    { label: `targets: power ${percent(input.targetPower)}, false pass ${percent(input.maxFalsePass)}`, color: REFERENCE, kind: 'reference' },
  ];
}

/** The share axis: 0 to 100% with ticks every 20, padded a little so a point at 0 or 100% does not sit on the frame. */
const SHARE_AXIS: Axis = { min: -4, max: 104, ticks: [0, 20, 40, 60, 80, 100], decimals: 0 };

/**
 * The plan's figures against n: for each decision level the share of simulated studies that end "within" when
 * the true bias is half the allowable bias (the power, solid), equal to it (a false pass, dashed) and zero
 * (dotted); each level its own marker and colour, named in the legend under the plot; the target power and the
 * false-pass limit as grey long-dash-dot lines across.
 */
export function powerCurvePlot(doc: PDFKit.PDFDocument, box: Box, input: PowerCurveInput): Frame {
  const ns = input.levels.flatMap((l) => l.points.map((p) => p.n));
  const items = powerCurveLegend(input);
  const xAxis = paddedAxis(ns, { resolution: 1, count: box.width > 300 ? 8 : 5 });
  const frame = makeFrame(doc, box, xAxis, SHARE_AXIS, legendRows(doc, items, dataWidth(box)).length);
  drawAxes(frame, { title: input.title, x: 'Number of specimens (n)', y: 'Simulated studies within (%)' });
  clipped(frame, () => {
    for (const value of [input.targetPower, input.maxFalsePass]) {
      const y = frame.py(100 * value);
      referenceDash(doc.save().lineWidth(0.8).strokeColor(REFERENCE)).moveTo(frame.x, y).lineTo(frame.x + frame.width, y).stroke();
      doc.restore();
    }
    input.levels.forEach((level, k) => {
      const style = levelStyle(k);
      const sorted = [...level.points].sort((a, b) => a.n - b.n);
      for (const s of SCENARIOS) {
        const data = sorted.filter((p) => Number.isFinite(p[s.key])).map((p): [number, number] => [p.n, 100 * p[s.key]]);
        if (data.length > 1) {
          doc.save().lineWidth(s.width).strokeColor(style.color).lineJoin('round');
          if (s.dash) doc.dash(s.dash[0], { space: s.dash[1] });
          doc.moveTo(frame.px(data[0][0]), frame.py(data[0][1]));
          for (const [x, y] of data.slice(1)) doc.lineTo(frame.px(x), frame.py(y));
          doc.stroke().restore();
        }
        points(frame, data, { color: style.color, shape: style.shape, radius: 2.2 });
      }
    });
  });
  legend(frame, items);
  return frame;
}
