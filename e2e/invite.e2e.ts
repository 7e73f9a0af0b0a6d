import { expect, test } from '@playwright/test';
import { shoot, signInHere } from './fixtures/pages';
import { navigationFor } from '../src/app/core/layout/navigation';



test('an administrator invites a technologist, who sets a password from the e-mail and signs in', async ({ page }) => {
  const email = `new.tech.${Date.now()}@valeharbor.example`;
  const password = `harbour-${Date.now()}-lights`;

  await page.goto('/sign-in');
  await signInHere(page, 'admin@valeharbor.example', 'parallax-demo');
  await page.getByTestId('nav-users').click();
  await page.getByTestId('invite-user').click();
  const dialog = page.getByRole('dialog');
  const nameInput = dialog.getByTestId('user-name-input');
  const emailInput = dialog.getByTestId('user-email-input');
  // The dialog moves focus to its first field when its opening animation ends; text typed before that can land in
  // the name field (seen once under load), so fill until both fields hold what was typed.
  await expect(async () => {
    await nameInput.fill('Noor Newcomer');
    await emailInput.fill(email);
    await expect(nameInput).toHaveValue('Noor Newcomer', { timeout: 1000 });
    await expect(emailInput).toHaveValue(email, { timeout: 1000 });
  }).toPass();
  await dialog.getByTestId('role-technologist').getByRole('checkbox').check();
  await shoot(page, 'invite-dialog');
  await dialog.getByTestId('user-save').click();
  await expect(dialog).toBeHidden();
  const row = page.getByTestId(`user-${email}`);
  await expect(row).toContainText('Invited — no password yet');
  await expect(row).toContainText('Technologist');

  await page.getByTestId('nav-mailbox').click();
  const message = page.getByTestId('mail-list').getByRole('button').filter({ hasText: email });
  await expect(async () => {
    await page.getByTestId('mailbox-refresh').click();
    await expect(message.first()).toBeVisible({ timeout: 2_000 });
  }).toPass({ timeout: 30_000 });
  await message.first().click();
  const link = page.getByTestId('mail-body').locator('a[href*="/set-password/"]');
  await expect(link).toHaveCount(1);
  await shoot(page, 'mailbox-invitation');
  const href = await link.getAttribute('href');
  await link.click();

  await expect(page).toHaveURL(/\/set-password\//);
  await expect(page.getByTestId('link-for')).toContainText(email);
  await page.getByTestId('new-password').fill(password);
  await page.getByTestId('repeat-password').fill(password);
  await shoot(page, 'set-password');
  await page.getByTestId('save-password').click();

  await expect(page).toHaveURL(/\/sign-in/);
  await expect(page.getByTestId('email')).toHaveValue(email);
  await expect(page.getByText('Your password is set.')).toBeVisible();
  await signInHere(page, email, password);
  await expect(page.getByTestId('user-name')).toHaveText('Noor Newcomer');
  const shown = await page.locator('nav [data-testid^="nav-"]').evaluateAll((links) => links.map((a) => a.getAttribute('data-testid')));
  expect(shown).toEqual(navigationFor(['technologist']).map((item) => `nav-${item.id}`));
  expect(shown).not.toContain('nav-users');

  // The link works once.
  await page.goto(href!);
  await expect(page.getByTestId('banner')).toContainText('This link is not valid or has expired');
});
