import { monitorEventLoopDelay, type IntervalHistogram } from 'node:perf_hooks';

let histogram: IntervalHistogram | null = null;

/**
 * How late this process's event loop ran since the last reading, in milliseconds (Node's own sampler,
 * every 10 ms). Each reading starts a new period, so a monitor polling the health check sees each stretch.
 */
export function eventLoopDelaySinceLastReading(): { p50: number; p99: number; max: number } {
  if (!histogram) {
    histogram = monitorEventLoopDelay({ resolution: 10 });
    histogram.enable();
  }
  const ms = (ns: number) => (Number.isFinite(ns) ? Math.round(ns / 1e4) / 100 : 0);
  const reading = { p50: ms(histogram.percentile(50)), p99: ms(histogram.percentile(99)), max: ms(histogram.max) };
  histogram.reset();
  return reading;
}
