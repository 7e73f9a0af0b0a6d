import { expect, test, type Locator, type Page } from '@playwright/test';
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { apiAs, send } from './fixtures/api';
import { choose, closeNotice, SCREENSHOTS, signIn } from './fixtures/pages';

/** A draft glucose comparison of its own (line 1 against line 2), analysed with Deming so a small plan runs quickly. */
async function draftComparison(baseURL: string, title: string): Promise<number> {
  const tech = await apiAs(baseURL, 'tech@valeharbor.example');
  const analytes: { id: number; name: string; unit: string }[] = await (await tech.get('/api/v1/analytes')).json();
  const instruments: { id: number; name: string }[] = await (await tech.get('/api/v1/instruments')).json();
  const glucose = analytes.find((a) => a.name === 'Glucose' && a.unit === 'mmol/L');
  const line = (name: string) => instruments.find((i) => i.name === name)?.id;
  expect(glucose, 'the demo catalog has Glucose (mmol/L)').toBeTruthy();
  const study = await send(tech, 'post', '/api/v1/studies', {
    kind: 'method-comparison', title, analyteId: glucose!.id,
    comparativeInstrumentId: line('Chemistry line 1'), candidateInstrumentId: line('Chemistry line 2'),
    settings: { regression: 'deming', demingRatio: 1, decisionLevels: [2.8, 7, 11.1], allowableBiasAbsolute: 0.2, allowableBiasPercent: 4 },
  });
  await tech.dispose();
  return study.id;
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

/**
 * A picture of one panel, once fonts are in and the chart has drawn: the shell scrolls inside its content pane, so the
 * viewport is made as tall as that pane's content for the shot, then put back to 1366×768.
 */
async function shootPanel(page: Page, panel: Locator, file: string): Promise<void> {
  const height = await page.evaluate(async () => {
    await document.fonts.ready;
    const pane = document.querySelector('mat-sidenav-content');
    return Math.ceil((pane?.scrollHeight ?? document.body.scrollHeight) + (pane?.getBoundingClientRect().top ?? 0));
  });
  await page.setViewportSize({ width: 1366, height: Math.max(768, height) });
  await page.waitForTimeout(400);
  await panel.screenshot({ path: path.join(SCREENSHOTS, file) });
  await page.setViewportSize({ width: 1366, height: 768 });
}

test.beforeEach(() => mkdirSync(SCREENSHOTS, { recursive: true }));

test('a technologist plans a new comparison by simulation: fills the plan, runs it, follows its progress and reads the recommendation', async ({ page, baseURL }) => {
  test.setTimeout(180_000);
  const id = await draftComparison(baseURL!, `Glucose plan, line 2 against line 1 (${Date.now()})`);
  await signIn(page);
  await page.goto(`/studies/${id}/setup`);

  const panel = page.getByTestId('plan-panel');
  await expect(panel).toBeVisible();
  // What the plan takes from Setup is shown, read-only.
  await expect(panel.getByTestId('plan-from-setup')).toContainText('Deming, error ratio λ = 1');
  await expect(panel.getByTestId('plan-from-setup')).toContainText('2.8; 7.0; 11.1 mmol/L');
  await expect(panel.getByTestId('plan-none')).toHaveText('No plan has been run yet. Fill in the plan, then save and run it.');

  // A grid the shared rule refuses is named at its field, and nothing is sent.
  await panel.getByTestId('plan-n').fill('20, 4x');
  await panel.getByTestId('plan-run').click();
  await expect(panel).toContainText('“4x” is not a whole number');

  await expect(panel.getByTestId('plan-error-model')).toContainText('Proportional (CV %)');
  await panel.getByTestId('plan-cv-comparative').fill('2');
  await panel.getByTestId('plan-cv-candidate').fill('2.5');
  await panel.getByTestId('plan-low').fill('3');
  await panel.getByTestId('plan-high').fill('20');
  await panel.getByTestId('plan-n').fill('20, 40, 80');
  await panel.getByTestId('plan-simulations').fill('200');

  // Remember whether the progress bar was ever shown: a small plan may end within a second.
  await page.evaluate(() => {
    const w = window as unknown as { sawProgress: boolean };
    w.sawProgress = false;
    new MutationObserver(() => {
      if (document.querySelector('[data-testid="plan-progress"]')) w.sawProgress = true;
    }).observe(document.body, { subtree: true, childList: true });
  });
  await panel.getByTestId('plan-run').click();
  await expect(panel.getByTestId('plan-recommendation')).toBeVisible({ timeout: 120_000 });
  expect(await page.evaluate(() => (window as unknown as { sawProgress: boolean }).sawProgress)).toBe(true);
  await expect(panel.getByTestId('plan-run-state')).toHaveText(/^Done in \d+\.\d s · engine /);

  // The recommendation (or why none), under the caution; the table of every n and level; the power curves; the notes.
  await expect(panel.getByTestId('plan-reason')).toHaveText(/specimens: the smallest n on the grid|No n on the grid meets both targets/);
  await expect(panel.getByTestId('plan-caution')).toContainText('Decision support only');
  await expect(panel.getByTestId('plan-table').locator('tbody tr')).toHaveCount(9);
  await expect(panel.getByTestId('plan-row-40')).toContainText('2.8 mmol/L');
  await expect(panel.getByTestId('plan-warnings')).toContainText('bootstrap resamples');
  await expect(panel.getByTestId('plan-method')).toContainText('200 simulated studies at each n, each analysed with Deming');
  await expectPainted(panel.getByTestId('plan-chart').locator('canvas'));
  await expect(panel.getByTestId('plan-chart').getByTestId('plot-legend')).toContainText('Target power 80%');
  await expect(panel.getByTestId('plan-out-of-date')).toHaveCount(0);

  // The plan was saved with the study: after a reload the fields hold it and the figures are still there.
  await page.reload();
  await expect(panel.getByTestId('plan-n')).toHaveValue('20, 40, 80');
  await expect(panel.getByTestId('plan-recommendation')).toBeVisible();
  await closeNotice(page);
  await shootPanel(page, panel, 'plan-comparison.png');
  // What the shot shows: the reloaded recommendation with its reason, the 9 rows of the grid and the caution.
  await expect(panel.getByTestId('plan-reason')).toHaveText(/specimens: the smallest n on the grid|No n on the grid meets both targets/);
  await expect(panel.getByTestId('plan-table').locator('tbody tr')).toHaveCount(9);
  await expect(panel.getByTestId('plan-caution')).toContainText('Decision support only');
});

test('a verification and an establishment show on Setup what their plan buys, worked out as the planned number changes', async ({ page }) => {
  await signIn(page);
  await page.getByTestId('nav-studies').click();
  await page.getByTestId('study-new').click();
  await choose(page, page.getByTestId('setup-kind'), /Reference interval: verify/);
  await choose(page, page.getByTestId('setup-analyte'), /^Potassium/);
  const verify = page.getByTestId('transference-plan');
  await expect(verify.getByTestId('transference-sentence')).toHaveText(
    'With 10% of your population outside the stated interval, the rule still accepts 67.7% of the time (89.6% with the retest).',
  );
  await expect(verify.getByTestId('transference-table').locator('tbody tr')).toHaveCount(8);
  await expectPainted(verify.getByTestId('transference-chart').locator('canvas'));
  await shootPanel(page, verify, 'plan-verify.png');
  await expect(verify.getByTestId('transference-sentence')).toContainText('the rule still accepts 67.7% of the time (89.6% with the retest)');
  await expect(verify.getByTestId('transference-table').locator('tbody tr')).toHaveCount(8);
  // 40 planned: at most 4 outside, and the figures follow.
  await page.getByTestId('setup-planned').fill('40');
  await expect(verify).toContainText('at most 4 of 40 individuals fall outside');
  await expect(verify.getByTestId('transference-sentence')).not.toContainText('67.7%');

  await choose(page, page.getByTestId('setup-kind'), /Reference interval: establish/);
  const establish = page.getByTestId('establish-plan');
  await expect(establish.getByTestId('establish-row-120')).toContainText('1–7');
  await expect(establish.getByTestId('establish-smallest-0')).toContainText('Below 119 individuals no 90% CI of the 2.5th or 97.5th percentile exists');
  // The 40 still planned from the verification has no CI of either limit.
  await expect(establish.getByTestId('establish-row-40')).toContainText('no CI');
  await choose(page, establish.getByTestId('establish-shape'), 'Normal');
  await establish.getByTestId('establish-lower').fill('3.5');
  await establish.getByTestId('establish-upper').fill('5.1');
  await expect(establish.getByTestId('establish-table')).toContainText('Expected width (mmol/L)');
  await expectPainted(establish.getByTestId('establish-chart').locator('canvas'));
  await shootPanel(page, establish, 'plan-establish.png');
  await expect(establish.getByTestId('establish-smallest-0')).toContainText('Below 119 individuals no 90% CI of the 2.5th or 97.5th percentile exists');
  await expect(establish.getByTestId('establish-table')).toContainText('Expected width (mmol/L)');
});
