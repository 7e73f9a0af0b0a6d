import { type PlanRow, type PlanStudy, bootstrapRow, orNone, specimensRow, unitOf, withUnit } from '../plan-parts';

/** A verification's plan: the stated interval and its source, the population, the acceptance rule and the count. */
export function verifyRows(study: PlanStudy): PlanRow[] {
  const s = study.settings;
  const stated = s.statedLower === null || s.statedUpper === null ? 'Not set' : withUnit(`${s.statedLower} to ${s.statedUpper}`, unitOf(study));
  return [
    { label: 'Stated reference interval', value: stated, missing: stated === 'Not set' },
    { label: 'Source of the stated interval', value: orNone(s.statedSource), missing: s.statedSource.trim() === '' },
    { label: 'Reference population', value: orNone(s.populationDescription) },
    { label: 'Acceptance rule', value: orNone(s.acceptanceRule) },
    specimensRow(study),
    bootstrapRow(study),
  ];
}
