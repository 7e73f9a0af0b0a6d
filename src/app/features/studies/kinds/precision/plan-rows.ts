import type { PrecisionMaterial } from '@shared/kinds/precision/meta';
import { plural } from '@shared/types/plural';
import { type PlanRow, type PlanStudy, orNone, unitOf, withUnit } from '../plan-parts';
import { PRECISION_RULES } from './guidance';
import { precisionOwn } from './own-settings';

/** "Repeatability SD ≤ 0.12 mmol/L, within-laboratory SD ≤ 0.2 mmol/L" or "Repeatability CV ≤ 1.5 %, …" (as entered). */
export function claimsText(m: Pick<PrecisionMaterial, 'claimRepeatability' | 'claimWithinLab' | 'claimAs'>, unit: string): string {
  const claim = (value: number): string => (m.claimAs === 'cv' ? `${value} %` : withUnit(String(value), unit));
  const as = m.claimAs === 'cv' ? 'CV' : 'SD';
  return `Repeatability ${as} ≤ ${claim(m.claimRepeatability)}, within-laboratory ${as} ≤ ${claim(m.claimWithinLab)}`;
}

/** "; assigned value 5.20 ± 0.05 mmol/L (standard uncertainty), from the certificate" when one is given. */
function assignedText(m: PrecisionMaterial, unit: string): string {
  if (m.assignedValue === null) return '';
  const uncertainty = m.assignedUncertainty === null ? '' : ` (standard uncertainty ${withUnit(String(m.assignedUncertainty), unit)})`;
  const source = m.assignedSource.trim() === '' ? '' : `, from ${m.assignedSource.trim()}`;
  return `; assigned value ${withUnit(String(m.assignedValue), unit)}${uncertainty}${source}`;
}

/** "α = 0.05; each upper verification limit at α/2 = 0.025 (2 materials)": the level is shared among the materials. */
function alphaText(alpha: number, materials: number): string {
  if (materials < 2) return `α = ${alpha}`;
  return `α = ${alpha}; each upper verification limit at α/${materials} = ${Number((alpha / materials).toPrecision(3))} (${materials} materials)`;
}

/**
 * A precision verification's plan: each material with the manufacturer's claims (as SDs in the unit or CVs in %) and its
 * assigned value if any, the design (days × replicates per material, and the results that makes against those included),
 * α, the outlier and acceptance rules, and the lots. There is no bootstrap.
 */
export function precisionRows(study: PlanStudy): PlanRow[] {
  const s = study.settings;
  const own = precisionOwn(s);
  const unit = unitOf(study);
  const materials: PlanRow[] = own.materials.length === 0
    ? [{ label: 'Materials', value: 'None named', missing: true }]
    : own.materials.map((m, i) => ({ label: `Material ${i + 1}: ${m.name}`, value: `${claimsText(m, unit)}${assignedText(m, unit)}` }));
  const planned = own.days * own.replicates * own.materials.length;
  const design = `${own.days} days × ${own.replicates} replicates per material`;
  const lots = [s.reagentLot.trim() && `reagent lot ${s.reagentLot.trim()}`, own.controlLot.trim() && `control lot ${own.controlLot.trim()}`].filter(Boolean);
  return [
    ...materials,
    {
      label: 'Results',
      value: own.materials.length === 0 ? `${design}; ${study.n} included` : `${design}: ${planned} planned for ${plural(own.materials.length, 'material')}; ${study.n} included`,
      missing: study.n < planned,
    },
    { label: 'Significance level', value: alphaText(own.alpha, own.materials.length) },
    { label: 'Outlier rule', value: orNone(s.outlierRule) },
    { label: 'Acceptance rule', value: orNone(s.acceptanceRule, PRECISION_RULES.acceptanceRule) },
    { label: 'Lots', value: lots.length > 0 ? lots.join('; ') : 'Not given' },
  ];
}
