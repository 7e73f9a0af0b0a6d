import { Signal, computed, effect, inject, untracked } from '@angular/core';
import type { Analysis, Study } from '@shared/schemas';
import type { SpecimenLayout } from '../../specimens/specimen-layout';
import { SpecimensStore } from '../../specimens/specimens-store';

/**
 * The grid rows a findings panel draws: loads the study's rows, and says whether they are the rows the
 * analysis used (the findings are current and nothing on screen is unsaved). Call from a constructor or field.
 * `layout` is the kind's grid layout (from its own folder: a panel never imports the kinds' registry); without it,
 * the rows the page has loaded are used (the Findings tab and the review page load them with the kind's layout).
 */
export function savedRows(
  study: Signal<Study>, analysis: Signal<Analysis>, layout?: SpecimenLayout,
): { store: SpecimensStore; current: Signal<boolean> } {
  const store = inject(SpecimensStore);
  effect(() => {
    const s = study();
    untracked(() => store.ensureLoaded(s.id, layout ?? store.layout));
  });
  const current = computed(() => analysis().current && study().findings !== 'out-of-date' && store.status() === 'saved' && !store.loading());
  return { store, current };
}
