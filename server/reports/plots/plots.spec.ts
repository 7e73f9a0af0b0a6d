import PDFDocument from 'pdfkit';
import { REGULAR } from '../fonts';
import { renderStudyReport } from '../render-report';
import { comparisonReport, verifyReport } from '../testing/fixtures';
import { flat, pdfPages } from '../testing/pdf-text';
import { COLOR } from '../theme';
import { differenceLegend, differencePlot, type DifferenceInput } from './difference-plot';
import type { Frame } from './frame';
import { histogramPlot } from './histogram-plot';
import { legendRows } from './marks';
import { levelStyle, powerCurveLegend, powerCurvePlot, type PowerCurveInput } from './power-curve';
import { textWidth } from '../text';
import { pdfLayout } from '../testing/pdf-layout';
import { scatterLegend, scatterPlot } from './scatter-plot';
import { stripPlot } from './strip-plot';

const BOX = { x: 56, y: 100, width: 240, height: 270 };
const NONE = { estimate: null, ci: null };
const mmol = (v: number): string => `${v.toFixed(2)} mmol/L`;

/** A page to draw on, and every circle drawn on it (the plots' dots), by their centres. */
function page(): { doc: PDFKit.PDFDocument; circles: [number, number][]; polygons: number[][][] } {
  const doc = new PDFDocument({ size: 'A4', font: REGULAR });
  const circles: [number, number][] = [];
  const polygons: number[][][] = [];
  const circle = doc.circle.bind(doc);
  const polygon = doc.polygon.bind(doc);
  doc.circle = ((x: number, y: number, r: number) => {
    circles.push([x, y]);
    return circle(x, y, r);
  }) as typeof doc.circle;
  doc.polygon = ((...points: number[][]) => {
    polygons.push(points);
    return polygon(...points);
  }) as typeof doc.polygon;
  return { doc, circles, polygons };
}

/** Every centre (but the legend's keys, under the axis title) lies inside the data area, at least `margin` points from its frame. */
function inside(frame: Frame, centres: [number, number][], margin = 2): boolean {
  const dots = centres.filter(([, y]) => y < frame.y + frame.height + 20);
  return dots.length > 0 && dots.every(([x, y]) => x >= frame.x + margin && x <= frame.x + frame.width - margin && y >= frame.y + margin && y <= frame.y + frame.height - margin);
}

// Extremes on round numbers (0 and 30, −1 and 1): an axis that is not padded ends exactly on them, and their dots are half cut away.
const extremes: DifferenceInput = {
  included: [[0, -1], [10, 0.2], [20, 0.5], [30, 1]], excluded: [[15, 0.4]],
  bias: { estimate: 0.2, ci: [0.1, 0.3] }, lower: { estimate: -0.6, ci: [-0.8, -0.4] }, upper: { estimate: 1, ci: [0.8, 1.2] },
  xLabel: 'Mean of the pair (mmol/L)', yLabel: 'Difference y − x (mmol/L)',
  type: 'absolute', goal: { absolute: 0.3, percent: null }, levels: [3, 10, 20],
  format: { difference: mmol, value: (v) => `${v.toFixed(1)} mmol/L`, goal: mmol },
};

