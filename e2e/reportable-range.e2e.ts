import { expect, test } from '@playwright/test';
import { execFileSync } from 'node:child_process';
import { mkdirSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';
import { RANGE_DEMO_ROWS } from '@shared/kinds/reportable-range/demo-data';
import { cell, choose, closeNotice, fullShot, SCREENSHOTS, signIn } from './fixtures/pages';

const OUT = path.resolve(__dirname, '../.test-output');

/**
 * The invented results of the demo (server/kinds/reportable-range/demo.ts: nine mixtures of a low and a high glucose
 * pool, the top one bending off the line), pasted as a technologist copies them from a spreadsheet: one line per
 * level, one column per replicate.
 */
function wideBlock(): string {
  const rows = RANGE_DEMO_ROWS;
  const lines = ['Level\tRep 1\tRep 2'];
  for (let k = 0; k < rows.length; k += 2) lines.push([rows[k].level, rows[k].value, rows[k + 1].value].join('\t'));
  return `${lines.join('\n')}\n`;
}

test.beforeEach(async ({ context, baseURL }) => {
  mkdirSync(SCREENSHOTS, { recursive: true });
  await context.grantPermissions(['clipboard-read', 'clipboard-write'], { origin: baseURL });
});

test('a technologist verifies the reportable range on nine mixtures and the director signs it; the PDF says the range ends one level short', async ({ page, browser }) => {
  test.setTimeout(240_000);
  await signIn(page);
  const title = `Glucose reportable range, nine mixtures (${Date.now()})`;
  await page.getByTestId('nav-studies').click();
  await page.getByTestId('study-new').click();
  await page.getByTestId('setup-title').fill(title);
  await choose(page, page.getByTestId('setup-kind'), /Reportable range/);
  await choose(page, page.getByTestId('setup-analyte'), /^Glucose/);
  await choose(page, page.getByTestId('setup-instrument'), 'Chemistry line 2');
  await expect(page.getByTestId('setup-replicates')).toHaveValue('2');
  await expect(page.getByTestId('setup-alpha')).toHaveValue('0.05');
  await expect(page.getByText('Confidence level of the deviations')).toBeVisible();
  await page.locator('input[formcontrolname="decimals"]').fill('2');
  await page.getByTestId('setup-claimed-low').fill('0.3');
  await page.getByTestId('setup-claimed-high').fill('32');
  // The pools in the wrong order are refused under the field, in the schema's words.
  await page.getByTestId('setup-pool-low').fill('32.3');
  await page.getByTestId('setup-pool-high').fill('0.3');
  await page.getByTestId('level-even-count').fill('9');
  await page.getByTestId('level-fill-even').click();
  await page.getByTestId('setup-nonlinearity').fill('0.5');
  await page.getByTestId('setup-nonlinearity-percent').fill('1.5');
  await page.getByTestId('setup-nonlinearity-source').fill('Laboratory quality goal for glucose linearity, set by the director (invented)');
  await page.getByTestId('setup-save').click();
  await expect(page.getByText('The high pool\'s value must be above the low pool\'s')).toBeVisible();
  await page.getByTestId('setup-pool-low').fill('0.3');
  await page.getByTestId('setup-pool-high').fill('32.3');
  await expect(page.getByTestId('level-9').getByTestId('level-fraction')).toHaveValue('1');
  await expect(page.getByTestId('level-2').getByTestId('level-pooled')).toContainText('4.3');
  await fullShot(page, 'range-setup.png');
  await expect(page.getByText('The high pool\'s value must be above the low pool\'s')).toHaveCount(0);
  await expect(page.getByTestId('level-9').getByTestId('level-fraction')).toHaveValue('1');
  await expect(page.getByTestId('setup-nonlinearity-source')).toHaveValue('Laboratory quality goal for glucose linearity, set by the director (invented)');
  await page.getByTestId('setup-save').click();
  await expect(page).toHaveURL(/\/studies\/\d+\/specimens$/);
  await expect(page.getByTestId('study-title')).toHaveText(title);

  // One line per level, a column per replicate: the grid takes it as 18 rows of one result each.
  await page.evaluate((text) => navigator.clipboard.writeText(text), wideBlock());
  await cell(page, 0, 'level').click();
  await page.keyboard.press('Control+V');
  await expect(page.getByTestId('row-count')).toHaveText('18 rows');
  await expect(page.getByTestId('save-state')).toHaveText('Saved', { timeout: 20_000 });
  await expect(cell(page, 0, 'level')).toHaveText('Level 1');
  await expect(cell(page, 17, 'level')).toHaveText('Level 9');
  await expect(cell(page, 17, 'replicate')).toHaveText('2');
  await closeNotice(page);
  await page.screenshot({ path: path.join(SCREENSHOTS, 'range-specimens.png') });
  await expect(page.getByTestId('row-count')).toHaveText('18 rows');
  await expect(page.getByTestId('save-state')).toHaveText('Saved');
  await expect(page.getByTestId('problems')).toHaveCount(0);

  await page.getByTestId('tab-findings').click();
  await page.getByTestId('run-analysis').click();
  await expect(page.getByTestId('range-verdict')).toBeVisible({ timeout: 120_000 });
  await expect(page.getByTestId('range-verdict')).toHaveText(/Reportable range shortened$/);
  await expect(page.getByTestId('range-sentence')).toHaveText('Shortened: the deviation from linearity exceeds the allowable nonlinearity at level "Level 9"; the reportable range is verified only from 0.30 to 28.30 mmol/L (levels "Level 1" to "Level 8"). It does not reach the claimed high end (32.00 mmol/L).');
  await expect(page.getByTestId('caution')).toContainText('Decision support only');
  await expect(page.getByTestId('plot-linearity')).toBeVisible();
  await expect(page.getByTestId('track-levels.8').getByTestId('judgement')).toHaveText('Beyond the goal');
  await expect(page.getByTestId('track-levels.8')).toHaveAttribute('data-within', 'false');
  await expect(page.getByTestId('track-levels.7').getByTestId('judgement')).toHaveText(/^Within/);
  await expect(page.getByTestId('fit-3')).toContainText('Best fit');
  await fullShot(page, 'range-findings.png');
  await expect(page.getByTestId('range-verdict')).toHaveText(/Reportable range shortened$/);
  await expect(page.getByTestId('range-sentence')).toContainText('the reportable range is verified only from 0.30 to 28.30 mmol/L');
  await expect(page.getByTestId('caution')).toContainText('Decision support only');

  // Submit, then the director signs on the review page.
  await page.getByTestId('step-submit').click();
  await page.getByRole('dialog').getByTestId('submit-confirm').click();
  await expect(page.getByTestId('study-state')).toHaveText('Awaiting sign-off');
  const id = /\/studies\/(\d+)/.exec(page.url())![1];
  const context = await browser.newContext({ viewport: { width: 1366, height: 768 }, acceptDownloads: true });
  const director = await context.newPage();
  await signIn(director, 'director@valeharbor.example');
  await director.goto(`/studies/${id}/review`);
  await expect(director.getByTestId('review-title')).toHaveText(title);
  await expect(director.getByTestId('range-sentence')).toContainText('verified only from 0.30 to 28.30 mmol/L', { timeout: 20_000 });
  await expect(director.getByTestId('review-caution')).toContainText('Decision support only');
  await fullShot(director, 'range-review.png');
  await expect(director.getByTestId('review-state')).toContainText('Awaiting sign-off');
  await expect(director.getByTestId('range-verdict')).toHaveText(/Reportable range shortened$/);
  await expect(director.getByTestId('range-sentence')).toContainText('verified only from 0.30 to 28.30 mmol/L');
  await director.getByTestId('open-sign').click();
  const dialog = director.getByRole('dialog');
  await dialog.getByTestId('meaning-accepted').click();
  await dialog.getByTestId('sign-comment').fill('Reportable range accepted from 0.30 to 28.30 mmol/L; results above are reported after dilution.');
  await dialog.getByTestId('sign-password').fill('parallax-demo');
  await dialog.getByTestId('sign-confirm').click();
  await expect(dialog).toHaveCount(0);
  await expect(director.getByTestId('review-state')).toContainText('Signed');

  const block = director.getByTestId('signature-block');
  const [download] = await Promise.all([director.waitForEvent('download'), block.getByTestId('download-signed-pdf').click()]);
  mkdirSync(path.join(OUT, 'downloads'), { recursive: true });
  const file = path.join(OUT, 'downloads', `range-${id}.pdf`);
  await download.saveAs(file);
  expect(statSync(file).size).toBeGreaterThan(10_000);
  const text = execFileSync('pdftotext', ['-layout', file, '-'], { encoding: 'utf8' }).replace(/\s+/g, ' ');
  expect(text).toContain('Reportable range verification: study report');
  expect(text).toContain('verified only from 0.30 to 28.30 mmol/L');
  expect(text).toContain('Laboratory quality goal for glucose linearity, set by the director (invented)');
  expect(text).toContain('Decision support only');
  expect(text).toContain('Dr. Imani Okafor');
  execFileSync('pdftoppm', ['-png', '-r', '70', file, path.join(SCREENSHOTS, 'range-report-page')]);
  expect(readdirSync(SCREENSHOTS).filter((f) => /^range-report-page-0*1\.png$/.test(f))).toHaveLength(1);
  await context.close();
});
