import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { StudySettings } from '@shared/schemas';
import { noAnimations } from '../../../../../../testing/http';
import { buildSetupForm, type SetupGroup } from '../../../setup/setup-form-group';
import { setupValues } from '../../../setup/setup-model';
import { establishGrid, establishPlan, smallestN } from './establish-data';
import { EstablishPlan, presumedPopulation } from './establish-plan';

function establishForm(over: Partial<StudySettings>): SetupGroup {
  const values = setupValues(null, 'abc123');
  const settings = StudySettings.parse({ confidenceLevel: 0.9, plannedSpecimens: 120, unit: 'mmol/L', decimals: 1, ...over });
  return buildSetupForm({ ...values, kind: 'interval-establish', settings: { ...values.settings, ...settings, decisionLevels: '' } });
}

async function render(form: SetupGroup) {
  TestBed.configureTestingModule({ providers: [noAnimations] });
  const fixture = TestBed.createComponent(EstablishPlan);
  fixture.componentRef.setInput('form', form);
  await fixture.whenStable();
  return { fixture, root: fixture.nativeElement as HTMLElement, loader: TestbedHarnessEnvironment.loader(fixture) };
}

const cells = (root: HTMLElement, n: number) =>
  Array.from(root.querySelectorAll(`[data-testid="establish-row-${n}"] td`)).map((c) => c.textContent!.trim());

describe('what more reference individuals buy (Setup of an establishment)', () => {
  // jsdom has no canvas: chart.js gets no context and draws nothing, which is all these tests need.
  beforeEach(() => jest.spyOn(HTMLCanvasElement.prototype, 'getContext').mockReturnValue(null));

  it('gives 120 individuals the ranks 1–7 and 114–120 at 90% (CLSI EP28-A3c practice; rank-ci.ts), and says no CI exists below 119', async () => {
    const { root } = await render(establishForm({}));
    const at120 = cells(root, 120);
    expect(at120[0]).toBe('1–7');
    expect(at120[3]).toBe('114–120');
    expect(root.querySelector('[data-testid="establish-row-120"]')!.textContent).toContain('planned');
    expect(root.querySelectorAll('[data-testid="establish-table"] tbody tr')).toHaveLength(6);
    expect(root.querySelector('[data-testid="establish-smallest-0"] span')!.textContent!.replace(/\s+/g, ' ').trim()).toBe(
      'Below 119 individuals no 90% CI of the 2.5th or 97.5th percentile exists from the ranks.',
    );
    expect(smallestN(2.5, 0.9)).toBe(119);
    // Spans in percentile points: (s − r)/(n + 1) of the population.
    expect(at120[2]).toBe(((100 * 6) / 121).toFixed(2));
  });

  it('adds the planned number to the grid, with "no CI" below the smallest that has one', async () => {
    expect(establishGrid(100)).toEqual([100, 120, 150, 200, 240, 300, 400]);
    expect(establishGrid(null)).toEqual([120, 150, 200, 240, 300, 400]);
    const { root } = await render(establishForm({ plannedSpecimens: 100 }));
    expect(cells(root, 100)).toEqual(['no CI', '—', '—', 'no CI', '—', '—']);
  });

  it('shows expected widths in the unit for a presumed population, and says what is missing from one', async () => {
    const { fixture, root, loader } = await render(establishForm({}));
    expect(root.querySelector('[data-testid="establish-table"]')!.textContent).not.toContain('Expected width');
    const shape = await loader.getHarness(MatSelectHarness.with({ selector: '[data-testid="establish-shape"]' }));
    await shape.open();
    await shape.clickOptions({ text: 'Normal' });
    expect(root.querySelector('[data-testid="establish-population-problem"]')!.textContent).toContain('Give the presumed lower and upper limit');
    await (await loader.getHarness(MatInputHarness.with({ selector: '[data-testid="establish-lower"]' }))).setValue('3.5');
    await (await loader.getHarness(MatInputHarness.with({ selector: '[data-testid="establish-upper"]' }))).setValue('5.1');
    await fixture.whenStable();
    expect(root.querySelector('[data-testid="establish-table"]')!.textContent).toContain('Expected width (mmol/L)');
    const expected = establishPlan({ planned: 120, percentiles: [2.5, 97.5], level: 0.9, population: { shape: 'normal', lower: 3.5, upper: 5.1 }, unit: 'mmol/L', decimals: 1 });
    expect(cells(root, 120)[3]).toBe(expected.rows[0].limits[0].width);
    expect(Number(expected.rows[0].limits[0].width)).toBeGreaterThan(0);
    // A symmetric population gives both limits one curve.
    expect(expected.curves.series.map((s) => s.label)).toEqual(['2.5th and 97.5th percentiles (alike)']);
  });

  it('refuses a presumed population it cannot use, in words', () => {
    expect(presumedPopulation({ shape: 'normal', lower: 5, upper: 4 }).problem).toBe('The presumed upper limit must be above the lower.');
    expect(presumedPopulation({ shape: 'log-normal', lower: 0, upper: 4 }).problem).toBe('A log-normal population needs a lower limit above 0.');
    expect(presumedPopulation({ shape: 'none', lower: null, upper: null })).toEqual({ population: null, problem: null });
    const skewed = establishPlan({ planned: null, percentiles: [2.5, 97.5], level: 0.9, population: { shape: 'log-normal', lower: 40, upper: 110 }, unit: 'µmol/L', decimals: 0 });
    expect(skewed.curves.series).toHaveLength(2);
  });
});
