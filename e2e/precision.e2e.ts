import { expect, test, type Page } from '@playwright/test';
import { execFileSync } from 'node:child_process';
import { mkdirSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';
import { precisionRuns } from '../server/kinds/precision/runs';
import { cell, choose, closeNotice, fullShot, SCREENSHOTS, signIn } from './fixtures/pages';

const OUT = path.resolve(__dirname, '../.test-output');
const DAYS = ['2026-11-16', '2026-11-17', '2026-11-18', '2026-11-19', '2026-11-20'];

/**
 * The invented runs of the demo (server/kinds/precision/demo.ts), pasted as a technologist copies them from a
 * spreadsheet: one line per material and day, one column per replicate. The low control verifies both claims;
 * the high control's within-laboratory CV lies above its claim and under the upper verification limit.
 */
function wideBlock(): string {
  const rows = [
    ...precisionRuns('vh-prec-low', 'Control 1 (low)', DAYS, 5, 5.42, 0.06, 0.03, 2),
    ...precisionRuns('vh-prec-high', 'Control 2 (high)', DAYS, 5, 16.8, 0.15, 0.2, 2),
  ];
  const lines = ['Material\tDay\tRep 1\tRep 2\tRep 3\tRep 4\tRep 5'];
  for (let k = 0; k < rows.length; k += 5) lines.push([rows[k].material, rows[k].day, ...rows.slice(k, k + 5).map((r) => r.value)].join('\t'));
  return `${lines.join('\n')}\n`;
}

async function fillMaterial(page: Page, index: number, m: { name: string; as: RegExp; repeatability: string; withinLab: string; assigned?: string; uncertainty?: string }) {
  const block = page.getByTestId(`material-${index}`);
  await block.getByTestId('material-name').fill(m.name);
  await choose(page, block.getByTestId('material-claim-as'), m.as);
  await block.getByTestId('material-claim-repeatability').fill(m.repeatability);
  await block.getByTestId('material-claim-within-lab').fill(m.withinLab);
  if (m.assigned) await block.getByTestId('material-assigned-value').fill(m.assigned);
  if (m.uncertainty) await block.getByTestId('material-assigned-uncertainty').fill(m.uncertainty);
}

test.beforeEach(async ({ context, baseURL }) => {
  mkdirSync(SCREENSHOTS, { recursive: true });
  await context.grantPermissions(['clipboard-read', 'clipboard-write'], { origin: baseURL });
});

test('a technologist verifies precision on two controls and the director signs it; the PDF says the verdicts', async ({ page, browser }) => {
  test.setTimeout(240_000);
  await signIn(page);
  const title = `Glucose precision, two controls (${Date.now()})`;
  await page.getByTestId('nav-studies').click();
  await page.getByTestId('study-new').click();
  await page.getByTestId('setup-title').fill(title);
  await choose(page, page.getByTestId('setup-kind'), /Precision verification/);
  await choose(page, page.getByTestId('setup-analyte'), /^Glucose/);
  await choose(page, page.getByTestId('setup-instrument'), 'Chemistry line 2');
  await expect(page.getByTestId('setup-days')).toHaveValue('5');
  await expect(page.getByTestId('setup-replicates')).toHaveValue('5');
  await expect(page.getByTestId('setup-alpha')).toHaveValue('0.05');
  await page.getByTestId('setup-reagent-lot').fill('GLU-4502');
  await page.getByTestId('setup-control-lot').fill('QC-GL-118');
  await page.locator('input[formcontrolname="decimals"]').fill('2');
  // A within-laboratory claim below the repeatability claim is refused under its field, in the schema's words.
  await fillMaterial(page, 1, { name: 'Control 1 (low)', as: /SDs/, repeatability: '0.08', withinLab: '0.05' });
  await page.getByTestId('setup-save').click();
  await expect(page.getByTestId('material-1')).toContainText('The within-laboratory claim cannot be smaller than the repeatability claim');
  await fillMaterial(page, 1, { name: 'Control 1 (low)', as: /SDs/, repeatability: '0.08', withinLab: '0.12', assigned: '5.40', uncertainty: '0.05' });
  await page.getByTestId('material-add').click();
  await fillMaterial(page, 2, { name: 'Control 2 (high)', as: /CVs/, repeatability: '1.0', withinLab: '1.4' });
  await fullShot(page, 'precision-setup.png');
  await expect(page.getByTestId('material-1')).not.toContainText('cannot be smaller');
  await expect(page.getByTestId('material-2')).toBeVisible();
  await expect(page.getByTestId('setup-control-lot')).toHaveValue('QC-GL-118');
  await page.getByTestId('setup-save').click();
  await expect(page).toHaveURL(/\/studies\/\d+\/specimens$/);
  await expect(page.getByTestId('study-title')).toHaveText(title);

  // One line per material and day, a column per replicate: the grid takes it as 50 rows of one result each.
  await page.evaluate((text) => navigator.clipboard.writeText(text), wideBlock());
  await cell(page, 0, 'material').click();
  await page.keyboard.press('Control+V');
  await expect(page.getByTestId('row-count')).toHaveText('50 rows');
  await expect(page.getByTestId('save-state')).toHaveText('Saved', { timeout: 20_000 });
  await expect(cell(page, 0, 'material')).toHaveText('Control 1 (low)');
  await expect(cell(page, 6, 'day')).toHaveText('2026-11-17');
  await expect(cell(page, 6, 'replicate')).toHaveText('2');
  await closeNotice(page);
  await page.screenshot({ path: path.join(SCREENSHOTS, 'precision-specimens.png') });
  await expect(page.getByTestId('row-count')).toHaveText('50 rows');
  await expect(page.getByTestId('save-state')).toHaveText('Saved');
  await expect(page.getByTestId('problems')).toHaveCount(0);

  await page.getByTestId('tab-findings').click();
  await page.getByTestId('run-analysis').click();
  await expect(page.getByTestId('precision-overall')).toBeVisible({ timeout: 120_000 });
  await expect(page.getByTestId('verdict-repeatability-0')).toContainText(/Repeatability verified/);
  await expect(page.getByTestId('verdict-withinLab-0')).toContainText(/verified/);
  await expect(page.getByTestId('verdict-withinLab-1')).toContainText(/consistent with the claim/);
  await expect(page.getByTestId('verdict-trueness-0')).toContainText('Trueness verified: the mean 5.416 mmol/L lies within the verification interval 5.282 to 5.518 mmol/L');
  await expect(page.getByTestId('precision-overall')).toHaveText('4 claims over 2 materials: 3 verified, 1 consistent with the claim, 0 not verified. Trueness verified for 1 of 1 material with an assigned value.');
  await expect(page.getByTestId('run-state')).toContainText('no resampling');
  await expect(page.getByTestId('caution')).toContainText('Decision support only');
  await expect(page.getByTestId('plot-days-1')).toBeVisible();
  await fullShot(page, 'precision-findings.png');
  await expect(page.getByTestId('precision-overall')).toHaveText('4 claims over 2 materials: 3 verified, 1 consistent with the claim, 0 not verified. Trueness verified for 1 of 1 material with an assigned value.');
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
  await expect(director.getByTestId('verdict-withinLab-1')).toContainText(/consistent with the claim/, { timeout: 20_000 });
  await expect(director.getByTestId('review-caution')).toContainText('Decision support only');
  await expect(director.getByTestId('review-analysis')).toContainText('no resampling');
  await fullShot(director, 'precision-review.png');
  await expect(director.getByTestId('review-state')).toContainText('Awaiting sign-off');
  await expect(director.getByTestId('precision-overall')).toHaveText('4 claims over 2 materials: 3 verified, 1 consistent with the claim, 0 not verified. Trueness verified for 1 of 1 material with an assigned value.');
  await expect(director.getByTestId('review-caution')).toContainText('Decision support only');
  await director.getByTestId('open-sign').click();
  const dialog = director.getByRole('dialog');
  await dialog.getByTestId('meaning-accepted').click();
  await dialog.getByTestId('sign-comment').fill('Both claims verified on the low control; the high control is consistent with its within-laboratory claim.');
  await dialog.getByTestId('sign-password').fill('parallax-demo');
  await dialog.getByTestId('sign-confirm').click();
  await expect(dialog).toHaveCount(0);
  await expect(director.getByTestId('review-state')).toContainText('Signed');

  const block = director.getByTestId('signature-block');
  const [download] = await Promise.all([director.waitForEvent('download'), block.getByTestId('download-signed-pdf').click()]);
  mkdirSync(path.join(OUT, 'downloads'), { recursive: true });
  const file = path.join(OUT, 'downloads', `precision-${id}.pdf`);
  await download.saveAs(file);
  expect(statSync(file).size).toBeGreaterThan(10_000);
  const text = execFileSync('pdftotext', ['-layout', file, '-'], { encoding: 'utf8' }).replace(/\s+/g, ' ');
  expect(text).toContain('Precision verification: study report');
  expect(text).toContain('Control 2 (high)');
  expect(text).toMatch(/consistent with the claim/i);
  expect(text).toContain('Decision support only');
  expect(text).toContain('Dr. Imani Okafor');
  execFileSync('pdftoppm', ['-png', '-r', '70', file, path.join(SCREENSHOTS, 'precision-report-page')]);
  expect(readdirSync(SCREENSHOTS).filter((f) => /^precision-report-page-0*1\.png$/.test(f))).toHaveLength(1);
  await context.close();
});
