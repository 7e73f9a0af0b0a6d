import type { PrecisionMaterialResult, PrecisionResult } from '../../stats/precision-types';
import {
  alphaText, alphaWords, anyNotVerified, claimText, claimVerdictSentence, componentHeadings, componentRows, designRows, dfDecimals, dfText,
  flaggedRows, givenDecimals, materialSummary, overallSentence, percentText, precisionFormat, resultHeading, termsNote, truenessRows,
  truenessSentence, typedDecimals, verdictLines, verdictWord,
} from './words';
import { LEVEL_1, LEVEL_2, precisionResult } from './words-fixture';

// The wording the Findings panel, the PDF and the Results sheet all print (their own specs check it on the
// screen and in the PDF). Results reported with 2 decimals in mmol/L: SDs and means with 3, CVs with 1.
const F = precisionFormat('mmol/L', 2);
const R = precisionResult();

describe('precision wording', () => {
  it('takes the unit and the decimals of the study: results as reported, estimates one more, CVs one', () => {
    expect(F).toEqual({ unit: 'mmol/L', value: 2, stat: 3, percent: 1 });
    expect(precisionFormat('U/L', 0)).toEqual({ unit: 'U/L', value: 0, stat: 1, percent: 1 });
    expect(precisionFormat(null, null)).toEqual({ unit: '', value: 1, stat: 2, percent: 1 });
  });

  it('writes a percentage as the other kinds do, with no space before the sign', () => {
    expect(percentText(3.4, F)).toBe('3.4%');
    expect(percentText(-1.27, F)).toBe('−1.3%');
    expect(percentText(null, F)).toBe('—');
  });

  it('writes degrees of freedom whole, or with one decimal when fractional (Satterthwaite) below 100', () => {
    expect(dfText(6)).toBe('6');
    expect(dfText(3.27)).toBe('3.3');
    expect(dfText(7.0000000000001)).toBe('7');
    expect(dfText(440.4)).toBe('440');
    expect(dfText(1672.3)).toBe('1672');
    expect(dfText(null)).toBe('—');
    expect([dfDecimals(20), dfDecimals(7.54), dfDecimals(440.4), dfDecimals(undefined)]).toEqual([0, 1, 0, 0]);
  });

  it('writes α as given', () => {
    expect([alphaText(0.05), alphaText(0.0125), alphaText(0.1 + 0.2), alphaText(null)]).toEqual(['0.05', '0.0125', '0.3', '—']);
    expect(alphaWords({ alpha: 0.01, materialsTested: 1 })).toBe('α = 0.01, 1 material');
  });

  it('says a verified claim with the SD in the unit', () => {
    expect(claimVerdictSentence(LEVEL_1, 'repeatability', R, F)).toBe('Repeatability verified: SD 0.052 mmol/L is within the claim 0.060 mmol/L.');
  });

  it('says "consistent with the claim" with the claim, the UVL, α and the number of materials', () => {
    expect(claimVerdictSentence(LEVEL_1, 'withinLab', R, F)).toBe(
      'Within-laboratory precision consistent with the claim: SD 0.087 mmol/L exceeds the claim 0.080 mmol/L but not the upper verification limit 0.111 mmol/L (α = 0.05, 2 materials).',
    );
    expect(claimVerdictSentence(LEVEL_2, 'withinLab', R, F)).toBe(
      'Within-laboratory precision consistent with the claim: CV 3.4% exceeds the claim 3.0% but not the upper verification limit 3.6% (α = 0.05, 2 materials).',
    );
  });

  it('says a claim not verified, adding a decimal where the CV and its limit would read the same', () => {
    // CV 2.43 against the UVL 2.41: with one decimal both read 2.4.
    expect(claimVerdictSentence(LEVEL_2, 'repeatability', R, F)).toBe(
      'Repeatability not verified: CV 2.43% exceeds the upper verification limit 2.41% of the claim 2.00% (α = 0.05, 2 materials).',
    );
  });

  it('still reads a stored result without a verdict as a sentence', () => {
    const none = { ...LEVEL_1, verdicts: {} } as unknown as PrecisionMaterialResult;
    expect(claimVerdictSentence(none, 'repeatability', R, F)).toBe('Repeatability: no verdict (SD 0.052 mmol/L; claim 0.060 mmol/L).');
    expect(componentRows(none, F)[0]).toMatchObject({ verdict: '—', verdictKey: null });
    expect(verdictWord(undefined)).toBe('—');
  });

  it('keeps a claim’s typed decimals, and adds one or two where two different numbers would print alike', () => {
    expect([typedDecimals(0.075), typedDecimals(2.25), typedDecimals(140), typedDecimals(1e-7), typedDecimals(5)]).toEqual([3, 2, 0, 7, 0]);
    expect([givenDecimals(2.25, 1), givenDecimals(2, 1), givenDecimals(0.123456789, 1), givenDecimals(null, 2)]).toEqual([2, 1, 5, 2]);
    expect([claimText(0.04, 'sd', F), claimText(1, 'cv', F), claimText(1.05, 'cv', F)]).toEqual(['0.040', '1.0', '1.05']);
    const typed = { ...LEVEL_2, repeatability: { ...LEVEL_2.repeatability, cv: 2.1 }, claims: { ...LEVEL_2.claims, repeatability: 2.25 }, verdicts: { ...LEVEL_2.verdicts, repeatability: 'verified' as const } };
    expect(claimVerdictSentence(typed, 'repeatability', R, F)).toBe('Repeatability verified: CV 2.10% is within the claim 2.25%.');
    expect(componentRows(typed, F)[0]).toMatchObject({ cv: '2.10', claim: '2.25', uvl: '2.41' });
    // SD 0.0598 within the claim 0.06: with 3 decimals both print 0.060; the SD's CI follows its SD.
    const close = { ...LEVEL_1, repeatability: { ...LEVEL_1.repeatability, sd: 0.0598 } };
    expect(claimVerdictSentence(close, 'repeatability', R, F)).toBe('Repeatability verified: SD 0.0598 mmol/L is within the claim 0.0600 mmol/L.');
    expect(componentRows(close, F)[0]).toMatchObject({ sd: '0.0598', ci: '0.0337 to 0.1152', claim: '0.0600', uvl: '0.0899' });
    expect(truenessRows({ ...LEVEL_2, trueness: { ...LEVEL_2.trueness!, assigned: 12.125 } }, F, R)[0]).toEqual(['Assigned value', '12.125 mmol/L']);
  });

  it('says the trueness verdict against the assigned value, and nothing without one', () => {
    expect(truenessSentence(LEVEL_2, F)).toBe(
      'Trueness verified: the mean 11.850 mmol/L lies within the verification interval 11.620 to 12.380 mmol/L around the assigned value 12.00 mmol/L (bias −0.150 mmol/L, −1.3%).',
    );
    const outside = { ...LEVEL_2, mean: 12.5, trueness: { ...LEVEL_2.trueness!, bias: 0.5, biasPercent: 4.17, verdict: 'not-verified' as const } };
    expect(truenessSentence(outside, F)).toBe(
      'Trueness not verified: the mean 12.500 mmol/L lies outside the verification interval 11.620 to 12.380 mmol/L around the assigned value 12.00 mmol/L (bias 0.500 mmol/L, 4.2%).',
    );
    expect(truenessSentence(LEVEL_1, F)).toBeNull();
    expect(truenessRows(LEVEL_1, F, R)).toEqual([]);
  });

  it('lists a material’s verdicts in order, trueness last where a value is assigned', () => {
    expect(verdictLines(LEVEL_1, R, F).map((v) => [v.key, v.verdict])).toEqual([['repeatability', 'verified'], ['withinLab', 'consistent']]);
    const lines = verdictLines(LEVEL_2, R, F);
    expect(lines.map((v) => [v.key, v.verdict])).toEqual([['repeatability', 'not-verified'], ['withinLab', 'consistent'], ['trueness', 'verified']]);
    expect(lines.map((v) => v.text)).toEqual([
      claimVerdictSentence(LEVEL_2, 'repeatability', R, F), claimVerdictSentence(LEVEL_2, 'withinLab', R, F), truenessSentence(LEVEL_2, F),
    ]);
  });

  it('makes the table of the three components, claims and limits in the claim’s terms (SD)', () => {
    expect(componentRows(LEVEL_1, F)).toEqual([
      { key: 'repeatability', name: 'Repeatability', sd: '0.052', cv: '1.0', df: '6', ci: '0.034 to 0.115', claim: '0.060', uvl: '0.090', verdict: 'Verified', verdictKey: 'verified' },
      { key: 'betweenDay', name: 'Between-day', sd: '0.050', cv: '0.9', df: '—', ci: '—', claim: '—', uvl: '—', verdict: 'No claim', verdictKey: null },
      { key: 'withinLab', name: 'Within-laboratory precision', sd: '0.087', cv: '1.6', df: '3.3', ci: '0.050 to 0.287', claim: '0.080', uvl: '0.111', verdict: 'Consistent with the claim', verdictKey: 'consistent' },
    ]);
    expect(componentHeadings(LEVEL_1, F, 0.05)).toEqual({
      sd: 'SD (mmol/L)', cv: 'CV (%)', ci: '95% CI of the SD (mmol/L)', claim: 'Claim (SD, mmol/L)', uvl: 'Upper verification limit (SD, mmol/L)', uvlShort: 'UVL (SD, mmol/L)',
    });
    expect(componentHeadings(LEVEL_1, precisionFormat('', 2), 0.1)).toMatchObject({ sd: 'SD', ci: '90% CI of the SD', claim: 'Claim (SD)' });
  });

  it('writes CV claims in % and tells apart a CV from the limit it exceeds in the table too', () => {
    const [rep, , wl] = componentRows(LEVEL_2, F);
    expect(rep).toMatchObject({ sd: '0.288', cv: '2.43', claim: '2.00', uvl: '2.41', verdict: 'Not verified', verdictKey: 'not-verified' });
    expect(wl).toMatchObject({ cv: '3.4', df: '7.5', claim: '3.0', uvl: '3.6', verdict: 'Consistent with the claim' });
    expect(componentHeadings(LEVEL_2, F, 0.05)).toMatchObject({ claim: 'Claim (CV, %)', uvl: 'Upper verification limit (CV, %)', uvlShort: 'UVL (CV, %)' });
  });

  it('says under the table what the claims’ terms are, what each verdict means, and when the between-day SD is set to 0', () => {
    expect(termsNote(LEVEL_2, F)).toBe(
      'The claims are CVs in %, so each estimate is judged as a CV. Verified: within the claim. Consistent with the claim: above the claim but ' +
      'within its upper verification limit (UVL), the most a laboratory whose true precision equals the claim would see by chance. ' +
      'Not verified: above that limit. Between-day precision has no claim of its own: it is part of the within-laboratory precision.',
    );
    expect(termsNote(LEVEL_1, F)).toMatch(/^The claims are SDs in mmol\/L, so each estimate is judged as an SD\./);
    const flat = { ...LEVEL_1, anova: { ...LEVEL_1.anova, msBetween: 0.0003 } };
    expect(termsNote(flat, F)).toMatch(/ The days differ less than the replicates within them \(mean square between days not above that within\), so the between-day SD is set to 0 and the within-laboratory SD equals the repeatability SD\.$/);
    expect(termsNote(LEVEL_1, F)).not.toContain('set to 0');
  });

  it('lists the trueness details and the flagged replicates', () => {
    expect(truenessRows(LEVEL_2, F, R)).toEqual([
      ['Assigned value', '12.00 mmol/L'],
      ['Standard uncertainty of the assigned value', '0.10 mmol/L'],
      ['Source of the assigned value', 'Control insert, lot 4471'],
      ['Grand mean of the results', '11.850 mmol/L'],
      ['Bias (mean − assigned value)', '−0.150 mmol/L (−1.3%)'],
      ['Standard error of the grand mean', '0.140 mmol/L (2.4 df)'],
      ['Degrees of freedom of the interval', '7.5'],
      ['Multiplier t of √(SE² + u²)', '2.943'],
      ['Verification interval, assigned value ± t·√(SE² + u²) (α = 0.05, 2 materials)', '11.620 to 12.380 mmol/L'],
    ]);
    // Results stored without the SE's df and the multiplier, and an assigned value of 0 (no bias in %).
    const bare = { ...LEVEL_2.trueness!, seDf: undefined, multiplier: undefined, assigned: 0, biasPercent: null as unknown as number };
    const rows = truenessRows({ ...LEVEL_2, trueness: bare }, F, R);
    expect(rows.map((row) => row[0])).not.toContain('Multiplier t of √(SE² + u²)');
    expect(rows).toContainEqual(['Standard error of the grand mean', '0.140 mmol/L']);
    expect(rows).toContainEqual(['Bias (mean − assigned value)', '−0.150 mmol/L']);
    expect(truenessSentence({ ...LEVEL_2, trueness: bare }, F)).toContain('(bias −0.150 mmol/L).');
    expect(flaggedRows(LEVEL_2, F)).toEqual([
      { row: '14', day: '2', replicate: '1', value: '12.20', why: 'More than 5.5 repeatability SDs from the day mean' },
    ]);
    expect(resultHeading(F)).toBe('Result (mmol/L)');
    expect(resultHeading(precisionFormat('', 1))).toBe('Result');
    expect(flaggedRows({ outliers: [{ day: '3', replicate: null, value: 11.6, why: 'x' }] }, F)[0]).toMatchObject({ replicate: '—', row: '—', value: '11.60' });
  });

  it('sums up a material and every material', () => {
    expect(materialSummary(LEVEL_1, F)).toBe('9 results over 3 days; grand mean 5.443 mmol/L.');
    expect(overallSentence(R)).toBe(
      '4 claims over 2 materials: 1 verified, 2 consistent with the claim, 1 not verified. Trueness verified for 1 of 1 material with an assigned value.',
    );
    expect(anyNotVerified(R)).toBe(true);
    const good = { ...LEVEL_1, verdicts: { repeatability: 'verified' as const, withinLab: 'verified' as const } };
    expect(overallSentence(precisionResult([good]))).toBe('Every claim verified: repeatability and within-laboratory precision of 1 material.');
    expect(anyNotVerified(precisionResult([good]))).toBe(false);
    expect(anyNotVerified(precisionResult([good, { ...LEVEL_2, verdicts: { repeatability: 'verified', withinLab: 'verified' } }]))).toBe(false);
    expect(anyNotVerified(precisionResult([good, { ...LEVEL_2, verdicts: { repeatability: 'verified', withinLab: 'verified' }, trueness: { ...LEVEL_2.trueness!, verdict: 'not-verified' } }]))).toBe(true);
    expect(overallSentence(precisionResult([]))).toBe('No material could be analysed; see the warnings.');
    // Stored results without materials (the PDF reads whatever is stored).
    expect(overallSentence({} as PrecisionResult)).toBe('No material could be analysed; see the warnings.');
    expect(anyNotVerified({} as PrecisionResult)).toBe(false);
  });

  it('lays out the design: materials, N, days, exclusions, α shared among the materials, the CI level, the engine', () => {
    expect(designRows(R)).toEqual([
      ['Materials tested (ℓ)', '2'],
      ['Results analysed (N)', '18 (Level 1: 9; Level 2: 9)'],
      ['Days with results', 'Level 1: 3; Level 2: 3'],
      ['Excluded with a reason', '1'],
      ['Significance level α', '0.05, shared among 2 materials (α/ℓ = 0.025 for each upper verification limit)'],
      ['CIs of the SDs', '95%, two-sided, from the χ² distribution'],
      ['Engine version', '1.3.0'],
    ]);
    expect(designRows(precisionResult([LEVEL_1]))[1]).toEqual(['Results analysed (N)', '9']);
    expect(designRows(precisionResult([LEVEL_1]))[4]).toEqual(['Significance level α', '0.05']);
  });
});
