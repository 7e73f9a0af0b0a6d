import { Component, input } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { buildSetupForm, type SetupGroup } from '../../setup/setup-form-group';
import { setupValues } from '../../setup/setup-model';
import { ESTABLISH_PLAN } from './interval-plans';
import { requireWhileShown, startWithPlan } from './require-fields';

@Component({ selector: 'app-plan-host', template: '' })
class PlanHost {
  readonly form = input.required<SetupGroup>();
  constructor() {
    startWithPlan(this.form, ESTABLISH_PLAN);
    requireWhileShown(this.form, (f) => [f.controls.settings.controls.populationDescription]);
  }
}

async function show(form: SetupGroup) {
  const fixture = TestBed.createComponent(PlanHost);
  fixture.componentRef.setInput('form', form);
  await fixture.whenStable();
  return fixture;
}

describe('interval setup helpers', () => {
  it("gives a new study the interval's plan and requires the population, and takes both back when another kind is chosen", async () => {
    const form = buildSetupForm(setupValues(null, 'abc'));
    const fixture = await show(form);
    const s = form.controls.settings.controls;
    expect([s.confidenceLevel.value, s.plannedSpecimens.value, s.outlierRule.value]).toEqual([0.9, 120, ESTABLISH_PLAN.outlierRule]);
    expect(s.populationDescription.hasError('required')).toBe(true);
    fixture.destroy();
    expect([s.confidenceLevel.value, s.plannedSpecimens.value]).toEqual([0.95, null]);
    expect(s.outlierRule.value).toMatch(/^Generalized ESD/);
    expect(s.populationDescription.hasError('required')).toBe(false);
  });

  it('keeps what the user changed, and leaves an existing study as it was saved', async () => {
    const form = buildSetupForm(setupValues(null, 'abc'));
    form.controls.settings.controls.plannedSpecimens.setValue(240);
    const fixture = await show(form);
    expect(form.controls.settings.controls.plannedSpecimens.value).toBe(240);
    fixture.destroy();
    expect(form.controls.settings.controls.plannedSpecimens.value).toBe(240);

    const saved = buildSetupForm(setupValues(null, 'abc'));
    saved.controls.kind.disable();
    await show(saved);
    expect(saved.controls.settings.controls.confidenceLevel.value).toBe(0.95);
  });
});
