import { buildSetupForm, readSetup } from './setup-form-group';
import { setupValues } from './setup-model';

describe('the Setup form group', () => {
  const form = () => buildSetupForm(setupValues(null, 'abc123'));

  it("checks a setting with the shared schema's own words", () => {
    const f = form();
    f.controls.settings.controls.resamples.setValue(50);
    expect(f.controls.settings.controls.resamples.errors).toEqual({ rule: 'At least 1,000 resamples' });
    f.controls.settings.controls.resamples.setValue(null);
    expect(f.controls.settings.controls.resamples.errors).toEqual({ rule: 'Enter a number here' });
    f.controls.settings.controls.allowableBiasAbsolute.setValue(null);
    expect(f.controls.settings.controls.allowableBiasAbsolute.errors).toBeNull();
  });

  it('refuses decision levels it cannot read', () => {
    const f = form();
    f.controls.settings.controls.decisionLevels.setValue('2.8, seven');
    expect(f.controls.settings.controls.decisionLevels.errors?.['rule']).toMatch(/numbers separated by commas/);
    f.controls.settings.controls.decisionLevels.setValue('2.8, 7.0');
    expect(f.controls.settings.controls.decisionLevels.errors).toBeNull();
  });

  it('refuses a last run day before the first, and forgets the error once fixed', () => {
    const f = form();
    f.controls.settings.patchValue({ runsFrom: '2026-05-10', runsTo: '2026-05-01' });
    expect(f.controls.settings.controls.runsTo.errors?.['rule']).toBe('The last run day cannot come before the first');
    f.controls.settings.patchValue({ runsTo: '2026-05-12' });
    expect(f.controls.settings.controls.runsTo.errors).toBeNull();
  });

  it('reads empty run days as null', () => {
    const f = form();
    f.controls.settings.patchValue({ runsFrom: '', runsTo: '2026-05-12' });
    const values = readSetup(f);
    expect(values.settings.runsFrom).toBeNull();
    expect(values.settings.runsTo).toBe('2026-05-12');
    expect(values).not.toHaveProperty('reason');
  });
});
