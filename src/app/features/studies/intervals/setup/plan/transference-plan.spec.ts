import { TestBed } from '@angular/core/testing';
import { StudySettings } from '@shared/schemas';
import { buildSetupForm, type SetupGroup } from '../../../setup/setup-form-group';
import { setupValues } from '../../../setup/setup-model';
import { TransferencePlan } from './transference-plan';
import { transferencePlan, verifyN } from './transference-data';

function verifyForm(planned: number | null): SetupGroup {
  const values = setupValues(null, 'abc123');
  return buildSetupForm({ ...values, kind: 'interval-verify', settings: { ...values.settings, ...StudySettings.pick({ plannedSpecimens: true }).parse({ plannedSpecimens: planned }) } });
}

async function render(form: SetupGroup) {
  const fixture = TestBed.createComponent(TransferencePlan);
  fixture.componentRef.setInput('form', form);
  await fixture.whenStable();
  return { fixture, root: fixture.nativeElement as HTMLElement };
}

const cells = (root: HTMLElement, row: number) =>
  Array.from(root.querySelectorAll(`[data-testid="transference-row-${row}"] th, [data-testid="transference-row-${row}"] td`)).map((c) => c.textContent!.trim());

describe('how often the transference rule accepts (Setup of a verification)', () => {
  // jsdom has no canvas: chart.js gets no context and draws nothing, which is all these tests need.
  beforeEach(() => jest.spyOn(HTMLCanvasElement.prototype, 'getContext').mockReturnValue(null));

  it('says for 20 individuals that 10% outside is still accepted 67.7% of the time, 89.6% with the retest (scipy.stats.binom, plan-transference.spec.ts)', async () => {
    const { root } = await render(verifyForm(20));
    expect(root.querySelector('[data-testid="transference-sentence"]')!.textContent!.trim()).toBe(
      'With 10% of your population outside the stated interval, the rule still accepts 67.7% of the time (89.6% with the retest).',
    );
    expect(root.querySelectorAll('[data-testid="transference-table"] tbody tr')).toHaveLength(8);
    expect(cells(root, 0)).toEqual(['2.5%', '98.7%', '> 99.9%']);
    expect(cells(root, 6)).toEqual(['20%', '20.6%', '37.0%']);
    expect(cells(root, 3)).toEqual(['10%', '67.7%', '89.6%']);
    expect(root.querySelector('[data-testid="transference-plan"]')!.textContent).toContain('at most 2 of 20 individuals fall outside it');
    expect(root.querySelector('[data-testid="transference-chart"] canvas')!.getAttribute('aria-label')).toContain('at 10% outside, 67.7% at first and 89.6% with the retest');
  });

  it('follows the planned number as it is typed: 40 individuals allow 4 outside', async () => {
    const form = verifyForm(20);
    const { fixture, root } = await render(form);
    form.controls.settings.controls.plannedSpecimens.setValue(40);
    await fixture.whenStable();
    const plan = transferencePlan(40);
    expect(plan.k).toBe(4);
    expect(root.querySelector('[data-testid="transference-plan"]')!.textContent).toContain('at most 4 of 40 individuals fall outside it');
    expect(cells(root, 3)).toEqual(['10%', plan.rows[3].acceptFirst, plan.rows[3].acceptWithRetest]);
    expect(plan.rows[3].acceptFirst).not.toBe('67.7%');
  });

  it('uses 20 while no number is planned, and says so', async () => {
    expect(verifyN(null)).toBe(20);
    expect(verifyN(0)).toBe(20);
    expect(verifyN(2.5)).toBe(20);
    const { root } = await render(verifyForm(null));
    expect(root.querySelector('[data-testid="transference-plan"]')!.textContent).toContain('(20 while none is planned)');
    expect(cells(root, 3)).toEqual(['10%', '67.7%', '89.6%']);
  });
});
