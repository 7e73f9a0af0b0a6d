import type { Chart, Plugin } from 'chart.js';

/** A straight line across the plot at a value of one axis, with an optional label at its end. */
export interface MarkerLine {
  axis: 'x' | 'y';
  value: number;
  color: string;
  dash?: number[];
  label?: string;
}

/** A shaded strip between two values of one axis (a CI band); ±Infinity reaches the edge of the plot. */
export interface MarkerBand {
  axis: 'x' | 'y';
  from: number;
  to: number;
  color: string;
}

export interface Markers {
  lines: MarkerLine[];
  bands: MarkerBand[];
}

declare module 'chart.js' {
  interface PluginOptionsByType<TType extends import('chart.js').ChartType> {
    parallaxMarkers?: Partial<Markers>;
  }
}

/** A line's label, outside the plot area (see labelPadding) so it never hides a point or a bar. */
function label(ctx: CanvasRenderingContext2D, text: string, x: number, y: number, align: 'left' | 'center', color: string): void {
  ctx.setLineDash([]);
  ctx.fillStyle = color;
  const half = ctx.measureText(text).width / 2;
  const width = ctx.canvas.width / (window.devicePixelRatio || 1);
  const at = align === 'center' ? Math.min(Math.max(x, half + 2), width - half - 2) : x;
  ctx.textAlign = align;
  ctx.fillText(text, at, y);
}

/** The lowest and highest value the markers put on one axis, so the scale can show them all. */
export function markerRange(markers: Partial<Markers>, axis: 'x' | 'y'): [number, number] | null {
  const values = [
    ...(markers.lines ?? []).filter((l) => l.axis === axis).map((l) => l.value),
    ...(markers.bands ?? []).filter((b) => b.axis === axis).flatMap((b) => [b.from, b.to]),
  ].filter(Number.isFinite);
  return values.length === 0 ? null : [Math.min(...values), Math.max(...values)];
}

function pixel(chart: Chart, axis: 'x' | 'y', value: number): number {
  const { chartArea: area } = chart;
  if (value === -Infinity) return axis === 'x' ? area.left : area.bottom;
  if (value === Infinity) return axis === 'x' ? area.right : area.top;
  return chart.scales[axis].getPixelForValue(value);
}

function span(chart: Chart, axis: 'x' | 'y', a: number, b: number): [number, number] {
  return [pixel(chart, axis, a), pixel(chart, axis, b)];
}

/** Room outside the plot for the labels: on the right for lines across, on top for lines up. */
export function labelPadding(markers: Partial<Markers>): { right: number; top: number } {
  const labelled = (axis: 'x' | 'y'): boolean => (markers.lines ?? []).some((l) => l.axis === axis && !!l.label);
  return { right: labelled('y') ? 150 : 0, top: labelled('x') ? 18 : 0 };
}

/** Draws the bands under the data and the lines over it (chart.js has no such element without a plugin). */
export const markersPlugin: Plugin = {
  id: 'parallaxMarkers',
  beforeDatasetsDraw(chart, _args, options: Partial<Markers>) {
    const { ctx, chartArea: area } = chart;
    ctx.save();
    for (const band of options.bands ?? []) {
      const [p, q] = span(chart, band.axis, band.from, band.to);
      ctx.fillStyle = band.color;
      if (band.axis === 'y') ctx.fillRect(area.left, Math.min(p, q), area.width, Math.abs(q - p));
      else ctx.fillRect(Math.min(p, q), area.top, Math.abs(q - p), area.height);
    }
    ctx.restore();
  },
  afterDatasetsDraw(chart, _args, options: Partial<Markers>) {
    const { ctx, chartArea: area } = chart;
    ctx.save();
    ctx.font = "12px 'Open Sans', sans-serif";
    for (const line of options.lines ?? []) {
      const [p] = span(chart, line.axis, line.value, line.value);
      if (!Number.isFinite(p)) continue;
      ctx.strokeStyle = line.color;
      ctx.fillStyle = line.color;
      ctx.lineWidth = 1.5;
      ctx.setLineDash(line.dash ?? []);
      ctx.beginPath();
      if (line.axis === 'y') {
        ctx.moveTo(area.left, p);
        ctx.lineTo(area.right, p);
      } else {
        ctx.moveTo(p, area.top);
        ctx.lineTo(p, area.bottom);
      }
      ctx.stroke();
      if (line.label) label(ctx, line.label, line.axis === 'y' ? area.right + 6 : p, line.axis === 'y' ? p + 4 : area.top - 6, line.axis === 'y' ? 'left' : 'center', line.color);
    }
    ctx.restore();
  },
};
