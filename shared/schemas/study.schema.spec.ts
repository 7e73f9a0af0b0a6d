import { StudySettings, StudySettingsPatch } from './study.schema';

describe('study settings', () => {
  it('a patch keeps only the fields given, so it never overwrites stored values with defaults', () => {
    expect(StudySettingsPatch.parse({})).toEqual({});
    expect(StudySettingsPatch.parse({ resamples: 2000 })).toEqual({ resamples: 2000 });
  });

  it('still checks the values it is given, naming the field', () => {
    const r = StudySettingsPatch.safeParse({ resamples: 10 });
    expect(r.success).toBe(false);
    expect(r.error!.issues[0].path).toEqual(['resamples']);
  });

  it('full settings fill in every default', () => {
    expect(StudySettings.parse({})).toMatchObject({ resamples: 10000, regressionResamples: 2000, confidenceLevel: 0.95, percentiles: [2.5, 97.5] });
  });
});
