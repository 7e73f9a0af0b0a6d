import { type PlanRow, type PlanStudy, bootstrapRow, orNone, specimensRow } from '../plan-parts';
import { METHOD_WORDS } from '../../intervals/findings/interval-wording';
import { percentileWords } from '../../intervals/setup/percentile-choices';

/** An establishment's plan: the population, percentiles, method, partitions, acceptance rule, count and bootstrap. */
export function establishRows(study: PlanStudy): PlanRow[] {
  const s = study.settings;
  const partitions = s.partitionFields.map((f) => (f === 'sex' ? 'sex' : 'age band')).join(', ');
  return [
    { label: 'Reference population', value: orNone(s.populationDescription), missing: s.populationDescription.trim() === '' },
    { label: 'Percentiles', value: percentileWords(s.percentiles) },
    { label: 'Method', value: METHOD_WORDS[s.intervalMethod] ?? s.intervalMethod },
    { label: 'Partitions tested', value: partitions || 'None' },
    { label: 'Acceptance rule', value: orNone(s.acceptanceRule) },
    specimensRow(study),
    bootstrapRow(study),
  ];
}