describe('the PDF plots', () => {
  it('pad every axis so no point sits on the frame', () => {
    const d = page();
    expect(inside(differencePlot(d.doc, BOX, extremes), d.circles)).toBe(true);
    const s = page();
    expect(inside(scatterPlot(s.doc, BOX, { included: [[0, 0], [30, 30], [12, 12.5]], excluded: [], line: null, xLabel: 'x', yLabel: 'y' }), s.circles)).toBe(true);
    const v = page();
    const strip = stripPlot(v.doc, BOX, { title: '5 values', xLabel: 'Sodium', values: [130, 135, 140, 140, 150], lower: 135, upper: 145 });
    expect(inside(strip, v.circles.map(([x]) => [x, strip.y + strip.height / 2]))).toBe(true);
    expect(strip.xAxis.ticks.every(Number.isInteger)).toBe(true);
  });

  it('shade the regression line’s CI band on the scatter and name it in the legend, only when there is a line', () => {
    const base = { included: [[1, 1.2], [10, 10.1], [20, 20.6]] as [number, number][], excluded: [], xLabel: 'x', yLabel: 'y' };
    const line = { slope: 1.02, intercept: 0.1, label: 'Passing–Bablok' };
    const band = { points: [{ x: 1, lower: 0.8, upper: 1.5 }, { x: 20, lower: 20.1, upper: 21 }], label: '95% CI of the line' };
    const fills = (input: Parameters<typeof scatterPlot>[2]): number => {
      const { doc } = page();
      let count = 0;
      const fill = doc.fill.bind(doc);
      doc.fill = ((...args: unknown[]) => { count++; return (fill as (...a: unknown[]) => PDFKit.PDFDocument)(...args); }) as typeof doc.fill;
      scatterPlot(doc, BOX, input);
      return count;
    };
    // Two fills more: the band, and its key in the legend.
    expect(fills({ ...base, line, band })).toBe(fills({ ...base, line, band: null }) + 2);
    expect(fills({ ...base, line: null, band })).toBe(fills({ ...base, line: null, band: null }));
    expect(scatterLegend({ ...base, line, band }).map((i) => i.label)).toEqual(['pairs', 'y = x', 'Passing–Bablok', '95% CI of the line']);
    expect(scatterLegend({ ...base, line: null, band }).map((i) => i.label)).toEqual(['pairs', 'y = x']);
  });

  it('mark each decision level with a triangle standing on the x axis of the difference plot', () => {
    const d = page();
    const frame = differencePlot(d.doc, BOX, extremes);
    const bottom = frame.y + frame.height;
    const triangles = d.polygons.filter((p) => p.length === 3 && p.some(([, y]) => Math.abs(y - bottom) < 1e-6));
    expect(triangles.map((t) => t[0][0])).toEqual([3, 10, 20].map(frame.px));
  });

  it('name every line with its value, the allowable bias as stated and the decision levels in the legend', () => {
    expect(differenceLegend(extremes).map((i) => [i.label, i.kind])).toEqual([
      ['pairs', 'point'], ['excluded', 'cross'], ['mean bias 0.20 mmol/L', 'line'],
      ['limits of agreement -0.60 mmol/L and 1.00 mmol/L', 'dash'], ['CIs', 'band'],
      ['allowable bias ±0.30 mmol/L', 'area'], ['decision levels 3.0 mmol/L, 10.0 mmol/L, 20.0 mmol/L', 'triangle'],
    ]);
    const percent = differenceLegend({ ...extremes, goal: { absolute: 0.2, percent: 4 }, levels: [7] });
    expect(percent.map((i) => i.label)).toContain('allowable bias ±0.20 mmol/L or ±4 %, whichever is greater');
    expect(percent.map((i) => i.label)).toContain('decision level 7.0 mmol/L');
    expect(differenceLegend({ ...extremes, goal: undefined, levels: [], lower: NONE, upper: NONE }).map((i) => i.label)).toEqual(['pairs', 'excluded', 'mean bias 0.20 mmol/L', 'CIs']);
  });

  it('draw excluded pairs and values outside a stated interval as shapes of their own, in no alarm colour', () => {
    const d = page();
    const frame = differencePlot(d.doc, BOX, extremes);
    // Four dots (the included pairs) and a cross for the excluded one: no fifth circle.
    expect(d.circles.filter(([x, y]) => x > frame.x && x < frame.x + frame.width && y > frame.y && y < frame.y + frame.height)).toHaveLength(4);
    const v = page();
    stripPlot(v.doc, BOX, { title: '3 values', xLabel: 'Sodium', values: [130, 140, 150], lower: 135, upper: 145 });
    expect(v.polygons.filter((p) => p.length === 4)).toHaveLength(2 + 1); // two diamonds outside, and the legend's
    expect(JSON.stringify(extremes)).not.toContain(COLOR.bad);
  });

  it('put light bars in the tails of a histogram on a padded axis', () => {
    const h = page();
    const frame = histogramPlot(h.doc, { ...BOX, width: 480 }, {
      title: 'Values', xLabel: 'Sodium (mmol/L)', resolution: 1,
      bins: [{ from: 129.5, to: 130.5, count: 2, tail: 'lower' }, { from: 130.5, to: 131.5, count: 5, tail: null }, { from: 131.5, to: 132.5, count: 1, tail: 'upper' }],
      markers: [], bands: [], legend: [],
    });
    expect(frame.xAxis.min).toBeLessThan(129.5);
    expect(frame.xAxis.max).toBeGreaterThan(132.5);
    expect(frame.xAxis.ticks.every(Number.isInteger)).toBe(true);
  });

  it('print the difference plot’s legend with the tables’ decimals in the comparison report', async () => {
    const text = flat(pdfPages(await renderStudyReport(comparisonReport(40))));
    expect(text).toContain('allowable bias ±0.30 mmol/L');
    expect(text).toContain('decision levels 3.0 mmol/L, 10.0 mmol/L, 20.0 mmol/L');
    expect(text).toMatch(/mean bias \d\.\d\d mmol\/L/);
    expect(text).toMatch(/limits of agreement −\d\.\d\d mmol\/L and \d\.\d\d mmol\/L/);
    expect(text).toMatch(/observed \d\.\d\d mmol\/L/);
    const verify = flat(pdfPages(await renderStudyReport(verifyReport(20))));
    expect(verify).toContain('outside');
  });
});

