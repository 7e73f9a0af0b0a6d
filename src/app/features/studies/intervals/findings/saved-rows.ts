import { Signal, computed, effect, inject, untracked } from '@angular/core';
import type { Analysis, Study } from '../../../../../../shared/schemas';
import { SpecimensStore } from '../../specimens/specimens-store';
import { kindView } from '../../study-kinds';

/**
 * The grid rows a findings panel draws: loads the study's rows, and says whether they are the rows the
 * analysis used (the findings are current and nothing on screen is unsaved). Call from a constructor or field.
 */
export function savedRows(study: Signal<Study>, analysis: Signal<Analysis>): { store: SpecimensStore; current: Signal<boolean> } {
  const store = inject(SpecimensStore);
  effect(() => {
    const s = study();
    untracked(() => store.ensureLoaded(s.id, kindView(s.kind).layout));
  });
  const current = computed(() => analysis().current && study().findings !== 'out-of-date' && store.status() === 'saved' && !store.loading());
  return { store, current };
}
