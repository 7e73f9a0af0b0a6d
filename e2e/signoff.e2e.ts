import { expect, request, test, type APIRequestContext, type Browser, type Page } from '@playwright/test';
import { execFileSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { mkdirSync, readdirSync, readFileSync, rmSync, statSync } from 'node:fs';
import path from 'node:path';
import { CAUTION } from '@shared/text/caution';

const OUT = path.resolve(__dirname, '../.test-output');
const SCREENSHOTS = path.join(OUT, 'screenshots');
const PASSWORD = 'parallax-demo';
const TECH = 'tech@valeharbor.example';
const DIRECTOR = 'director@valeharbor.example';
/** Technologist and director at once. */
const LEAD = 'lead@valeharbor.example';
const NOTE = 'Row 7 was haemolysed on the candidate run and is excluded with that reason; the high end is the part to read first.';

/** One demo user's API session: the session GET hands out the XSRF-TOKEN cookie, every write sends it back. */
class ApiUser {
  private constructor(private readonly api: APIRequestContext) {}

  static async signIn(baseURL: string, email: string): Promise<ApiUser> {
    const user = new ApiUser(await request.newContext({ baseURL, storageState: { cookies: [], origins: [] } }));
    await user.api.get('/api/v1/session');
    await user.write('post', '/api/v1/session', { email, password: PASSWORD });
    return user;
  }

  async read<T>(url: string): Promise<T> {
    const response = await this.api.get(url);
    expect(response.ok(), `GET ${url} answered ${response.status()}`).toBe(true);
    return (await response.json()) as T;
  }

  async write<T>(method: 'post' | 'put' | 'patch', url: string, data: unknown): Promise<T> {
    const token = (await this.api.storageState()).cookies.find((c) => c.name === 'XSRF-TOKEN')?.value ?? '';
    const response = await this.api[method](url, { data, headers: { 'X-XSRF-TOKEN': token } });
    expect(response.ok(), `${method.toUpperCase()} ${url} answered ${response.status()}: ${await response.text()}`).toBe(true);
    return (await response.json()) as T;
  }

  dispose(): Promise<void> {
    return this.api.dispose();
  }
}

interface StudyAnswer { id: number; version: number; state: string; timeZone?: string }

/**
 * A glucose comparison of 40 invented pairs across 3–20 mmol/L (row 7 excluded with a reason), analysed; submitted when asked.
 * `author` creates it and enters its rows (the technologist unless named).
 */
async function preparedStudy(baseURL: string, title: string, submit: boolean, author = TECH): Promise<number> {
  const tech = await ApiUser.signIn(baseURL, author);
  const analytes = await tech.read<{ id: number; name: string; unit: string }[]>('/api/v1/analytes');
  const instruments = await tech.read<{ id: number }[]>('/api/v1/instruments');
  const glucose = analytes.find((a) => a.name === 'Glucose' && a.unit === 'mmol/L') ?? analytes.find((a) => a.name === 'Glucose');
  expect(glucose, 'the demo catalog has Glucose').toBeTruthy();
  expect(instruments.length).toBeGreaterThanOrEqual(2);
  const study = await tech.write<StudyAnswer>('post', '/api/v1/studies', {
    kind: 'method-comparison', title, analyteId: glucose!.id,
    comparativeInstrumentId: instruments[0].id, candidateInstrumentId: instruments[1].id,
    settings: { resamples: 1000, regressionResamples: 1000 },
  });
  const wobble = [0.1, -0.1, 0, 0.05, -0.05, 0.1, 0, -0.1];
  const rows = Array.from({ length: 40 }, (_, i) => {
    const comparative = Math.round((3 + (17 * i) / 39) * 10) / 10;
    const excluded = i === 6;
    return {
      label: `SO-${String(i + 1).padStart(3, '0')}`, comparative, candidate: Math.round((comparative * 1.01 + wobble[i % 8]) * 10) / 10,
      excluded, exclusionReason: excluded ? 'Haemolysed on the candidate run' : null,
    };
  });
  await tech.write('put', `/api/v1/studies/${study.id}/specimens`, { version: study.version, rows });
  const { id: analysisId } = await tech.write<{ id: number }>('post', `/api/v1/studies/${study.id}/analyses`, {});
  await expect
    .poll(async () => (await tech.read<{ state: string }>(`/api/v1/analyses/${analysisId}`)).state, { timeout: 120_000, intervals: [500, 1000] })
    .toBe('done');
  if (submit) await tech.write('post', `/api/v1/studies/${study.id}/submit`, {});
  await tech.dispose();
  return study.id;
}

/** A page of its own (own cookies) for one user, signed in through the sign-in page. */
async function pageOf(browser: Browser, baseURL: string, email: string): Promise<Page> {
  const context = await browser.newContext({ baseURL, storageState: { cookies: [], origins: [] } });
  const page = await context.newPage();
  await page.goto('/sign-in');
  await page.getByTestId('email').fill(email);
  await page.getByTestId('password').fill(PASSWORD);
  await page.getByTestId('sign-in').click();
  await expect(page.getByTestId('welcome')).toBeVisible();
  return page;
}

/** A screenshot once fonts and animations are done; `whole` grows the window to the shell's scrolling content. */
async function shot(page: Page, name: string, whole = false): Promise<void> {
  await expect(page.locator('mat-progress-bar')).toHaveCount(0);
  await page.evaluate(async () => {
    await document.fonts.ready;
    // An animation cancelled meanwhile (a field's error replacing its hint) rejects its promise: it is over too.
    await Promise.all(document.getAnimations().map((a) => a.finished.catch(() => undefined)));
  });
  if (whole) {
    const height = await page.evaluate(() => (document.querySelector('mat-sidenav-content')?.scrollHeight ?? document.body.scrollHeight) + 64);
    await page.setViewportSize({ width: 1366, height: Math.max(768, height) });
    await page.waitForTimeout(300);
  }
  await page.screenshot({ path: path.join(SCREENSHOTS, `${name}.png`) });
  await page.setViewportSize({ width: 1366, height: 768 });
}

test.beforeAll(() => mkdirSync(SCREENSHOTS, { recursive: true }));

test('the technologist submits a study; the director refuses a wrong password, then signs, and the signed PDF is the one the signature names', async ({
  browser, baseURL,
}) => {
  test.setTimeout(240_000);
  const title = `Sign-off: glucose line 2 against line 1 (${Date.now()})`;
  const id = await preparedStudy(baseURL!, title, false);

  // The technologist submits from the study page's sign-off bar.
  const tech = await pageOf(browser, baseURL!, TECH);
  await tech.goto(`/studies/${id}`);
  const bar = tech.getByTestId('signoff-bar');
  await expect(bar.getByTestId('signoff-state')).toHaveText('Draft');
  await expect(bar.getByTestId('step-approve-plan')).toHaveCount(0);
  await shot(tech, 'signoff-bar-draft');
  await expect(bar.getByTestId('signoff-state')).toHaveText('Draft');
  await expect(bar.getByTestId('step-submit')).toBeEnabled();
  // Submitting asks first, says the study is locked for the director, and takes a note for the director.
  await bar.getByTestId('step-submit').click();
  const submitDialog = tech.getByRole('dialog');
  await expect(submitDialog.getByTestId('submit-what')).toContainText('Submitting locks the study for the director');
  await submitDialog.getByTestId('submit-note').fill(NOTE);
  await shot(tech, 'submit-dialog');
  await expect(submitDialog.getByTestId('submit-note')).toHaveValue(NOTE);
  await expect(submitDialog.getByTestId('submit-what')).toContainText('Submitting locks the study for the director');
  await submitDialog.getByTestId('submit-confirm').click();
  await expect(submitDialog).toHaveCount(0);
  await expect(bar.getByTestId('signoff-state')).toHaveText('Awaiting the director’s signature');
  await expect(tech.getByTestId('study-state')).toHaveText('Awaiting sign-off');
  await expect(bar.locator('button')).toHaveCount(0);
  await tech.context().close();

  // The director finds it under "Awaiting my signature"; its link opens the review.
  const director = await pageOf(browser, baseURL!, DIRECTOR);
  const waiting = director.getByTestId('wl-awaitingSignature').getByTestId(`wl-study-${id}`);
  await expect(waiting).toContainText(title);
  await waiting.getByRole('link', { name: title }).click();
  await expect(director).toHaveURL(new RegExp(`/studies/${id}/review$`));
  await expect(director.getByTestId('who-may-sign')).toHaveText('You may sign it. Any director but Tomas Reyes, who entered its rows, may sign it.');
  await expect(director.getByTestId('review-title')).toHaveText(title);
  await expect(director.getByTestId('verdict-panel')).toBeVisible();
  // The decision-level picture, photographed first, then read: one track per decision level of the plan, the
  // engine's verdict in words beside each, an image label per track, and the band captioned with its source.
  const picture = director.getByTestId('decision-track');
  await picture.scrollIntoViewIfNeeded();
  await shot(director, 'review-decision-track-page');
  await director.setViewportSize({ width: 1366, height: 1400 });
  await director.getByTestId('verdict-panel').screenshot({ path: path.join(SCREENSHOTS, 'review-decision-track.png') });
  // The same in grey, as a black-and-white print or a reader without colour vision sees it.
  await director.evaluate(() => (document.documentElement.style.filter = 'grayscale(1)'));
  await director.getByTestId('verdict-panel').screenshot({ path: path.join(SCREENSHOTS, 'review-decision-track-grey.png') });
  await director.evaluate(() => (document.documentElement.style.filter = ''));
  await director.setViewportSize({ width: 1366, height: 768 });
  const { currentAnalysisId } = (await (await director.request.get(`/api/v1/studies/${id}`)).json()) as { currentAnalysisId: number };
  const analysis = (await (await director.request.get(`/api/v1/analyses/${currentAnalysisId}`)).json()) as {
    results: { decisionLevels: { level: number; verdict: 'within' | 'inconclusive' | 'exceeds' | null }[] };
  };
  const levels = analysis.results.decisionLevels;
  expect(levels.map((l) => l.level)).toEqual([2.8, 7, 11.1]);
  const WORD = { within: 'Within', inconclusive: 'Inconclusive', exceeds: 'Exceeds' } as const;
  await expect(picture.getByTestId('track-level')).toHaveText(['2.8 mmol/L', '7.0 mmol/L', '11.1 mmol/L']);
  await expect(picture.getByTestId('verdict')).toHaveText(levels.map((l) => (l.verdict ? WORD[l.verdict] : 'No verdict')));
  const images = picture.locator('svg[role="img"]');
  await expect(images).toHaveCount(3);
  for (const [k, l] of levels.entries()) {
    await expect(images.nth(k)).toHaveAttribute('aria-label', new RegExp(`^At ${['2.8', '7.0', '11.1'][k]} mmol/L: predicted bias .*\\. ${l.verdict ? WORD[l.verdict] : 'No verdict'}: `));
    await expect(picture.getByTestId(`track-decisionLevels.${k}`).getByTestId('track-mark')).toHaveAttribute('data-mark', l.verdict ? { within: 'filled', inconclusive: 'half', exceeds: 'open' }[l.verdict] : 'none');
  }
  await expect(picture.getByTestId('band-caption')).toContainText('(source: Laboratory goal set by the director (2026)');
  await expect(director.getByTestId('verdict-overall')).toContainText('Judged on the 95% CI of the bias that the Passing–Bablok regression of 39 pairs predicts at each level');
  await expect(director.getByTestId('review-caution')).toContainText(CAUTION);
  await expect(director.getByTestId('plan-Source of the allowable bias')).not.toContainText('Not given');
  const note = director.getByTestId('submission-note');
  await expect(note.getByTestId('submission-note-from')).toHaveText(/^Note from \S/);
  await expect(note.getByTestId('submission-note-text')).toHaveText(NOTE);
  await shot(director, 'review-with-note');
  await expect(note.getByTestId('submission-note-text')).toHaveText(NOTE);
  await expect(director.getByTestId('review-state')).toContainText('Awaiting sign-off');
  await expect(director.getByTestId('plan-approval')).toContainText('No plan approval');
  await expect(director.getByTestId('excluded-7')).toContainText('Haemolysed on the candidate run');
  await expect(director.getByTestId('study-history')).toContainText('Submitted');
  await expect(director.getByTestId('no-signatures')).toBeVisible();
  await expect(director.getByTestId('preview-pdf')).toHaveText(/Preview PDF \(draft\)/);
  await shot(director, 'review-awaiting');
  await expect(director.getByTestId('open-sign')).toBeVisible();
  await expect(director.getByTestId('open-return')).toBeVisible();
  await expect(director.getByTestId('review-caution')).toContainText(CAUTION);

  // A wrong password is refused on the password field, and nothing is signed.
  await director.getByTestId('open-sign').click();
  const dialog = director.getByRole('dialog');
  await expect(dialog.getByTestId('sign-binding')).toContainText('binds your name, the meaning you choose and the time of signing to this exact record');
  await dialog.getByTestId('sign-confirm').click();
  await expect(dialog.getByTestId('meaning-error')).toHaveText('Choose accepted or not accepted.');
  await dialog.getByTestId('meaning-accepted').click();
  await dialog.getByTestId('sign-comment').fill('Bias within the goal at every decision level; one exclusion explained.');
  await dialog.getByTestId('sign-password').fill('not-the-password');
  await dialog.getByTestId('sign-confirm').click();
  await expect(dialog.getByTestId('password-error')).toHaveText('The password is wrong');
  await expect(dialog.getByTestId('banner')).toContainText('The password is wrong; the signature was not made');
  await shot(director, 'sign-dialog-wrong-password');
  await expect(dialog.getByTestId('password-error')).toHaveText('The password is wrong');
  await expect(director.getByTestId('review-state')).toContainText('Awaiting sign-off');

  // The right password signs: the signature block names the signer, the meaning, the time in the lab's zone, the hashes.
  await dialog.getByTestId('sign-password').fill(PASSWORD);
  await dialog.getByTestId('sign-confirm').click();
  await expect(dialog).toHaveCount(0);
  const block = director.getByTestId('signature-block');
  await expect(block).toContainText('Accepted for patient testing');
  await expect(block).toContainText('Dr. Imani Okafor');
  await expect(block).toContainText('one exclusion explained');
  const session = (await (await director.request.get('/api/v1/session')).json()) as { laboratory: { timeZone: string } };
  await expect(block).toContainText(`${session.laboratory.timeZone} (UTC`);
  await expect(block.getByTestId('content-hash')).toHaveText(/^[0-9a-f]{64}$/);
  await expect(block.getByTestId('verification-code')).not.toBeEmpty();
  await expect(director.getByTestId('review-state')).toContainText('Signed');
  await expect(director.getByTestId('open-sign')).toHaveCount(0);
  await expect(director.getByTestId('study-history')).toContainText('Signed');

  // The PDF downloads; its bytes are a PDF whose SHA-256 is the one the signature reports.
  const [download] = await Promise.all([director.waitForEvent('download'), block.getByTestId('download-signed-pdf').click()]);
  mkdirSync(path.join(OUT, 'downloads'), { recursive: true });
  const file = path.join(OUT, 'downloads', `signoff-${id}.pdf`);
  await download.saveAs(file);
  const bytes = readFileSync(file);
  expect(bytes.subarray(0, 5).toString()).toBe('%PDF-');
  const signatures = (await (await director.request.get(`/api/v1/studies/${id}/signatures`)).json()) as { meaning: string; pdfSha256: string; contentHash: string }[];
  const signed = signatures.find((s) => s.meaning === 'accepted');
  expect(signed?.pdfSha256).toBe(createHash('sha256').update(bytes).digest('hex'));
  await expect(block.getByTestId('content-hash')).toHaveText(signed!.contentHash);
  await expect(block.getByTestId('open-signed-pdf')).toHaveAttribute('href', `/api/v1/studies/${id}/report.pdf`);
  await shot(director, 'review', true);
  await expect(director.getByTestId('review-state')).toContainText('Signed');
  await expect(block).toContainText('Accepted for patient testing');
  await expect(director.getByTestId('verdict-overall')).toContainText('Passing–Bablok regression of 39 pairs');

  // The first page of the PDF, rendered by Debian's pdftoppm.
  for (const old of readdirSync(SCREENSHOTS).filter((f) => f.startsWith('report-page'))) rmSync(path.join(SCREENSHOTS, old));
  execFileSync('pdftoppm', ['-png', '-r', '70', '-f', '1', '-l', '1', file, path.join(SCREENSHOTS, 'report-page')]);
  const rendered = readdirSync(SCREENSHOTS).filter((f) => /^report-page-0*1\.png$/.test(f));
  expect(rendered).toHaveLength(1);
  expect(statSync(path.join(SCREENSHOTS, rendered[0])).size).toBeGreaterThan(5000);

  // Printed, the review keeps the verdict, caution and signature and drops buttons and navigation.
  await director.emulateMedia({ media: 'print' });
  await expect(director.locator('mat-sidenav')).toBeHidden();
  await expect(block.getByTestId('download-signed-pdf')).toBeHidden();
  await expect(director.getByTestId('review-caution')).toBeVisible();
  await director.emulateMedia({ media: 'screen' });

  // Back on the study page the bar sums up the signature and offers the amendment (opened, then cancelled).
  await director.getByTestId('back-to-study').click();
  const signedBar = director.getByTestId('signoff-bar');
  await expect(signedBar.getByTestId('signoff-state')).toHaveText('Signed');
  await expect(signedBar.getByTestId('signature-summary')).toContainText('Accepted for patient testing — signed by Dr. Imani Okafor');
  await shot(director, 'signoff-bar-signed');
  await expect(signedBar.getByTestId('signoff-state')).toHaveText('Signed');
  await expect(signedBar.getByTestId('step-amend')).toBeVisible();
  await signedBar.getByTestId('step-amend').click();
  await director.getByTestId('reason-confirm').click();
  await expect(director.getByTestId('reason-error')).toHaveText('Reason for the amendment is required.');
  await shot(director, 'amend-dialog');
  await expect(director.getByTestId('reason-error')).toHaveText('Reason for the amendment is required.');
  await director.getByRole('button', { name: 'Cancel' }).click();
  await expect(director.getByRole('dialog')).toHaveCount(0);
  await director.context().close();
});

test('the director returns a study with a comment, the technologist reads it, and criteria moved after plan approval stand out', async ({
  browser, baseURL,
}) => {
  test.setTimeout(240_000);
  const title = `Returned: glucose line 2 against line 1 (${Date.now()})`;
  const id = await preparedStudy(baseURL!, title, true);
  const comment = 'Add five specimens above 20 mmol/L so the range covers the highest decision level.';

  const director = await pageOf(browser, baseURL!, DIRECTOR);
  await director.goto(`/studies/${id}/review`);
  await director.getByTestId('open-return').click();
  await director.getByTestId('reason-confirm').click();
  await expect(director.getByTestId('reason-error')).toHaveText('Comment for the technologist is required.');
  await director.getByTestId('reason-text').fill(comment);
  await shot(director, 'return-dialog');
  await expect(director.getByTestId('reason-text')).toHaveValue(comment);
  await expect(director.getByTestId('reason-error')).toHaveCount(0);
  await director.getByTestId('reason-confirm').click();
  await expect(director.getByRole('dialog')).toHaveCount(0);
  await expect(director.getByTestId('review-state')).toContainText('Draft');
  await expect(director.getByTestId('open-sign')).toHaveCount(0);

  // The technologist sees the comment on the study, prominently, in the sign-off bar.
  const tech = await pageOf(browser, baseURL!, TECH);
  await tech.goto(`/studies/${id}`);
  const bar = tech.getByTestId('signoff-bar');
  await expect(bar.getByTestId('signoff-state')).toHaveText('Draft, returned by the director');
  await expect(bar.getByTestId('return-comment')).toContainText(comment);
  await expect(bar.getByTestId('step-submit')).toBeEnabled();
  await shot(tech, 'signoff-bar-returned');
  await expect(bar.getByTestId('signoff-state')).toHaveText('Draft, returned by the director');
  await expect(bar.getByTestId('return-comment')).toContainText(comment);
  await tech.getByTestId('tab-history').click();
  await expect(tech).toHaveURL(new RegExp(`/studies/${id}/history$`));
  await expect(tech.getByTestId('study-history')).toContainText('Returned to draft by the director');
  await expect(tech.getByTestId('study-history')).toContainText(comment);

  // The director approves the plan on the draft (an electronic signature with the password again).
  await director.goto(`/studies/${id}`);
  await director.getByTestId('signoff-bar').getByTestId('step-approve-plan').click();
  const approve = director.getByRole('dialog');
  await expect(approve.getByTestId('sign-meaning')).toHaveCount(0);
  await approve.getByTestId('sign-password').fill(PASSWORD);
  await shot(director, 'plan-approval-dialog');
  await expect(approve.getByTestId('sign-meaning')).toHaveCount(0);
  await expect(approve.getByTestId('sign-confirm')).toBeEnabled();
  await approve.getByTestId('sign-confirm').click();
  await expect(approve).toHaveCount(0);
  await expect(director.getByTestId('signoff-bar').getByTestId('plan-approved')).toContainText('Plan approved by Dr. Imani Okafor');
  await expect(director.getByTestId('signoff-bar').getByTestId('step-approve-plan')).toHaveCount(0);

  // The technologist moves a criterion after the approval (with the reason the server asks for); the review shows it.
  const api = await ApiUser.signIn(baseURL!, TECH);
  const study = await api.read<StudyAnswer>(`/api/v1/studies/${id}`);
  await api.write('patch', `/api/v1/studies/${id}`, {
    version: study.version, settings: { allowableBiasSource: 'Biological variation, desirable bias (EFLM database, 2026)' },
    reason: 'The laboratory adopted the biological-variation goal',
  });
  await api.dispose();
  await director.goto(`/studies/${id}/review`);
  await expect(director.getByTestId('moved-alert')).toContainText('One criterion change after the plan was approved.');
  const moved = director.getByTestId('moved-criteria');
  await expect(moved).toContainText('Criteria changed after the plan was approved (1)');
  await expect(moved).toContainText('after data were entered');
  await expect(moved).toContainText('The laboratory adopted the biological-variation goal');
  await expect(director.getByTestId('plan-approval')).toContainText('Plan approved by Dr. Imani Okafor');
  await shot(director, 'review-moved-criteria');
  await expect(director.getByTestId('moved-alert')).toContainText('One criterion change after the plan was approved.');
  await expect(moved).toContainText('Criteria changed after the plan was approved (1)');
  await tech.context().close();
  await director.context().close();
});

test('a technologist-director is offered only what they may sign, the review says who may sign before any dialog, and a refused signature reads in words', async ({
  browser, baseURL,
}) => {
  test.setTimeout(300_000);
  const stamp = Date.now();
  const othersTitle = `Entered by the technologist: glucose (${stamp})`;
  const ownTitle = `Entered by the lead: glucose (${stamp})`;
  const others = await preparedStudy(baseURL!, othersTitle, true);
  const own = await preparedStudy(baseURL!, ownTitle, true, LEAD);

  // Under "Awaiting my signature": the technologist's study, not the one whose rows the lead entered.
  const lead = await pageOf(browser, baseURL!, LEAD);
  const awaiting = lead.getByTestId('wl-awaitingSignature');
  await expect(awaiting.getByTestId(`wl-study-${others}`)).toContainText(othersTitle);
  await expect(awaiting.getByTestId(`wl-study-${own}`)).toHaveCount(0);
  await expect(lead.getByTestId('worklist')).not.toContainText(ownTitle);
  await shot(lead, 'worklist-tech-director');
  await expect(awaiting.getByTestId(`wl-study-${others}`)).toContainText(othersTitle);
  await expect(awaiting.getByTestId(`wl-study-${own}`)).toHaveCount(0);

  // The link opens the review, which says who may sign; the exclusion's reason is shown where it is mentioned.
  await awaiting.getByRole('link', { name: othersTitle }).click();
  await expect(lead).toHaveURL(new RegExp(`/studies/${others}/review$`));
  await expect(lead.getByTestId('who-may-sign')).toHaveText('You may sign it. Any director but Tomas Reyes, who entered its rows, may sign it.');
  const sensitivity = lead.getByTestId('sensitivity-panel');
  await expect(sensitivity).toContainText('One row is excluded, for this reason:');
  await expect(sensitivity.getByTestId('exclusion-reason-7')).toHaveText('Row 7 (SO-007): Haemolysed on the candidate run');
  await expect(lead.locator('main')).not.toContainText('Specimens tab');
  await sensitivity.scrollIntoViewIfNeeded();
  await sensitivity.screenshot({ path: path.join(SCREENSHOTS, 'review-exclusion-reasons.png') });
  await expect(sensitivity.getByTestId('exclusion-reason-7')).toHaveText('Row 7 (SO-007): Haemolysed on the candidate run');
  await expect(sensitivity.locator('tbody tr')).not.toHaveCount(0);

  // Its own study: the refusal and its reason before any dialog, and no Sign button; returning stays possible.
  await lead.goto(`/studies/${own}/review`);
  await expect(lead.getByTestId('review-title')).toHaveText(ownTitle);
  await expect(lead.getByTestId('who-may-sign')).toHaveText('You entered rows of this study; this laboratory requires another director to sign it (segregation of duties).');
  await expect(lead.getByTestId('open-sign')).toHaveCount(0);
  await expect(lead.getByTestId('open-return')).toBeVisible();
  await expect(lead.getByRole('dialog')).toHaveCount(0);
  await shot(lead, 'review-who-may-sign');
  await expect(lead.getByTestId('who-may-sign')).toContainText('(segregation of duties)');
  await expect(lead.getByTestId('open-sign')).toHaveCount(0);

  // A wrong password at signing the other study is refused, and recorded on that study in words.
  await lead.goto(`/studies/${others}/review`);
  await lead.getByTestId('open-sign').click();
  const dialog = lead.getByRole('dialog');
  await dialog.getByTestId('meaning-accepted').click();
  await dialog.getByTestId('sign-password').fill('not-the-password');
  await dialog.getByTestId('sign-confirm').click();
  await expect(dialog.getByTestId('password-error')).toHaveText('The password is wrong');
  await dialog.getByRole('button', { name: 'Cancel' }).click();
  await expect(dialog).toHaveCount(0);
  await lead.goto(`/history?studyId=${others}`);
  const refused = lead.locator('[data-action="signature.refused"]');
  await expect(refused).toHaveCount(1);
  await expect(refused).toContainText('Signature refused: wrong password');
  await expect(refused).toContainText('Priya Nair');
  await expect(refused).toContainText('wrong passwords in a row: 1');
  await expect(refused.getByRole('link', { name: `Study ${others}` })).toBeVisible();
  await expect(lead.locator('main')).not.toContainText('wrong-password');
  await shot(lead, 'lab-history-signature-refused');
  await expect(refused).toHaveCount(1);
  await expect(refused).toContainText('Signature refused: wrong password');
  await lead.context().close();
});