describe('the power curve of a plan by simulation', () => {
  const curve: PowerCurveInput = {
    title: 'Plan', targetPower: 0.8, maxFalsePass: 0.05,
    levels: [{ label: 'at 3.0 mmol/L', points: [
      { n: 40, powerAtZero: 0.9, powerAtHalf: 0.5, falsePass: 0.02 },
      { n: 20, powerAtZero: 0.6, powerAtHalf: 0.2, falsePass: 0 },
      { n: 80, powerAtZero: 1, powerAtHalf: 0.85, falsePass: 0.04 },
    ] }],
  };

  it('puts a marker at each n and share of every line, inside the frame, the shares of 0 and 100% off its edges', () => {
    const d = page();
    const frame = powerCurvePlot(d.doc, { ...BOX, width: 480 }, curve);
    const expected = curve.levels[0].points.flatMap((p) => [p.powerAtHalf, p.falsePass, p.powerAtZero].map((v) => [frame.px(p.n), frame.py(100 * v)]));
    const drawn = d.circles.filter(([, y]) => y < frame.y + frame.height + 20);
    expect(drawn.map(([x, y]) => `${x.toFixed(2)},${y.toFixed(2)}`).sort()).toEqual(expected.map(([x, y]) => `${x.toFixed(2)},${y.toFixed(2)}`).sort());
    expect(inside(frame, d.circles)).toBe(true);
    expect(frame.yAxis.ticks).toEqual([0, 20, 40, 60, 80, 100]);
  });

  it('draws the target power and the false-pass limit as dash-dot lines across the frame', () => {
    const d = page();
    const lines: { pattern: unknown; y: number; from: number; to: number }[] = [];
    let pattern: unknown = null;
    const dash = d.doc.dash.bind(d.doc);
    const moveTo = d.doc.moveTo.bind(d.doc);
    const lineTo = d.doc.lineTo.bind(d.doc);
    d.doc.dash = ((length: unknown, options: unknown) => { pattern = length; return dash(length as number, options); }) as typeof d.doc.dash;
    d.doc.moveTo = ((x: number, y: number) => { if (Array.isArray(pattern)) lines.push({ pattern, y, from: x, to: x }); return moveTo(x, y); }) as typeof d.doc.moveTo;
    d.doc.lineTo = ((x: number, y: number) => { if (Array.isArray(pattern)) lines[lines.length - 1].to = x; pattern = null; return lineTo(x, y); }) as typeof d.doc.lineTo;
    const frame = powerCurvePlot(d.doc, { ...BOX, width: 480 }, curve);
    const across = lines.filter((l) => Math.abs(l.from - frame.x) < 1e-6 && Math.abs(l.to - frame.x - frame.width) < 1e-6);
    expect(across.map((l) => l.y)).toEqual([frame.py(80), frame.py(5)]);
    expect(across.every((l) => (l.pattern as number[]).length === 4)).toBe(true);
  });

  it('tells the levels apart by marker and colour together, and the truths by line style, in the legend', () => {
    const looks = Array.from({ length: 10 }, (_, k) => `${levelStyle(k).color} ${levelStyle(k).shape}`);
    expect(new Set(looks).size).toBe(10);
    expect(new Set(Array.from({ length: 5 }, (_, k) => levelStyle(k).shape)).size).toBe(5);
    expect(powerCurveLegend(curve).map((i) => [i.label, i.kind])).toEqual([
      ['at 3.0 mmol/L', 'point'],
      ['true bias half the allowable (power)', 'line'], ['true bias equal to the allowable (false pass)', 'dash'], ['true bias 0', 'dots'],
      ['targets: power 80%, false pass 5%', 'reference'],
    ]);
  });
});

