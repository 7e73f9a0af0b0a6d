import {
  BarController, BarElement, Colors, Legend, LineElement, LinearScale, PointElement, ScatterController, Title, Tooltip,
} from 'chart.js';
import type { NgChartsConfiguration } from 'ng2-charts';
import { markersPlugin, pointKeysPlugin } from './markers-plugin';

/**
 * The chart.js parts the Findings plots use (scatter with lines, bars on a number line), plus Colors so
 * nothing falls back to grey, our markers (lines, bands, the allowable region) and the record of where each
 * specimen's point is drawn, and Open Sans as the font. Given to provideCharts() by the chart component
 * only, so chart.js stays in the Findings chunk.
 */
export const CHART_SETUP: NgChartsConfiguration = {
  registerables: [ScatterController, BarController, LinearScale, PointElement, LineElement, BarElement, Tooltip, Legend, Title, Colors, markersPlugin, pointKeysPlugin],
  defaults: {
    font: { family: "'Open Sans', system-ui, sans-serif", size: 12 },
    color: '#40484a',
    maintainAspectRatio: false,
    animation: false,
  },
};
