import { expect, test, type Page } from '@playwright/test';
import path from 'node:path';
import type { Role } from '@shared/schemas/roles';
import { navigationFor } from '../src/app/core/layout/navigation';

const SCREENSHOTS = path.resolve(__dirname, '../.test-output/screenshots');
const ADMIN_PAGES = ['nav-users', 'nav-analytes', 'nav-instruments', 'nav-mailbox'];

/** The demo sign-ins with their roles (as the seed gives them) and how the toolbar names them. */
const DEMO: { email: string; roles: Role[]; named: string }[] = [
  { email: 'tech@valeharbor.example', roles: ['technologist'], named: 'Technologist' },
  { email: 'director@valeharbor.example', roles: ['director'], named: 'Laboratory director' },
  { email: 'quality@valeharbor.example', roles: ['quality'], named: 'Quality officer' },
  { email: 'admin@valeharbor.example', roles: ['admin'], named: 'Administrator' },
  { email: 'lead@valeharbor.example', roles: ['technologist', 'director'], named: 'Technologist, Laboratory director' },
];

async function signIn(page: Page, email: string, password = 'parallax-demo'): Promise<void> {
  await page.goto('/sign-in');
  await page.getByTestId('email').fill(email);
  await page.getByTestId('password').fill(password);
  await page.getByTestId('sign-in').click();
  await expect(page.getByTestId('welcome')).toBeVisible();
}

const navIds = (page: Page) =>
  page.locator('nav [data-testid^="nav-"]').evaluateAll((links) => links.map((a) => a.getAttribute('data-testid')));

for (const demo of DEMO) {
  test(`${demo.email} signs in and sees exactly the navigation of their roles`, async ({ page }) => {
    await signIn(page, demo.email);
    await expect(page.getByTestId('lab-name')).toHaveText('Vale Harbor Regional Laboratory');
    await expect(page.getByTestId('user-roles')).toHaveText(demo.named);
    const shown = await navIds(page);
    // Exactly the entries the navigation table gives these roles, in its order ...
    expect(shown).toEqual(navigationFor(demo.roles).map((item) => `nav-${item.id}`));
    // ... which always include the worklist and the profile, and the admin pages only for an administrator.
    expect(shown.slice(0, 1)).toEqual(['nav-worklist']);
    expect(shown).toContain('nav-profile');
    expect(shown.filter((id) => ADMIN_PAGES.includes(id!))).toEqual(demo.roles.includes('admin') ? ADMIN_PAGES : []);
  });
}

test('a user without the admin role who opens an admin address is sent home with a message', async ({ page }) => {
  await signIn(page, 'tech@valeharbor.example');
  await page.goto('/admin/users');
  await expect(page).toHaveURL(/\/$/);
  await expect(page.locator('mat-snack-bar-container')).toContainText('Your roles do not include that page.');
});

test('a wrong password is refused in words and nothing is signed in', async ({ page }) => {
  await page.goto('/sign-in');
  // An address of no account, so the demo accounts' failed-sign-in counts stay as they are.
  await page.getByTestId('email').fill(`nobody.${Date.now()}@valeharbor.example`);
  await page.getByTestId('password').fill('not-the-password');
  await page.getByTestId('sign-in').click();
  await expect(page.getByTestId('banner')).toContainText(/wrong/i);
  await expect(page).toHaveURL(/\/sign-in/);
});

/** A screenshot once the web fonts (text and icons) have loaded. */
async function shoot(page: Page, name: string): Promise<void> {
  await page.evaluate(async () => {
    await document.fonts.ready;
    await Promise.all(document.getAnimations().map((animation) => animation.finished.catch(() => undefined)));
  });
  await page.screenshot({ path: `${SCREENSHOTS}/${name}.png` });
}

test('every request of every page goes to the app’s own address, and the pages look right', async ({ page, baseURL }) => {
  const requests: string[] = [];
  const blocked: string[] = [];
  page.on('request', (request) => requests.push(request.url()));
  page.on('console', (message) => {
    if (message.type() === 'error' && message.text().includes('Content Security Policy')) blocked.push(message.text());
  });
  await page.goto('/sign-in');
  await expect(page.getByTestId('sign-in-form')).toBeVisible();
  await shoot(page, 'sign-in');
  await expect(page.getByRole('heading', { level: 1 })).toHaveText('Parallax');
  await expect(page.getByTestId('sign-in')).toBeEnabled();
  await signIn(page, 'admin@valeharbor.example');
  await shoot(page, 'shell');
  await expect(page.getByTestId('welcome')).toHaveText(/^Welcome, /);
  await expect(page.getByTestId('nav-users')).toBeVisible();
  const pages = [
    { nav: 'nav-profile', heading: 'Profile', shot: 'profile' },
    { nav: 'nav-users', heading: 'Users', shot: 'users' },
    { nav: 'nav-analytes', heading: 'Analytes', shot: 'analytes' },
    { nav: 'nav-instruments', heading: 'Instruments', shot: 'instruments' },
    { nav: 'nav-mailbox', heading: 'Mailbox', shot: 'mailbox' },
  ];
  for (const p of pages) {
    await page.getByTestId(p.nav).click();
    await expect(page.getByRole('heading', { level: 1, name: p.heading })).toBeVisible();
    await expect(page.locator('mat-progress-bar')).toHaveCount(0);
    await shoot(page, p.shot);
    await expect(page.getByRole('heading', { level: 1 })).toHaveText(p.heading);
    await expect(page.getByTestId('banner')).toHaveCount(0);
  }
  await page.getByTestId('nav-analytes').click();
  await page.getByTestId('edit').first().click();
  await expect(page.getByRole('dialog')).toBeVisible();
  await shoot(page, 'analyte-dialog');
  await expect(page.getByRole('dialog').getByRole('heading', { level: 2 })).toHaveText(/^Edit /);
  await page.keyboard.press('Escape');
  await page.getByTestId('sign-out').click();
  await expect(page).toHaveURL(/\/sign-in/);
  const foreign = requests.filter((url) => !url.startsWith(baseURL!) && !url.startsWith('data:'));
  expect(requests.length).toBeGreaterThan(10);
  expect(foreign).toEqual([]);
  expect(blocked).toEqual([]);
});
