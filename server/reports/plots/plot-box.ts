import type { Layout } from '../layout';

export interface Box { x: number; y: number; width: number; height: number }

/** Reserves a band of the page for plots side by side; returns one box per plot. */
export function plotRow(layout: Layout, count: number, height: number, gap = 18): Box[] {
  layout.ensure(height);
  const width = (layout.width - gap * (count - 1)) / count;
  const boxes = Array.from({ length: count }, (_, k) => ({ x: layout.left + k * (width + gap), y: layout.y, width, height }));
  layout.y += height + 6;
  return boxes;
}
