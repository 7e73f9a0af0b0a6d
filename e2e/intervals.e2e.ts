import { expect, test, type Locator, type Page } from '@playwright/test';
import { CAUTION } from '@shared/text/caution';
import { cell, choose, closeNotice, fullShot, SCREENSHOTS, signIn } from './fixtures/pages';
import { execFileSync } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';

/** A small seeded generator (an LCG) so the invented values are the same on every run. */
function seeded(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
    return (state + 0.5) / 2 ** 32;
  };
}

/**
 * 120 invented creatinine values (µmol/L), log-normal: women around a median of 68, men around 72, both with
 * a geometric SD of about 1.15, alternating F and M. Whole numbers, as the analyser reports them.
 */
function inventedReferenceValues(): string {
  const random = seeded(20261202);
  const lines = ['Individual\tValue\tSex'];
  for (let i = 0; i < 120; i++) {
    const sex = i % 2 === 0 ? 'F' : 'M';
    const normal = Math.sqrt(-2 * Math.log(random())) * Math.cos(2 * Math.PI * random());
    const value = Math.round(Math.exp(Math.log(sex === 'F' ? 68 : 72) + 0.14 * normal));
    lines.push(`RI-${String(i + 1).padStart(3, '0')}\t${value}\t${sex}`);
  }
  return `${lines.join('\r\n')}\r\n`;
}

/** 20 invented potassium values (mmol/L) spread over 3.6–5.0, and row 13 at 5.4: one outside a stated 3.5–5.1. */
function inventedVerificationValues(): string {
  const values = Array.from({ length: 20 }, (_, i) => (i === 12 ? 5.4 : 3.6 + ((i * 7) % 20) * 0.07));
  return `${values.map((v, i) => `RV-${String(i + 1).padStart(2, '0')}\t${v.toFixed(1)}`).join('\n')}\n`;
}

/** New study → kind → title and analyte; the kind's own fields are filled by the caller. */
async function startStudy(page: Page, kind: RegExp, title: string, analyte: RegExp): Promise<void> {
  await page.getByTestId('nav-studies').click();
  await page.getByTestId('study-new').click();
  await page.getByTestId('setup-title').fill(title);
  await choose(page, page.getByTestId('setup-kind'), kind);
  await choose(page, page.getByTestId('setup-analyte'), analyte);
}

/** Pastes a block with a real Ctrl+V at the first cell and waits until it is saved. */
async function pasteRows(page: Page, block: string, count: number): Promise<void> {
  await page.evaluate((text) => navigator.clipboard.writeText(text), block);
  await cell(page, 0, 'label').click();
  await page.keyboard.press('Control+V');
  await expect(page.getByTestId('row-count')).toHaveText(`${count} rows`);
  await expect(page.getByTestId('save-state')).toHaveText('Saved', { timeout: 20_000 });
  await expect(page.getByTestId('study-n')).toHaveText(`n = ${count}`);
}

async function runAnalysis(page: Page): Promise<void> {
  await closeNotice(page);
  await page.getByTestId('tab-findings').click();
  await expect(page.getByTestId('caution').locator('span')).toHaveText(CAUTION);
  await page.getByTestId('run-analysis').click();
}

async function expectPainted(canvas: Locator): Promise<void> {
  await expect(canvas).toBeVisible();
  const inked = await canvas.evaluate((c: HTMLCanvasElement) => {
    const data = c.getContext('2d')!.getImageData(0, 0, c.width, c.height).data;
    let n = 0;
    for (let i = 3; i < data.length; i += 4) if (data[i] > 0) n++;
    return n;
  });
  expect(inked).toBeGreaterThan(1000);
}

test.beforeEach(async ({ context, baseURL }) => {
  mkdirSync(SCREENSHOTS, { recursive: true });
  await context.grantPermissions(['clipboard-read', 'clipboard-write'], { origin: baseURL });
});

