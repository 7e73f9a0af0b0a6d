import { expect, test } from '@playwright/test';
import { mkdirSync } from 'node:fs';
import { choose, closeNotice, fullShot, SCREENSHOTS, shoot, signIn } from './fixtures/pages';

/** Waits for fonts and animations, then photographs one element. */
async function shootElement(page: import('@playwright/test').Page, testId: string, name: string): Promise<void> {
  await page.evaluate(async () => {
    await document.fonts.ready;
    await Promise.all(document.getAnimations().map((a) => a.finished.catch(() => undefined)));
  });
  await page.getByTestId(testId).screenshot({ path: `${SCREENSHOTS}/${name}.png` });
}

test('the regression reads as how the candidate reads across the range: slope and offset in words, linearity named, r as details', async ({ page }) => {
  mkdirSync(SCREENSHOTS, { recursive: true });
  await signIn(page);
  await page.getByTestId('nav-studies').click();
  await page.getByRole('link', { name: 'Glucose: Chemistry line 2 against line 1' }).first().click();
  await page.getByTestId('tab-findings').click();
  const section = page.getByTestId('regression-section');
  await expect(section.getByRole('heading')).toHaveText('How the candidate reads across the range', { timeout: 30_000 });
  await expect(page.getByTestId('regression-method')).toHaveText(/^Passing–Bablok regression of the candidate \(y\) on the comparative method \(x\); 95% CIs of slope and intercept: rank-based/);
  await expect(page.getByTestId('regression-slope')).toContainText(/The candidate reads (neither higher nor lower|[0-9.]+% (higher|lower)) per unit \(slope [0-9.]+, 95% CI/);
  await expect(page.getByTestId('regression-intercept')).toContainText(/At zero the candidate reads .*\(intercept .*mmol\/L, 95% CI .* mmol\/L\)\. The CI (includes|excludes) 0/);
  await expect(page.getByTestId('regression-linearity')).toContainText('The cusum test for linearity of Passing–Bablok');
  await expect(page.getByTestId('regression-details')).toHaveText(/^Details: Pearson r = [0-9.]+, for reference only/);
  await closeNotice(page);
  await section.scrollIntoViewIfNeeded();
  await shootElement(page, 'regression-section', 'regression-section');
  await expect(section.getByRole('heading')).toHaveText('How the candidate reads across the range');
  await expect(page.getByTestId('regression-linearity')).toContainText('The cusum test for linearity of Passing–Bablok');
  await fullShot(page, 'findings-regression-words.png');
  await expect(page.getByTestId('verdict-panel')).toBeVisible();
  await expect(page.getByTestId('caution')).toContainText('Decision support only');
  await expect(page.getByTestId('regression-slope')).toContainText(/per unit \(slope [0-9.]+, 95% CI/);
});

test('a verification asks for its reference population, counts the characters and names the limit when it is passed', async ({ page }) => {
  mkdirSync(SCREENSHOTS, { recursive: true });
  await signIn(page);
  await page.getByTestId('nav-studies').click();
  await page.getByTestId('study-new').click();
  await page.getByTestId('setup-title').fill(`Potassium: reference population (${Date.now()})`);
  await choose(page, page.getByTestId('setup-kind'), /Reference interval: verify/);
  const population = page.getByTestId('setup-population');
  await population.fill('Healthy adult blood donors, 18–65 y, Vale Harbor catchment (invented)');
  const field = page.locator('mat-form-field', { has: population });
  await expect(field).toContainText('Reference population');
  await expect(field).toContainText('69 / 2000');
  await page.locator('#setup-local-population').scrollIntoViewIfNeeded();
  await shoot(page, 'setup-reference-population');
  await expect(field).toContainText('69 / 2000');
  await expect(population).toHaveValue('Healthy adult blood donors, 18–65 y, Vale Harbor catchment (invented)');
  await population.fill('x'.repeat(2001));
  await population.blur();
  await expect(field.locator('mat-error')).toHaveText('Keep the description of the reference population to 2,000 characters');
});
