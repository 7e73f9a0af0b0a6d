import { expect, test } from '@playwright/test';
import { execFileSync } from 'node:child_process';
import { mkdirSync, readdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { addDays } from '@shared/types/due-dates';
import { apiAs, send, signedStudy } from './fixtures/api';
import { fullShot, SCREENSHOTS, signIn } from './fixtures/pages';

const OUT = path.resolve(__dirname, '../.test-output');

test.beforeEach(() => {
  mkdirSync(SCREENSHOTS, { recursive: true });
});

/**
 * A director releases a new reagent lot for patient testing, from the board to the signed PDF. Before the page is
 * opened, a technologist created the lot change and linked the lot comparison, which the director had signed
 * (through the API, as in the audit journey); an overdue item of the demo's released glucose system is seen too.
 */
test('a director releases a reagent lot from the board and opens the signed release PDF', async ({ page, baseURL }) => {
  test.setTimeout(240_000);
  const stamp = Date.now();
  const title = `Glucose reagent lot GLU-5${String(stamp).slice(-3)} on Chemistry line 2`;
  const studyId = await signedStudy(baseURL!, `Lot comparison GLU-5${String(stamp).slice(-3)} (${stamp})`);
  const tech = await apiAs(baseURL!, 'tech@valeharbor.example');
  const analytes: { id: number; name: string; unit: string }[] = await (await tech.get('/api/v1/analytes')).json();
  const instruments: { id: number; name: string }[] = await (await tech.get('/api/v1/instruments')).json();
  const release = await send(tech, 'post', '/api/v1/releases', {
    changeType: 'reagent-lot', title, analyteId: analytes.find((a) => a.name === 'Glucose' && a.unit === 'mmol/L')!.id,
    instrumentId: instruments.find((i) => i.name === 'Chemistry line 2')!.id, reagentLot: `GLU-5${String(stamp).slice(-3)}`,
  });
  await send(tech, 'post', `/api/v1/releases/${release.id}/studies`, { requirement: 'lot-comparison', studyId });
  await tech.dispose();

  // A re-verification the demo release set due is brought forward by the director, so it is overdue (the suites
  // before this one may have started or finished others), and the Worklist says so.
  const director = await apiAs(baseURL!, 'director@valeharbor.example');
  const due: { id: number; state: string; label: string; dueDate: string; daysLeft: number; version: number }[] = await (await director.get('/api/v1/due?status=pending')).json();
  const item = due.find((d) => d.state === 'open')!;
  const today = addDays(item.dueDate, -item.daysLeft);
  const moved = await send(director, 'patch', `/api/v1/due/${item.id}`, { version: item.version, dueDate: addDays(today, -3), reason: 'Brought forward after a quality-control shift (invented)' });
  expect(moved.dueWords).toBe('overdue by 3 days');
  await director.dispose();
  await signIn(page, 'director@valeharbor.example');
  const overdue = page.getByTestId('due-item').filter({ hasText: item.label });
  await expect(overdue).toContainText(/overdue by 3 days/);
  await fullShot(page, 'release-worklist-due.png');
  await expect(overdue).toContainText(/overdue by 3 days/);

  // The list of releases, then the new lot change's board: its one requirement is met by the signed comparison.
  await page.getByTestId('nav-releases').click();
  await page.getByTestId('release-q').fill(title);
  await expect(page.getByTestId(`release-open-${release.id}`)).toBeVisible();
  await expect(page.getByTestId(`release-met-${release.id}`)).toContainText('1 of 1');
  await fullShot(page, 'release-list.png');
  await expect(page.getByTestId(`release-open-${release.id}`)).toBeVisible();
  await expect(page.getByTestId(`release-met-${release.id}`)).toContainText('1 of 1');
  await page.getByTestId(`release-open-${release.id}`).click();
  await expect(page.getByTestId('release-title')).toHaveText(title);
  await expect(page.getByTestId('release-state')).toContainText('Open');
  await expect(page.getByTestId('requirement-status-lot-comparison')).toContainText('Met');
  await expect(page.getByTestId('requirement-lot-comparison')).toContainText(`study ${studyId}, Method comparison, n = 40`);
  await expect(page.getByTestId('requirement-lot-comparison')).toContainText(/PX-[A-Z2-9]{4}-[A-Z2-9]{4}/);
  await expect(page.getByTestId('release-caution')).toContainText(/decision support.*director's judgement.*accreditation/);
  await expect(page.getByTestId('release-who-may-sign')).toContainText('You may sign it');

  // Released needs a go-live date: the panel says so before the server is asked.
  await page.getByTestId('release-meaning-released').click();
  await page.getByTestId('release-password').fill('parallax-demo');
  await page.getByTestId('sign-release').click();
  await expect(page.getByTestId('release-go-live-error')).toBeVisible();
  await page.getByTestId('release-go-live').fill('2026-12-14');
  await page.getByTestId('release-comment').fill('Lot comparison within the goal; the new lot goes into use on Monday.');
  await fullShot(page, 'release-board-ready.png');
  await expect(page.getByTestId('release-go-live')).toHaveValue('2026-12-14');
  await expect(page.getByTestId('release-go-live-error')).toHaveCount(0);
  await expect(page.getByTestId('requirement-status-lot-comparison')).toContainText('Met');
  await expect(page.getByTestId('release-caution')).toContainText(/decision support.*director's judgement.*accreditation/);
  await page.getByTestId('sign-release').click();
  await expect(page.getByTestId('release-state')).toContainText('Released for patient testing', { timeout: 30_000 });
  const code = (await page.getByTestId('release-verification-code').first().textContent())!.match(/PX-[A-Z2-9]{4}-[A-Z2-9]{4}/)![0];
  await expect(page.getByTestId('sign-panel')).toHaveCount(0);
  await fullShot(page, 'release-board-signed.png');
  await expect(page.getByTestId('release-state')).toContainText('Released for patient testing');
  await expect(page.getByTestId('release-verification-code').first()).toContainText(code);

  // The signed PDF: the link says so, and the document carries the decision, the component and the caution.
  const pdfLink = page.getByTestId('release-pdf');
  await expect(pdfLink).toContainText('Signed PDF');
  const response = await page.request.get((await pdfLink.getAttribute('href'))!);
  expect(response.status()).toBe(200);
  mkdirSync(path.join(OUT, 'downloads'), { recursive: true });
  const file = path.join(OUT, 'downloads', `release-${release.id}.pdf`);
  writeFileSync(file, await response.body());
  const text = execFileSync('pdftotext', ['-layout', file, '-'], { encoding: 'utf8' }).replace(/\s+/g, ' ');
  expect(text).toContain('Released for patient testing');
  expect(text).toContain('Go-live date 2026-12-14');
  expect(text).toContain(title);
  expect(text).toContain(`Verification code ${code}`);
  expect(text).toContain('Lot comparison within the goal');
  expect(text).toMatch(/Median bias .* n = 40/);
  expect(text).toMatch(/Decision support only/);
  execFileSync('pdftoppm', ['-png', '-r', '70', file, path.join(SCREENSHOTS, 'release-report-page')]);
  expect(readdirSync(SCREENSHOTS).filter((f) => /^release-report-page-0*1\.png$/.test(f))).toHaveLength(1);

  // The release is found again by its verification code, signed.
  await page.getByTestId('back-to-releases').click();
  await page.getByTestId('release-q').fill(code.toLowerCase());
  await expect(page.getByTestId(`release-code-${release.id}`)).toHaveText(code);
});