test('a technologist establishes a creatinine reference interval from 120 individuals, tested for a partition by sex', async ({ page }) => {
  test.setTimeout(180_000);
  await signIn(page);
  const title = `Creatinine reference interval, adults (${Date.now()})`;
  await startStudy(page, /Reference interval: establish/, title, /^Creatinine/);
  await expect(page.getByTestId('setup-level')).toContainText('90 %');
  await expect(page.getByTestId('setup-percentiles')).toContainText('2.5th and 97.5th');
  await expect(page.getByTestId('setup-method-text')).toContainText('at least 120');
  await expect(page.getByTestId('setup-acceptance')).toHaveValue(/^At least 120 reference individuals per partition/);
  await expect(page.getByTestId('setup-planned')).toHaveValue('120');
  // The establishment's own guidance (DOMAIN.md: 120 per partition), and only the bootstrap settings it reads.
  await expect(page.getByTestId('setup-planned-hint')).toHaveText(
    'At least 120 healthy reference individuals per partition (CLSI EP28-A3c practice); a sex or age band with limits of its own needs its 120.',
  );
  await expect(page.getByTestId('setup-analyte-hint')).toHaveText('Brings its unit and decimals; you may change them for this study.');
  await expect(page.getByTestId('setup-resamples')).toBeVisible();
  await expect(page.getByTestId('setup-interval')).toHaveCount(0);
  await choose(page, page.getByTestId('setup-instrument'), 'Chemistry line 2');
  await page.getByTestId('setup-reagent-lot').fill('CRE-0912');

  // The population description is required: saving without it is refused in words.
  await page.getByTestId('setup-save').click();
  await expect(page.getByText('Check the marked fields.')).toBeVisible();
  await page.getByTestId('setup-population').fill('Healthy adult blood donors aged 18–65, fasting; excluded: known kidney disease, pregnancy, nephrotoxic drugs.');
  await page.getByTestId('setup-partition-sex').locator('input').check();
  await fullShot(page, 'interval-establish-setup.png');
  await expect(page.getByTestId('setup-population')).toHaveValue(/^Healthy adult blood donors aged 18–65, fasting;/);
  await expect(page.getByTestId('setup-partition-sex').locator('input')).toBeChecked();
  await page.getByTestId('setup-save').click();
  await expect(page).toHaveURL(/\/studies\/\d+\/specimens$/);
  await expect(page.getByTestId('study-title')).toHaveText(title);

  await pasteRows(page, inventedReferenceValues(), 120);
  await expect(cell(page, 0, 'sex')).toHaveText('F');
  await expect(cell(page, 1, 'sex')).toHaveText('M');
  await closeNotice(page);
  await page.screenshot({ path: path.join(SCREENSHOTS, 'interval-establish-specimens.png') });
  await expect(page.getByTestId('row-count')).toHaveText('120 rows');
  await expect(page.getByTestId('problems')).toHaveCount(0);

  await runAnalysis(page);
  await expect(page.getByTestId('interval-limits')).toBeVisible({ timeout: 120_000 });
  await expect(page.getByTestId('interval-counts')).toHaveText('n = 120 analysed of 120 entered; 0 excluded with a reason.');
  await expect(page.getByTestId('limits-lower')).toContainText('2.5th');
  await expect(page.getByTestId('limits-upper')).toContainText('97.5th');
  // Both limits are numbers within the invented range, each with a rank-based and a bootstrap CI.
  for (const id of ['limits-lower', 'limits-upper']) {
    const cells = await page.getByTestId(id).locator('td').allTextContents();
    expect(Number(cells[1])).toBeGreaterThan(40);
    expect(Number(cells[1])).toBeLessThan(110);
    expect(cells[2]).toMatch(/^\d+\.\d to \d+\.\d$/);
    expect(cells[3]).toMatch(/^\d+\.\d to \d+\.\d$/);
  }
  await expect(page.getByTestId('interval-method')).toContainText('Nonparametric');
  await expect(page.getByTestId('partition-sex')).toHaveText(/^By sex: (separate intervals recommended|one common interval is enough) \(z = /);
  await expect(page.getByTestId('outliers')).toBeVisible();
  await expectPainted(page.getByTestId('plot-values').locator('canvas'));
  await expect(page.getByTestId('plot-values').locator('figcaption')).toContainText('Light bars lie beyond a limit.');
  await fullShot(page, 'interval-establish.png');
  await expect(page.getByTestId('caution')).toContainText('Decision support only');
  await expect(page.getByTestId('interval-counts')).toHaveText('n = 120 analysed of 120 entered; 0 excluded with a reason.');
  await expect(page.getByTestId('study-findings')).toHaveText('Findings up to date');

  // Whole-number results, binned at half-steps of 1 µmol/L (shared/types/plot-axes.ts): bars of equal width
  // standing evenly from the lowest value to the highest. Hovering the tallest names its values, its count and who they are.
  const histogram = page.getByTestId('plot-values').locator('canvas');
  await histogram.scrollIntoViewIfNeeded();
  await expect(histogram).toHaveAttribute('data-bars', /\[\[/);
  const bars = JSON.parse((await histogram.getAttribute('data-bars'))!) as [number, number, number][];
  expect(bars.length).toBeGreaterThanOrEqual(8);
  const gaps = bars.slice(1).map((b, k) => b[1] - bars[k][1]);
  expect(Math.max(...gaps) - Math.min(...gaps)).toBeLessThan(1); // equal widths: the bars stand evenly
  const tallest = bars.reduce((top, b) => (b[2] < top[2] ? b : top));
  await histogram.hover({ position: { x: tallest[1], y: tallest[2] } });
  const barTip = page.getByTestId('plot-values').getByTestId('plot-tip');
  await expect(barTip).toBeVisible();
  await expect(barTip.locator('strong')).toHaveText(/^\d+( to \d+)? µmol\/L$/);
  await expect(barTip).toContainText(/\d+ individuals/);
  await expect(barTip).toContainText(/RI-\d{3} \(row \d+\)/);
  await page.getByTestId('plot-values').screenshot({ path: path.join(SCREENSHOTS, 'interval-establish-histogram.png') });
  await expect(barTip).toBeVisible();
  await expect(barTip).toContainText(/\d+ individuals/);
  await page.mouse.move(0, 0);

  // One click on a flagged value asks for the reason, excludes the row, and a new run analyses 119.
  const flagged = page.locator('[data-testid^="exclude-"]').first();
  const position = Number((await flagged.getAttribute('data-testid'))!.replace('exclude-', ''));
  await flagged.click();
  await page.getByTestId('exclude-confirm').click();
  await expect(page.locator('mat-dialog-container mat-error')).toContainText('reason');
  await page.getByTestId('exclude-reason').fill('Donor reported strenuous exercise the day before sampling');
  await page.getByTestId('exclude-confirm').click();
  await expect(page.getByTestId(`outlier-${position}`)).toContainText('Excluded; run again to update');
  await expect(page.getByTestId('study-n')).toHaveText('n = 119', { timeout: 20_000 });
  await page.getByTestId('rerun').click();
  await expect(page.getByTestId('interval-counts')).toHaveText('n = 119 analysed of 120 entered; 1 excluded with a reason.', { timeout: 120_000 });
});

const SOURCE = "Manufacturer's insert for the potassium reagent, edition 2026-03";

test('a technologist verifies a stated potassium interval with 20 individuals, one outside', async ({ page }) => {
  test.setTimeout(120_000);
  await signIn(page);
  const title = `Potassium: transference of the stated interval (${Date.now()})`;
  await startStudy(page, /Reference interval: verify/, title, /^Potassium/);
  await expect(page.getByTestId('setup-acceptance')).toHaveValue(/at most 2 of 20/);
  // The verification's own guidance (DOMAIN.md: 20 individuals, at most 2 outside), and no bootstrap settings: the count uses none.
  await expect(page.getByTestId('setup-planned-hint')).toHaveText(
    '20 local healthy individuals; the stated interval is accepted when at most 2 of them fall outside it (CLSI EP28-A3c practice).',
  );
  await expect(page.getByTestId('setup-planned')).toHaveValue('20');
  await expect(page.getByTestId('setup-bootstrap')).toHaveCount(0);
  await expect(page.getByTestId('setup-level')).toHaveCount(0);
  await expect(page.getByTestId('setup-seed')).toHaveCount(0);
  await expect(page.getByTestId('setup-analysis-note')).toContainText('there is no bootstrap');
  await choose(page, page.getByTestId('setup-instrument'), 'Chemistry line 2');
  await page.getByTestId('setup-stated-lower').fill('3.5');
  await page.getByTestId('setup-stated-upper').fill('5.1');
  await fullShot(page, 'setup-verification-guidance.png');
  await expect(page.getByTestId('setup-planned')).toHaveValue('20');
  await expect(page.getByTestId('setup-stated-lower')).toHaveValue('3.5');
  await expect(page.getByTestId('setup-stated-upper')).toHaveValue('5.1');
  await page.getByTestId('setup-save').click();
  await expect(page.getByText('Check the marked fields.')).toBeVisible();
  await page.getByTestId('setup-stated-source').fill(SOURCE);
  await page.getByTestId('setup-save').click();
  await expect(page).toHaveURL(/\/studies\/\d+\/specimens$/);

  await pasteRows(page, inventedVerificationValues(), 20);
  await expect(cell(page, 12, 'value')).toHaveText('5.4');

  await runAnalysis(page);
  await expect(page.getByTestId('verify-acceptance')).toHaveText('Accepted: 1 of 20 outside; at most 2 allowed.', { timeout: 60_000 });
  await expect(page.getByTestId('verify-outside')).toHaveText('0 below and 1 above the stated interval 3.5 to 5.1.');
  await expect(page.getByTestId('verify-power')).toContainText('of the time');
  await expect(page.getByTestId('verify-advice')).toHaveCount(0);
  await expect(page.getByTestId('verify-source')).toHaveText(SOURCE);
  await expectPainted(page.getByTestId('plot-strip').locator('canvas'));
  await expect(page.getByTestId('plot-strip').locator('figcaption')).toContainText('diamonds: outside it');
  await fullShot(page, 'interval-verify.png');
  await expect(page.getByTestId('verify-acceptance')).toHaveText('Accepted: 1 of 20 outside; at most 2 allowed.');
  await expect(page.getByTestId('verify-source')).toHaveText(SOURCE);
  await expect(page.getByTestId('caution')).toContainText('Decision support only');

  // Each point is an individual: hovering the one outside names it and its value.
  const strip = page.getByTestId('plot-strip').locator('canvas');
  await strip.scrollIntoViewIfNeeded();
  await expect(strip).toHaveAttribute('data-points', /\[\[/);
  const points = JSON.parse((await strip.getAttribute('data-points'))!) as [number, number, number][];
  expect(points.map((p) => p[0]).sort((a, b) => a - b)).toEqual(Array.from({ length: 20 }, (_, i) => i + 1));
  const [, x, y] = points.find((p) => p[0] === 13)!;
  await strip.hover({ position: { x, y } });
  const tip = page.getByTestId('plot-strip').getByTestId('plot-tip');
  await expect(tip.locator('strong')).toHaveText('RV-13 (row 13)');
  await expect(tip).toContainText('Value 5.4 mmol/L');
  await expect(tip).toContainText('Outside the stated interval');
  await page.getByTestId('plot-strip').screenshot({ path: path.join(SCREENSHOTS, 'interval-verify-strip.png') });
  await expect(tip.locator('strong')).toHaveText('RV-13 (row 13)');
  await expect(tip).toContainText('Outside the stated interval');
  // The typed source is a record-only setting (no input of the engine): the review page and the PDF name it too, never "—".
  const id = Number(/\/studies\/(\d+)\//.exec(page.url())![1]);
  await page.goto(`/studies/${id}/review`);
  await expect(page.getByTestId('review-title')).toHaveText(title);
  await expect(page.getByTestId('verify-source')).toHaveText(SOURCE);
  await expect(page.getByTestId('review-caution')).toContainText(CAUTION);
  const pdf = await page.request.get(`/api/v1/studies/${id}/report.pdf`);
  expect(pdf.status()).toBe(200);
  const downloads = path.resolve(__dirname, '../.test-output/downloads');
  mkdirSync(downloads, { recursive: true });
  const file = path.join(downloads, `interval-verify-${id}.pdf`);
  writeFileSync(file, await pdf.body());
  const text = execFileSync('pdftotext', [file, '-'], { encoding: 'utf8' }).replace(/\s+/g, ' ');
  // In the findings, beside the stated interval (the plan names it too, from Setup).
  expect(text).toContain(`Source of the stated interval ${SOURCE} Values tested (n) 20 tested of 20 entered`);
  expect(text).not.toContain('Source of the stated interval — ');
  // The draft's diagonal mark interleaves its letters with the caution's lines, so only its start is read here (the full text: server/reports specs).
  expect(text).toContain(CAUTION.slice(0, 60));
});
