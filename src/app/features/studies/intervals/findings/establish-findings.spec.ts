import { TestBed } from '@angular/core/testing';
import type { Analysis, Study } from '@shared/schemas';
import { StudySettings } from '@shared/schemas';
import { httpController, noAnimations, provideTestHttp } from '../../../../../testing/http';
import { sodiumInterval, storedBeforeResolution, fineGrained } from '../../../../../testing/coarse-results';
import { SpecimensStore } from '../../specimens/specimens-store';
import { StudyStore } from '../../study/study-store';
import { EstablishFindings } from './establish-findings';
import type { EstablishResult } from './interval-result';

const STUDY = {
  id: 14, kind: 'interval-establish', title: 'Sodium reference interval', analyte: { id: 6, name: 'Sodium' }, analyteUnit: 'mmol/L',
  settings: StudySettings.parse({ unit: 'mmol/L', decimals: 0, partitionFields: ['sex'] }), version: 2, state: 'draft', findings: 'current',
} as unknown as Study;
const ANALYSIS = { id: 41, studyId: 14, state: 'done', current: true } as Analysis;
const NARROW = 'CI narrower than one reporting step (1 mmol/L): the data cannot show a difference finer than the step.';

async function render(results: EstablishResult) {
  TestBed.configureTestingModule({ providers: [...provideTestHttp(), noAnimations, SpecimensStore, StudyStore] });
  const fixture = TestBed.createComponent(EstablishFindings);
  fixture.componentRef.setInput('study', STUDY);
  fixture.componentRef.setInput('analysis', ANALYSIS);
  fixture.componentRef.setInput('results', results);
  await fixture.whenStable();
  httpController().expectOne('/api/v1/studies/14/specimens').flush({ version: 2, rows: [] });
  await fixture.whenStable();
  const root = fixture.nativeElement as HTMLElement;
  const text = (id: string): string | null => root.querySelector(`[data-testid="${id}"]`)?.textContent?.replace(/\s+/g, ' ').trim() ?? null;
  return { root, text };
}

describe('EstablishFindings with values reported in whole steps', () => {
  beforeEach(() => jest.spyOn(HTMLCanvasElement.prototype, 'getContext').mockReturnValue(null));
  afterEach(() => {
    httpController().verify();
    jest.restoreAllMocks();
  });

  it('states the rule once above the limits and names each limit whose CI is narrower than the step', async () => {
    const { root, text } = await render(sodiumInterval());
    expect(root.querySelector('[data-testid="resolution-rule"] span')!.textContent).toBe(
      'Results are reported in steps of 1 mmol/L (detected from the data). A confidence interval narrower than one step says nothing finer than the step.',
    );
    expect(root.querySelectorAll('[data-testid="resolution-rule"]')).toHaveLength(1);
    expect(text('limits-upper-step')).toBe(`Upper limit: bootstrap ${NARROW}`);
    expect(text('limits-lower-step')).toBeNull();
    expect(text('limits-sex-F-lower-step')).toBe(`Lower limit: bootstrap ${NARROW}`);
    expect(text('limits-sex-F-upper-step')).toBeNull();
    expect(text('limits-sex-M-lower-step')).toBeNull();
  });

  it.each([
    ['fine-grained values', fineGrained(sodiumInterval())],
    ['results stored by engine 1.1.0', storedBeforeResolution(sodiumInterval())],
  ])('shows no word of the step for %s', async (_name, result) => {
    const { root, text } = await render(result);
    expect(text('resolution-rule')).toBeNull();
    expect(root.querySelectorAll('.step-note')).toHaveLength(0);
    expect(root.textContent).not.toContain('reporting step');
  });
});
