import { expect, test, type Download, type Page } from '@playwright/test';
import { createHash } from 'node:crypto';
import { mkdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import { laboratoryDate, laboratoryTime } from '@shared/types/lab-time';
import { NO_SESSION, signedStudy } from './fixtures/api';

const SCREENSHOTS = path.resolve(__dirname, '../.test-output/screenshots');
const PASSWORD = 'parallax-demo';
const QUALITY_STATE = path.resolve(__dirname, '../.test-output/quality-session.json');

async function signIn(page: Page, email: string): Promise<void> {
  await page.goto('/sign-in');
  await page.getByTestId('email').fill(email);
  await page.getByTestId('password').fill(PASSWORD);
  await page.getByTestId('sign-in').click();
  await expect(page.getByTestId('welcome')).toBeVisible();
}

/**
 * A screenshot once the web fonts (text and icons) have loaded and nothing is still loading. The shell
 * scrolls inside its content pane, so `whole` grows the window to the content's height for one shot.
 */
async function shoot(page: Page, name: string, whole = false): Promise<void> {
  await expect(page.locator('mat-progress-bar')).toHaveCount(0);
  await page.evaluate(async () => {
    await document.fonts.ready;
    await Promise.all(document.getAnimations().map((animation) => animation.finished));
  });
  const viewport = page.viewportSize()!;
  if (whole) {
    const height = await page.evaluate(() => (document.querySelector('mat-sidenav-content')?.scrollHeight ?? document.body.scrollHeight) + 64);
    await page.setViewportSize({ width: viewport.width, height: Math.max(height, viewport.height) });
  }
  await page.screenshot({ path: `${SCREENSHOTS}/${name}.png`, fullPage: whole });
  await page.setViewportSize(viewport);
}

/** A downloaded file is a non-empty .xlsx: a zip archive, so it starts with "PK". */
async function expectXlsx(download: Download): Promise<void> {
  expect(download.suggestedFilename()).toMatch(/\.xlsx$/);
  const saved = path.resolve(__dirname, '../.test-output/downloads', download.suggestedFilename());
  await download.saveAs(saved);
  expect(statSync(saved).size).toBeGreaterThan(1000);
  expect(readFileSync(saved).subarray(0, 2).toString()).toBe('PK');
}

/** Buttons and links whose words would change a study; the quality officer must see none. */
const CHANGES_A_STUDY = /^\s*(submit|sign(?! out)|edit|return|amend|approve|delete|remove|save|run|upload|import|new study)\b/i;

test.describe('the quality officer audits a study the laboratory signed', () => {
  let id = 0;
  const title = `Audit check: glucose line 2 against line 1 (${Date.now()})`;

  // The quality officer signs in through the page once; each test then opens its own tab in that session
  // (sign-ins are rate-limited per address, so the tests do not sign in again and again).
  test.use({ storageState: QUALITY_STATE });

  test.beforeAll(async ({ browser, baseURL }) => {
    test.setTimeout(180_000);
    mkdirSync(SCREENSHOTS, { recursive: true });
    id = await signedStudy(baseURL!, title);
    const context = await browser.newContext({ baseURL, storageState: NO_SESSION });
    await signIn(await context.newPage(), 'quality@valeharbor.example');
    await context.storageState({ path: QUALITY_STATE });
    await context.close();
  });

  test.beforeEach(async ({ page }) => {
    await page.goto('/profile');
    await expect(page.getByTestId('user-roles')).toHaveText('Quality officer');
  });

  test('finds the study in the Archive by its title and downloads the list', async ({ page }) => {
    await page.getByTestId('nav-archive').click();
    await expect(page.getByRole('heading', { level: 1, name: 'Archive' })).toBeVisible();
    await expect(page.getByTestId('caution')).toContainText('Decision support only');
    await expect(page.locator('[data-testid^="archive-row-"]').first()).toBeVisible();
    await shoot(page, 'archive-all');
    await expect(page.getByRole('heading', { level: 1, name: 'Archive' })).toBeVisible();
    await expect(page.getByTestId('archive-count')).toHaveText(/^[\d,]+ stud(y matches|ies match)$/);
    await page.getByTestId('archive-q').fill(title);
    await expect(page).toHaveURL(/[?&]q=/);
    const row = page.getByTestId(`archive-row-${id}`);
    await expect(row).toBeVisible();
    await expect(page.getByTestId('archive-count')).toHaveText('1 study matches');
    await expect(row).toContainText('Signed');
    await expect(row).toContainText('Accepted for patient testing');
    // The fixture's candidate reads 1 % above (bias about 0.04, 0.08 and 0.12 mmol/L at 2.8, 7.0 and 11.1), each CI
    // wholly inside the allowable 0.2 mmol/L or 4 %: within at every level, for any seed.
    await expect(row.getByTestId('verdict')).toContainText('Within goal');
    // Times are the laboratory's, and the page names the zone once above the table.
    await expect(page.getByTestId('archive-zone')).toHaveText(/^Times are ([A-Za-z_]+\/[A-Za-z_/]+|UTC) time, the laboratory's zone\.$/);
    await expect(row).toContainText(/\d{4}-\d\d-\d\d \d\d:\d\d/);
    await shoot(page, 'archive');
    await expect(page.getByTestId('archive-count')).toHaveText('1 study matches');
    await expect(row).toContainText('Accepted for patient testing');
    const [download] = await Promise.all([page.waitForEvent('download', { timeout: 30_000 }), page.getByTestId('archive-download').click()]);
    await expectXlsx(download);
    await row.click();
    await expect(page).toHaveURL(new RegExp(`/archive/${id}$`));
  });

  test('opens the audit record: the signature, the signed PDF, both re-checks passing, and nothing that changes a study', async ({ page }) => {
    await page.goto(`/archive/${id}`);
    await expect(page.getByTestId('record-title')).toHaveText(title);
    await expect(page.getByTestId('study-state')).toHaveText('Signed');
    await expect(page.getByTestId('caution')).toBeVisible();
    const signature = page.locator('[data-meaning="accepted"]');
    await expect(signature).toContainText('Accepted for patient testing');
    await expect(signature).toContainText('Bias within goal at all three decision levels.');
    await expect(signature.getByTestId('content-hash')).toHaveText(/^[0-9a-f]{64}$/);
    await expect(signature.getByTestId('verification-code')).not.toBeEmpty();
    await expect(page.getByTestId('study-history')).toContainText('Signed: accepted for patient testing');

    // The signed PDF opens in a new tab, and its bytes are the ones the signature names.
    const pdfLink = page.getByTestId('open-pdf');
    await expect(pdfLink).toHaveText(/Open signed PDF/);
    await expect(pdfLink).toHaveAttribute('target', '_blank');
    const pdf = await page.request.get((await pdfLink.getAttribute('href'))!);
    const bytes = await pdf.body();
    expect(bytes.subarray(0, 5).toString()).toBe('%PDF-');
    await expect(signature).toContainText(createHash('sha256').update(bytes).digest('hex'));

    // Both re-checks pass, check by check, in words, and each is recorded in the study's history.
    await page.getByTestId('check-integrity').click();
    await expect(page.getByTestId('integrity-outcome')).toContainText('Passed. All 4 checks passed');
    for (const name of ['Content hash', 'Signed PDF', 'Analysis input', 'History chain']) {
      await expect(page.getByTestId(`check-${name}`)).toContainText(`${name}: passed`);
    }
    await page.getByTestId('reproduce-results').click();
    await expect(page.getByTestId('reproduce-outcome')).toContainText('Passed. Re-running the analysis gave identical results');
    await expect(page.getByTestId('differences')).toHaveCount(0);
    const history = page.getByTestId('study-history');
    await expect(history.locator('[data-action="integrity.checked"]')).not.toHaveCount(0);
    await expect(history.locator('[data-action="reproduce.checked"]')).not.toHaveCount(0);
    await shoot(page, 'audit-record');
    await shoot(page, 'audit-record-full', true);
    await expect(page.getByTestId('record-title')).toHaveText(title);
    await expect(page.getByTestId('integrity-outcome')).toContainText('Passed. All 4 checks passed');
    await expect(page.getByTestId('reproduce-outcome')).toContainText('Passed. Re-running the analysis gave identical results');

    // Nothing on the record changes a study.
    const words = await page.locator('main').locator('button, a').allInnerTexts();
    expect(words.length).toBeGreaterThan(3);
    expect(words.filter((w) => CHANGES_A_STUDY.test(w.replace(/^[a-z_]+\s/, '')))).toEqual([]);

    // Printed, the record keeps its content and drops the navigation and the buttons.
    await page.emulateMedia({ media: 'print' });
    await expect(page.locator('mat-sidenav')).toBeHidden();
    await expect(page.getByTestId('check-integrity')).toBeHidden();
    await expect(page.getByTestId('record-title')).toBeVisible();
    await shoot(page, 'audit-record-print', true);
    await expect(page.getByTestId('record-title')).toHaveText(title);
    await expect(page.getByTestId('caution')).toBeVisible();
    await expect(signature).toContainText('Accepted for patient testing');
  });

  test('downloads the study’s full record as a non-empty .xlsx', async ({ page }) => {
    await page.goto(`/archive/${id}`);
    await expect(page.getByTestId('record-title')).toHaveText(title);
    const [download] = await Promise.all([page.waitForEvent('download', { timeout: 30_000 }), page.getByTestId('download-record').click()]);
    expect(download.suggestedFilename()).toBe(`parallax-study-${id}.xlsx`);
    await expectXlsx(download);
  });

  test('reads the laboratory history of the study, with a link back to its record', async ({ page }) => {
    await page.getByTestId('nav-history').click();
    await expect(page.getByRole('heading', { level: 1, name: 'History' })).toBeVisible();
    await page.getByTestId('history-study').fill(String(id));
    await expect(page).toHaveURL(new RegExp(`studyId=${id}`));
    const signed = page.locator('[data-action="study.signed"]');
    await expect(signed).toHaveCount(1);
    await expect(signed).toContainText('Signed: accepted for patient testing');
    // The list follows the typed number as it is typed: wait for this study's one creation before reading it.
    await expect(page.locator('[data-action="study.created"]')).toHaveCount(1);
    await expect(page.locator('[data-action="study.created"]')).toContainText(title);
    await page.getByTestId('check-chains').click();
    await expect(page.getByTestId('chains-outcome')).toHaveText(/Passed\. Both history chains are intact/);
    await expect(page.getByTestId('check-Laboratory history')).toContainText(/Laboratory history: passed\s*All [\d,]+ events of the laboratory's history are intact/);
    await expect(page.getByTestId('check-History without a laboratory')).toContainText('passed');
    await shoot(page, 'history');
    await expect(signed).toHaveCount(1);
    await expect(page.getByTestId('chains-outcome')).toHaveText(/Passed\. Both history chains are intact/);
    await signed.getByRole('link', { name: `Study ${id}` }).click();
    await expect(page.getByTestId('record-title')).toHaveText(title);
  });

  test('finds the study by the verification code printed on its signed PDF, typed as printed or in lower case without separators', async ({ page }) => {
    const signatures: { meaning: string; verificationCode: string }[] = await (await page.request.get(`/api/v1/studies/${id}/signatures`)).json();
    const code = signatures.filter((s) => s.meaning !== 'plan-approved').at(-1)!.verificationCode;
    expect(code).toMatch(/^PX-[A-Z2-9]{4}-[A-Z2-9]{4}$/);
    await page.getByTestId('nav-archive').click();
    const search = page.getByTestId('archive-q');
    await expect(page.locator('mat-form-field').filter({ has: search })).toContainText('Title, purpose or verification code');
    const row = page.getByTestId(`archive-row-${id}`);
    await search.fill(code);
    await expect(page).toHaveURL(new RegExp(`[?&]q=${code}`));
    await expect(page.getByTestId('archive-count')).toHaveText('1 study matches');
    await expect(row).toContainText(title);
    const typed = code.replace(/-/g, '').toLowerCase();
    await search.fill(typed);
    await expect(page).toHaveURL(new RegExp(`[?&]q=${typed}`));
    await expect(page.getByTestId('archive-count')).toHaveText('1 study matches');
    await expect(row).toContainText('Accepted for patient testing');
    await shoot(page, 'archive-code-search');
    await expect(page.getByTestId('archive-count')).toHaveText('1 study matches');
    await expect(search).toHaveValue(typed);
  });

  test("filters the laboratory history by the laboratory's days, yyyy-mm-dd, and shows its times with the zone named", async ({ page }) => {
    const session: { laboratory: { timeZone: string } } = await (await page.request.get('/api/v1/session')).json();
    const zone = session.laboratory.timeZone;
    const events: { action: string; at: string }[] = await (await page.request.get(`/api/v1/studies/${id}/history`)).json();
    const signedAt = events.find((e) => e.action === 'study.signed')!.at;
    const day = laboratoryDate(signedAt, zone);
    await page.getByTestId('nav-history').click();
    await expect(page.getByTestId('history-zone')).toHaveText(`Dates and times are the laboratory's, in ${zone}.`);
    await page.getByTestId('history-study').fill(String(id));
    await page.getByTestId('history-from').fill(day);
    await page.getByTestId('history-to').fill(day);
    await expect(page).toHaveURL(new RegExp(`from=${day}`));
    await expect(page).toHaveURL(new RegExp(`to=${day}`));
    await expect(page.getByTestId('history-from')).toHaveValue(day);
    const signed = page.locator('[data-action="study.signed"]');
    await expect(signed).toHaveCount(1);
    await expect(signed.locator('time')).toHaveText(laboratoryTime(signedAt, zone, { seconds: true }));
    await expect(signed.locator('time')).toHaveText(new RegExp(`^${day} \\d\\d:\\d\\d:\\d\\d ${zone} \\(UTC[+−]\\d\\d:\\d\\d\\)$`));
    // The whole year shows in the date fields.
    for (const field of ['history-from', 'history-to']) {
      const box = page.getByTestId(field);
      expect(await box.evaluate((input: HTMLInputElement) => input.scrollWidth <= input.clientWidth)).toBe(true);
    }
    await shoot(page, 'lab-history-local-times');
    await expect(signed).toHaveCount(1);
    await expect(page.getByTestId('history-zone')).toHaveText(`Dates and times are the laboratory's, in ${zone}.`);
    // The calendar opens on the chosen day and writes the day it is given back as yyyy-mm-dd.
    await page.locator('mat-form-field').filter({ has: page.getByTestId('history-to') }).locator('mat-datepicker-toggle button').click();
    await expect(page.locator('mat-calendar')).toBeVisible();
    await shoot(page, 'lab-history-calendar');
    await expect(page.locator('mat-calendar')).toBeVisible();
    await expect(page.locator('mat-calendar .mat-calendar-body-selected')).toHaveText(String(Number(day.slice(8))));
    await page.keyboard.press('Escape');
  });

  test("lists studies changed on the laboratory's days, read and written as yyyy-mm-dd", async ({ page }) => {
    const session: { laboratory: { timeZone: string } } = await (await page.request.get('/api/v1/session')).json();
    const zone = session.laboratory.timeZone;
    const study: { updatedAt: string } = await (await page.request.get(`/api/v1/studies/${id}`)).json();
    const day = laboratoryDate(study.updatedAt, zone);
    await page.getByTestId('nav-studies').click();
    await page.getByTestId('filter-from').fill(day);
    await page.getByTestId('filter-from').press('Tab');
    await page.getByTestId('filter-to').fill(day);
    await page.getByTestId('filter-to').press('Tab');
    await expect(page).toHaveURL(new RegExp(`from=${day}`));
    await expect(page).toHaveURL(new RegExp(`to=${day}`));
    await expect(page.getByTestId('study-table')).toContainText(title);
    await expect(page.getByTestId('study-table').locator('th').last()).toHaveText(new RegExp(`Last change \\(${zone}\\)`));
    await expect(page.getByTestId('study-table')).toContainText(laboratoryTime(study.updatedAt, zone, { zone: false }));
    for (const field of ['filter-from', 'filter-to']) {
      await expect(page.getByTestId(field)).toHaveValue(day);
      expect(await page.getByTestId(field).evaluate((input: HTMLInputElement) => input.scrollWidth <= input.clientWidth)).toBe(true);
    }
    await shoot(page, 'study-list-dates');
    await expect(page.getByTestId('study-table')).toContainText(title);
  });

  test('cannot open the laboratory settings, which are for administrators', async ({ page }) => {
    await expect(page.getByTestId('nav-laboratory')).toHaveCount(0);
    await page.goto('/admin/laboratory');
    await expect(page).toHaveURL(/\/$/);
    await expect(page.locator('mat-snack-bar-container')).toContainText('Your roles do not include that page.');
  });
});

test('an administrator reads the laboratory settings in plain words', async ({ page }) => {
  mkdirSync(SCREENSHOTS, { recursive: true });
  await signIn(page, 'admin@valeharbor.example');
  await page.getByTestId('nav-laboratory').click();
  await expect(page.getByRole('heading', { level: 1, name: 'Laboratory' })).toBeVisible();
  await expect(page.getByTestId('lab-time-zone')).toHaveValue(/^[A-Za-z_]+(\/[A-Za-z_+-]+)*$/);
  await expect(page.getByTestId('lab-plan-approval')).toContainText('Plan approval before data');
  await expect(page.locator('main')).toContainText("Specimens can be entered only after a director approved the study's plan.");
  await expect(page.locator('main')).toContainText('A director may sign a study whose rows they entered (each such signature is recorded in the history).');
  await shoot(page, 'laboratory');
  await expect(page.getByRole('heading', { level: 1, name: 'Laboratory' })).toBeVisible();
  await expect(page.getByTestId('lab-plan-approval')).toContainText('Plan approval before data');
});
