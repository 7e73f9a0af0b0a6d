import type { Chart, Plugin } from 'chart.js';

/**
 * A straight line across the plot at a value of one axis. A line with a label is named in the legend under
 * the plot (chart-options.ts, legendEntries; never in a margin beside it); `axisMark` also puts a small triangle on the axis at its value
 * (decision levels on the x axis).
 */
export interface MarkerLine {
  axis: 'x' | 'y';
  value: number;
  color: string;
  dash?: number[];
  width?: number;
  label?: string;
  axisMark?: boolean;
}

/** A shaded strip between two values of one axis (a CI band); ±Infinity reaches the edge of the plot. */
export interface MarkerBand {
  axis: 'x' | 'y';
  from: number;
  to: number;
  color: string;
  label?: string;
}

/** A shaded region between a lower and an upper curve over x (the allowable-bias band), its edges drawn. */
export interface MarkerArea {
  points: { x: number; lower: number; upper: number }[];
  color: string;
  edge: string;
  dash?: number[];
  label?: string;
}

export interface Markers {
  lines: MarkerLine[];
  bands: MarkerBand[];
  areas?: MarkerArea[];
}

declare module 'chart.js' {
  interface PluginOptionsByType<TType extends import('chart.js').ChartType> {
    parallaxMarkers?: Partial<Markers>;
  }
}

/** The lowest and highest value the lines and bands put on one axis, so the scale can show them all. */
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

function clip(chart: Chart): void {
  const { ctx, chartArea: area } = chart;
  ctx.beginPath();
  ctx.rect(area.left, area.top, area.width, area.height);
  ctx.clip();
}

/** The curves' y beyond the plot are drawn at its edge (a percentage of zero is infinite). */
function py(chart: Chart, value: number): number {
  const { chartArea: area } = chart;
  if (!Number.isFinite(value)) return value > 0 ? area.top - 2 : area.bottom + 2;
  return Math.min(area.bottom + 2, Math.max(area.top - 2, chart.scales['y'].getPixelForValue(value)));
}

function drawArea(chart: Chart, area: MarkerArea): void {
  const { ctx } = chart;
  const pts = area.points;
  if (pts.length < 2) return;
  ctx.beginPath();
  pts.forEach((p, k) => (k === 0 ? ctx.moveTo(pixel(chart, 'x', p.x), py(chart, p.upper)) : ctx.lineTo(pixel(chart, 'x', p.x), py(chart, p.upper))));
  for (let k = pts.length - 1; k >= 0; k--) ctx.lineTo(pixel(chart, 'x', pts[k].x), py(chart, pts[k].lower));
  ctx.closePath();
  ctx.fillStyle = area.color;
  ctx.fill();
  ctx.strokeStyle = area.edge;
  ctx.lineWidth = 1;
  ctx.setLineDash(area.dash ?? []);
  for (const side of ['upper', 'lower'] as const) {
    ctx.beginPath();
    pts.forEach((p, k) => (k === 0 ? ctx.moveTo(pixel(chart, 'x', p.x), py(chart, p[side])) : ctx.lineTo(pixel(chart, 'x', p.x), py(chart, p[side]))));
    ctx.stroke();
  }
}

/** Draws the bands under the data and the lines over it (chart.js has no such element without a plugin). */
export const markersPlugin: Plugin = {
  id: 'parallaxMarkers',
  beforeDatasetsDraw(chart, _args, options: Partial<Markers>) {
    const { ctx, chartArea: area } = chart;
    ctx.save();
    clip(chart);
    for (const a of options.areas ?? []) drawArea(chart, a);
    for (const band of options.bands ?? []) {
      const [p, q] = [pixel(chart, band.axis, band.from), pixel(chart, band.axis, band.to)];
      ctx.fillStyle = band.color;
      if (band.axis === 'y') ctx.fillRect(area.left, Math.min(p, q), area.width, Math.abs(q - p));
      else ctx.fillRect(Math.min(p, q), area.top, Math.abs(q - p), area.height);
    }
    ctx.restore();
  },
  afterDatasetsDraw(chart, _args, options: Partial<Markers>) {
    const { ctx, chartArea: area } = chart;
    for (const line of options.lines ?? []) {
      const p = pixel(chart, line.axis, line.value);
      if (!Number.isFinite(p)) continue;
      const inside = line.axis === 'y' ? p >= area.top - 0.5 && p <= area.bottom + 0.5 : p >= area.left - 0.5 && p <= area.right + 0.5;
      if (!inside) continue;
      ctx.save();
      ctx.strokeStyle = line.color;
      ctx.fillStyle = line.color;
      ctx.lineWidth = line.width ?? 1.5;
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
      if (line.axisMark && line.axis === 'x') {
        // A triangle standing on the x axis, pointing up at the line.
        ctx.setLineDash([]);
        ctx.beginPath();
        ctx.moveTo(p, area.bottom - 9);
        ctx.lineTo(p - 5, area.bottom);
        ctx.lineTo(p + 5, area.bottom);
        ctx.closePath();
        ctx.fill();
      }
      ctx.restore();
    }
  },
};

/**
 * Where each specimen's point is drawn (CSS pixels from the canvas's top left), written on the canvas after
 * every layout as `data-points` = [[key, x, y], ...], the ringed (selected) one as `data-selected` = [key, x, y],
 * and each bar's middle as `data-bars` = [[index, x, y], ...]: tests and tools find a specimen's point or a bar
 * there, as a person finds it by eye.
 */
export const pointKeysPlugin: Plugin = {
  id: 'parallaxPointKeys',
  afterUpdate(chart) {
    const points: [number, number, number][] = [];
    const bars: [number, number, number][] = [];
    let selected: [number, number, number] | null = null;
    const at = (v: number): number => Math.round(v * 10) / 10;
    chart.data.datasets.forEach((dataset, i) => {
      const meta = chart.getDatasetMeta(i);
      const highlight = (dataset as { highlight?: boolean }).highlight === true;
      (dataset.data as unknown[]).forEach((raw, j) => {
        const el = meta.data[j] as unknown as { x: number; y: number; base?: number } | undefined;
        if (!el) return;
        if (meta.type === 'bar') {
          bars.push([j, at(el.x), at(el.base === undefined ? el.y : (el.y + el.base) / 2)]);
          return;
        }
        const key = (raw as { key?: number } | null)?.key;
        if (key === undefined) return;
        if (highlight) selected = [key, at(el.x), at(el.y)];
        else points.push([key, at(el.x), at(el.y)]);
      });
    });
    const canvas = chart.canvas;
    if (!canvas) return;
    canvas.setAttribute('data-points', JSON.stringify(points));
    canvas.setAttribute('data-bars', JSON.stringify(bars));
    if (selected) canvas.setAttribute('data-selected', JSON.stringify(selected));
    else canvas.removeAttribute('data-selected');
  },
};
