import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { buildSetupForm, readSetup } from '../../setup/setup-form-group';
import { setupValues } from '../../setup/setup-model';
import { noAnimations } from '../../../../../testing/http';
import { VerifySetupFields } from './verify-setup-fields';

async function render() {
  TestBed.configureTestingModule({ providers: [noAnimations] });
  const form = buildSetupForm({ ...setupValues(null, 'abc123'), kind: 'interval-verify' });
  const fixture = TestBed.createComponent(VerifySetupFields);
  fixture.componentRef.setInput('form', form);
  await fixture.whenStable();
  return { form, fixture, loader: TestbedHarnessEnvironment.loader(fixture) };
}

const population = MatFormFieldHarness.with({ selector: ':has([data-testid="setup-population"])' });

describe('VerifySetupFields: the reference population the report prints', () => {
  it('asks who the local individuals are and saves the words with the settings', async () => {
    const { form, loader } = await render();
    const field = await loader.getHarness(population);
    expect(await field.getLabel()).toBe('Reference population');
    const box = await loader.getHarness(MatInputHarness.with({ selector: '[data-testid="setup-population"]' }));
    await box.setValue('Healthy adult blood donors, 18–65 y');
    expect(readSetup(form).settings.populationDescription).toBe('Healthy adult blood donors, 18–65 y');
    expect(form.controls.settings.controls.populationDescription.valid).toBe(true);
    expect((await field.getTextHints()).at(-1)).toBe('35 / 2000');
  });

  it('may be left empty: a verification needs no description to be analysed or submitted', async () => {
    const { form } = await render();
    expect(form.controls.settings.controls.populationDescription.hasError('required')).toBe(false);
  });

  it('refuses a description over the limit with words that name the limit', async () => {
    const { form, fixture, loader } = await render();
    const box = await loader.getHarness(MatInputHarness.with({ selector: '[data-testid="setup-population"]' }));
    await box.setValue('x'.repeat(2001));
    await box.blur();
    await fixture.whenStable();
    expect(form.controls.settings.controls.populationDescription.valid).toBe(false);
    const field = await loader.getHarness(population);
    expect(await field.getTextErrors()).toEqual(['Keep the description of the reference population to 2,000 characters']);
  });
});
