import { expect, test, type Page } from '@playwright/test';
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { choose, closeNotice, SCREENSHOTS, signIn } from './fixtures/pages';

/** 45 invented glucose pairs (mmol/L) as a CSV whose label column is headed "Individual". */
function pairsFile(): { name: string; mimeType: string; buffer: Buffer } {
  const lines = ['Individual,Current analyzer,New analyzer,Comment'];
  for (let i = 0; i < 45; i++) {
    const x = 3 + (i * 17) / 45;
    lines.push(`IM-${String(i + 1).padStart(3, '0')},${x.toFixed(1)},${(x * 1.01 + 0.05).toFixed(1)},`);
  }
  return { name: 'line-2-run.csv', mimeType: 'text/csv', buffer: Buffer.from(`${lines.join('\n')}\n`) };
}

async function openImport(page: Page): Promise<void> {
  await page.getByTestId('upload-open').click();
  await page.getByTestId('upload-file').setInputFiles(pairsFile());
  await expect(page.getByTestId('upload-summary')).toContainText('line-2-run.csv: 45 rows, 4 columns.');
}

test('importing the same file twice warns of the repeated labels and suggests replacing the rows', async ({ page }) => {
  test.setTimeout(120_000);
  mkdirSync(SCREENSHOTS, { recursive: true });
  await signIn(page);
  await page.getByTestId('nav-studies').click();
  await page.getByTestId('study-new').click();
  await page.getByTestId('setup-title').fill(`Glucose: import check (${Date.now()})`);
  await choose(page, page.getByTestId('setup-analyte'), /^Glucose \(mmol\/L\)/);
  await choose(page, page.getByTestId('setup-comparative'), 'Chemistry line 1');
  await choose(page, page.getByTestId('setup-candidate'), 'Chemistry line 2');
  await page.getByTestId('setup-save').click();
  await expect(page).toHaveURL(/\/studies\/\d+\/specimens$/);

  // The first import: "Individual" is taken for the label, nothing is repeated, and an empty grid is replaced.
  await openImport(page);
  await expect(page.getByTestId('map-label')).toContainText('Individual');
  await expect(page.getByTestId('upload-warnings')).toHaveCount(0);
  await expect(page.getByTestId('mode-replace').locator('input')).toBeChecked();
  await page.getByTestId('upload-import').click();
  await expect(page.getByTestId('row-count')).toHaveText('45 rows');
  await closeNotice(page);

  // The same file again: the preview names the repeats and suggests replacing instead of adding after the rows.
  await openImport(page);
  await expect(page.getByTestId('upload-warnings')).toHaveText('warning_amber 45 rows repeat labels already in the study (IM-001, IM-002, IM-003, IM-004, IM-005 and 40 more)');
  await expect(page.getByTestId('repeat-advice')).toBeVisible();
  await expect(page.getByTestId('mode-replace').locator('input')).toBeChecked();
  // A notice that came up meanwhile is dismissed by its own button (the dialog's backdrop covers the page).
  const notice = page.locator('mat-snack-bar-container');
  if (await notice.count()) await notice.getByRole('button').dispatchEvent('click');
  await expect(notice).toHaveCount(0);
  const dialog = page.locator('mat-dialog-container');
  await dialog.screenshot({ path: path.join(SCREENSHOTS, 'import-preview-repeats.png') });
  // What the shot shows: the dialog's title, the file's 45 rows, the repeats named and replacing chosen.
  await expect(dialog.getByRole('heading', { level: 2 })).toHaveText('Import specimen results from a file');
  await expect(page.getByTestId('upload-summary')).toContainText(': 45 rows,');
  await expect(page.getByTestId('upload-warnings')).toContainText('45 rows repeat labels already in the study');
  await page.getByTestId('repeat-advice').scrollIntoViewIfNeeded();
  await dialog.screenshot({ path: path.join(SCREENSHOTS, 'import-preview-repeats-mode.png') });
  await expect(page.getByTestId('repeat-advice')).toBeInViewport();
  await expect(page.getByTestId('repeat-advice')).toHaveText(/^The file repeats most of the study's labels, so it looks like the same rows again: replacing them is suggested\./);
  await expect(page.getByTestId('mode-replace').locator('input')).toBeChecked();
  await expect(page.getByTestId('replace-warning')).toHaveText("This replaces the 45 rows now in the grid (the change is kept in the study's history).");

  // Choosing the label column away says the rows would come in unlabelled.
  await choose(page, page.getByTestId('map-label'), '— none —');
  await expect(page.getByTestId('upload-warnings')).toContainText('Not mapped: specimen label — no column of the file is chosen for it; the rows come in unlabelled');
});
