import type { ChartData, ChartOptions, PointStyle, TooltipItem } from 'chart.js';
import type { MarkerLine } from './markers-plugin';

/** The shapes a curve's points may take; each is drawn in the legend as on the plot. */
export type CurveMarker = Extract<PointStyle, 'circle' | 'triangle' | 'rect' | 'rectRot' | 'crossRot' | 'star'>;
export const CURVE_MARKERS: readonly CurveMarker[] = ['circle', 'triangle', 'rect', 'rectRot', 'crossRot', 'star'];

/** One curve: its points joined by a line of its dash, each point drawn as its marker. */
export interface CurveSeries {
  label: string;
  points: { x: number; y: number }[];
  color: string;
  /** Empty for a solid line. */
  dash: number[];
  marker: CurveMarker;
}

/** A plot of curves over one number (n, a fraction outside): the curves, straight lines at set values, the axes in words. */
export interface Curves {
  series: CurveSeries[];
  /** Lines at a value (a target, a limit), each named with its value in the legend. */
  lines: MarkerLine[];
  xTitle: string;
  yTitle: string;
  /** How a value of each axis is written in the tooltip (and, for y, on its ticks); x ticks by `xTick`, else as numbers. */
  xText: (x: number) => string;
  yText: (y: number) => string;
  xTick?: (x: number) => string;
  yTick?: (y: number) => string;
  /** Fixed ends of the x axis; chart.js chooses them when absent. */
  xMin?: number;
  xMax?: number;
  /** Fixed ends of the y axis (0 to 1 for a probability); chart.js chooses them when absent. */
  yMin?: number;
  yMax?: number;
  /** The plot in words: the canvas's accessible name. */
  summary: string;
}

export function curveData(c: Curves): ChartData<'scatter'> {
  return {
    datasets: c.series.map((s) => ({
      label: s.label,
      data: s.points,
      showLine: true,
      borderColor: s.color,
      backgroundColor: s.color,
      borderDash: s.dash,
      borderWidth: 2,
      pointStyle: s.marker,
      pointRadius: 4,
      pointHoverRadius: 6,
      pointBorderWidth: 1.5,
    })),
  };
}

export function curveOptions(c: Curves): ChartOptions<'scatter'> {
  return {
    responsive: true,
    maintainAspectRatio: false,
    animation: false,
    interaction: { mode: 'nearest', intersect: true },
    scales: {
      x: { type: 'linear', min: c.xMin, max: c.xMax, title: { display: true, text: c.xTitle }, ...(c.xTick ? { ticks: { callback: (v) => c.xTick!(Number(v)) } } : {}) },
      y: {
        type: 'linear', min: c.yMin, max: c.yMax,
        title: { display: true, text: c.yTitle }, ticks: { callback: (v) => (c.yTick ?? c.yText)(Number(v)) },
      },
    },
    plugins: {
      legend: { display: false },
      tooltip: {
        callbacks: {
          title: (items: TooltipItem<'scatter'>[]) => (items[0] ? c.xText(items[0].parsed.x ?? 0) : ''),
          label: (item: TooltipItem<'scatter'>) => `${item.dataset.label}: ${c.yText(item.parsed.y ?? 0)}`,
        },
      },
      parallaxMarkers: { lines: c.lines, bands: [] },
    },
  };
}
