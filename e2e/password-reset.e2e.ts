import { expect, test, type APIRequestContext } from '@playwright/test';
import { shoot, signInHere } from './fixtures/pages';



/** The administrator's API session (its own cookies, apart from the page's): for setting up a user and reading the mailbox. */
async function adminApi(request: APIRequestContext) {
  await request.get('/api/v1/session');
  const cookie = (await request.storageState()).cookies.find((c) => c.name === 'XSRF-TOKEN')!;
  const headers = { 'X-XSRF-TOKEN': decodeURIComponent(cookie.value) };
  expect((await request.post('/api/v1/session', { headers, data: { email: 'admin@valeharbor.example', password: 'parallax-demo' } })).status()).toBe(200);
  /** The path of the set-password link in the newest mail to `email` whose subject starts with `subject`. */
  const linkInMail = async (email: string, subject: string): Promise<string> => {
    let found = '';
    await expect(async () => {
      const mail = (await (await request.get('/api/v1/mailbox')).json()) as { id: number; to: string[]; subject: string; text: string }[];
      const hit = mail.filter((m) => m.to.includes(email) && m.subject.startsWith(subject)).sort((a, b) => b.id - a.id)[0];
      expect(hit).toBeDefined();
      found = /\/set-password\/[A-Za-z0-9_-]+/.exec(hit.text)![0];
    }).toPass({ timeout: 30_000 });
    return found;
  };
  /** A technologist with a password of their own, made through the invitation. */
  const userWithPassword = async (name: string, password: string): Promise<string> => {
    const email = `${name.toLowerCase().replace(/\W+/g, '.')}.${Date.now()}@valeharbor.example`;
    expect((await request.post('/api/v1/users', { headers, data: { name, email, roles: ['technologist'] } })).status()).toBe(201);
    const invitation = await linkInMail(email, 'Your Parallax account');
    const token = invitation.split('/').pop();
    expect((await request.post(`/api/v1/password-links/${token}`, { headers, data: { password } })).status()).toBe(204);
    return email;
  };
  return { linkInMail, userWithPassword };
}

test('a technologist who forgot the password asks for a link, sets a new password from the e-mail and signs in', async ({ page, request }) => {
  const api = await adminApi(request);
  const email = await api.userWithPassword('Rhea Forgetful', `old-harbour-${Date.now()}`);
  const password = `new-harbour-${Date.now()}-tide`;

  await page.goto('/sign-in');
  await page.getByTestId('email').fill(email);
  await page.getByTestId('forgot-password').click();
  await expect(page).toHaveURL(/\/forgot-password\?email=/);
  await expect(page.getByTestId('email')).toHaveValue(email);
  await page.getByTestId('send-link').click();
  await expect(page.getByTestId('banner')).toContainText('If an account uses this address, a link is on its way; it works once, for one hour.');
  await shoot(page, 'forgot-password');

  const link = await api.linkInMail(email, 'A link to choose a new Parallax password');
  await page.goto(link);
  await expect(page.getByRole('heading', { name: 'Choose a new password' })).toBeVisible();
  await expect(page.getByTestId('link-for')).toContainText(email);
  await page.getByTestId('new-password').fill(password);
  await page.getByTestId('repeat-password').fill(password);
  await page.getByTestId('save-password').click();

  await expect(page).toHaveURL(/\/sign-in/);
  await expect(page.getByTestId('email')).toHaveValue(email);
  await expect(page.getByText('Your password is set.')).toBeVisible();
  await signInHere(page, email, password);
  await expect(page.getByTestId('user-name')).toHaveText('Rhea Forgetful');

  // The link works once.
  await page.goto(link);
  await expect(page.getByTestId('banner')).toContainText('This link is not valid or has expired');
});

test('an administrator sends a user a password link from the user list', async ({ page, request }) => {
  const api = await adminApi(request);
  const email = await api.userWithPassword('Otto Locked', `old-harbour-${Date.now()}`);

  await page.goto('/sign-in');
  await signInHere(page, 'admin@valeharbor.example', 'parallax-demo');
  await page.getByTestId('nav-users').click();
  const row = page.getByTestId(`user-${email}`);
  await row.getByTestId('user-actions').click();
  const item = page.getByTestId('send-password-link');
  await expect(item).toBeVisible();
  await shoot(page, 'admin-send-password-link');
  await item.click();
  await expect(page.locator('mat-snack-bar-container')).toContainText(`A password link is on its way to ${email}; it works once, for one hour.`);

  const link = await api.linkInMail(email, 'A link to choose a new Parallax password');
  // The next person to sign in on this browser does not see the administrator's "You are signed out.".
  await page.getByTestId('sign-out').click();
  await expect(page).toHaveURL(/\/sign-in/);
  await signInHere(page, 'tech@valeharbor.example', 'parallax-demo');
  await expect(page.getByText('You are signed out.')).toHaveCount(0);
  await page.goto(link);
  await expect(page.getByRole('heading', { name: 'Choose a new password' })).toBeVisible();
  await expect(page.getByTestId('link-for')).toContainText('Otto Locked');
});