describe('the legend under a plot', () => {
  it('breaks a label wider than the plot over rows of its own, the key on the first, so no row runs past the plot', () => {
    const { doc } = page();
    const width = 182;
    const long = { label: 'decision levels 3.0 mmol/L, 10.0 mmol/L, 20.0 mmol/L', color: COLOR.ink, kind: 'triangle' as const };
    const style = { size: 7.5 };
    expect(16 + textWidth(doc, long.label, style)).toBeGreaterThan(width);
    const rows = legendRows(doc, [{ label: 'pairs', color: COLOR.ink, kind: 'point' }, long, { label: 'CIs', color: COLOR.ink, kind: 'band' }], width);
    for (const row of rows) for (const [item, x] of row) expect(x + 16 + textWidth(doc, item.label, style)).toBeLessThanOrEqual(width);
    expect(rows.map((row) => row.map(([item]) => [item.label, !!item.continued]))).toEqual([
      [['pairs', false]], [['decision levels 3.0 mmol/L, 10.0 mmol/L,', false]], [['20.0 mmol/L', true]], [['CIs', false]],
    ]);
  });
});

describe('the scatter and difference plots of a comparison', () => {
  it('keep the height of their data when a long legend breaks over more rows, and no legend runs past the right margin', async () => {
    // "allowable bias ±0.30 mmol/L or ±5 %, whichever is greater" breaks over two rows: the plots grow by the rows added.
    const heights: number[] = [];
    for (const report of [comparisonReport(40), comparisonReport(40, { allowableBiasPercent: 5 })]) {
      const pages = pdfLayout(await renderStudyReport(report));
      const lines = pages.flatMap((p) => p.lines);
      const title = lines.find((l) => l.text.startsWith('Scatter plot Difference plot'))!;
      const axis = lines.find((l) => l.text.startsWith('Comparative x (mmol/L) Mean of the pair (mmol/L)'))!;
      heights.push(axis.top - title.top);
      const page = pages.find((p) => p.lines.includes(title))!;
      for (const l of page.lines) expect({ text: l.text, past: l.right > page.width - 56 + 1 }).toEqual({ text: l.text, past: false });
    }
    expect(heights[0]).toBeGreaterThan(190);
    expect(heights[1]).toBeCloseTo(heights[0], 1);
  });
});
