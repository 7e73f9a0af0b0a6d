import { DestroyRef, inject, type Signal } from '@angular/core';
import type { BaseChartDirective } from 'ng2-charts';

/**
 * The printed page is narrower than the screen: redraws the chart's canvas to the paper's width before printing and
 * back after. Call in a component's constructor (it uses inject).
 */
export function fitChartOnPrint(chart: Signal<BaseChartDirective | undefined>): void {
  const fit = (): void => chart()?.chart?.resize();
  window.addEventListener('beforeprint', fit);
  window.addEventListener('afterprint', fit);
  inject(DestroyRef).onDestroy(() => {
    window.removeEventListener('beforeprint', fit);
    window.removeEventListener('afterprint', fit);
  });
}
