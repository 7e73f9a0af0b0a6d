import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatCheckboxHarness } from '@angular/material/checkbox/testing';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatMenuHarness } from '@angular/material/menu/testing';
import { MatSortHarness } from '@angular/material/sort/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import type { User } from '@shared/schemas';
import { apiError, httpController, noAnimations, provideTestHttp } from '../../../../../testing/http';
import { provideSession, restoreSession, sessionUser } from '../../../../../testing/session-users';
import { Notices } from '../../../../core/notify/notices';
import { UserList } from './user-list';

const user = (over: Partial<User>): User => ({
  id: 1, name: 'Ada', email: 'ada@valeharbor.example', roles: ['technologist'], active: true, hasPassword: true,
  failedSignIns: 0, lockedUntil: null, createdAt: '2026-01-01T00:00:00Z', ...over,
});
const USERS = [
  user({ id: 1, name: 'Bea Director', email: 'bea@valeharbor.example', roles: ['director'] }),
  user({ id: 2, name: 'Al New', email: 'al@valeharbor.example', hasPassword: false }),
  user({ id: 3, name: 'Cy Gone', email: 'cy@valeharbor.example', active: false, roles: ['quality', 'admin'] }),
];

async function setUp() {
  TestBed.configureTestingModule({ providers: [...provideTestHttp(), provideSession(sessionUser(['admin'])), noAnimations] });
  await restoreSession();
  const fixture = TestBed.createComponent(UserList);
  httpController().expectOne({ method: 'GET', url: '/api/v1/users' }).flush(USERS);
  await fixture.whenStable();
  const loader = TestbedHarnessEnvironment.loader(fixture);
  const root = TestbedHarnessEnvironment.documentRootLoader(fixture);
  return { fixture, loader, root };
}

async function cells(loader: Awaited<ReturnType<typeof setUp>>['loader']) {
  const table = await loader.getHarness(MatTableHarness);
  return table.getCellTextByColumnName();
}

describe('UserList', () => {
  afterEach(() => httpController().verify());

  it('lists every user with roles and state in words', async () => {
    const { loader } = await setUp();
    const columns = await cells(loader);
    expect(columns['name'].text).toEqual(['Bea Director', 'Al New', 'Cy Gone']);
    expect(columns['roles'].text).toEqual(['Laboratory director', 'Technologist', 'Quality officer, Administrator']);
    expect(columns['state'].text).toEqual(['Active', 'Invited — no password yet', 'Deactivated']);
  });

  it('filters by role or state and sorts by name', async () => {
    const { loader } = await setUp();
    await (await loader.getHarness(MatInputHarness.with({ selector: '[data-testid="filter"]' }))).setValue('invited');
    expect((await cells(loader))['name'].text).toEqual(['Al New']);
    await (await loader.getHarness(MatInputHarness.with({ selector: '[data-testid="filter"]' }))).setValue('administrator');
    expect((await cells(loader))['name'].text).toEqual(['Cy Gone']);
    await (await loader.getHarness(MatInputHarness.with({ selector: '[data-testid="filter"]' }))).setValue('');
    const [nameHeader] = await (await loader.getHarness(MatSortHarness)).getSortHeaders({ label: 'Name' });
    await nameHeader.click();
    expect((await cells(loader))['name'].text).toEqual(['Al New', 'Bea Director', 'Cy Gone']);
  });

  it('invites a user with the chosen roles and lists the answer', async () => {
    const { loader, root } = await setUp();
    await (await loader.getHarness(MatButtonHarness.with({ text: /Invite a user/ }))).click();
    const dialog = await root.getHarness(MatDialogHarness);
    await (await dialog.getHarness(MatInputHarness.with({ selector: '[data-testid="user-name-input"]' }))).setValue('Dee Tech');
    await (await dialog.getHarness(MatInputHarness.with({ selector: '[data-testid="user-email-input"]' }))).setValue('dee@valeharbor.example');
    await (await dialog.getHarness(MatCheckboxHarness.with({ label: 'Technologist' }))).check();
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Send the invitation' }))).click();
    const req = httpController().expectOne({ method: 'POST', url: '/api/v1/users' });
    expect(req.request.body).toEqual({ name: 'Dee Tech', email: 'dee@valeharbor.example', roles: ['technologist'] });
    req.flush(user({ id: 9, name: 'Dee Tech', email: 'dee@valeharbor.example', hasPassword: false }), { status: 201, statusText: 'Created' });
    expect(await root.getAllHarnesses(MatDialogHarness)).toHaveLength(0);
    expect((await cells(loader))['name'].text).toContain('Dee Tech');
  });

  it('keeps the invitation dialog open and shows the server’s issue on its field', async () => {
    const { fixture, loader, root } = await setUp();
    await (await loader.getHarness(MatButtonHarness.with({ text: /Invite a user/ }))).click();
    const dialog = await root.getHarness(MatDialogHarness);
    await (await dialog.getHarness(MatInputHarness.with({ selector: '[data-testid="user-name-input"]' }))).setValue('Bea Again');
    await (await dialog.getHarness(MatInputHarness.with({ selector: '[data-testid="user-email-input"]' }))).setValue('bea@valeharbor.example');
    await (await dialog.getHarness(MatCheckboxHarness.with({ label: 'Laboratory director' }))).check();
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Send the invitation' }))).click();
    httpController()
      .expectOne('/api/v1/users')
      .flush(apiError('This e-mail is already in use', [{ path: 'email', message: 'A user with this e-mail exists' }]), { status: 409, statusText: 'Conflict' });
    await fixture.whenStable();
    const text = document.querySelector('mat-dialog-container')?.textContent ?? '';
    expect(text).toContain('A user with this e-mail exists');
    expect(text).toContain('This e-mail is already in use');
    expect(await root.getAllHarnesses(MatDialogHarness)).toHaveLength(1);
  });

  it('refuses to send an invitation without a role', async () => {
    const { loader, root } = await setUp();
    await (await loader.getHarness(MatButtonHarness.with({ text: /Invite a user/ }))).click();
    const dialog = await root.getHarness(MatDialogHarness);
    await (await dialog.getHarness(MatInputHarness.with({ selector: '[data-testid="user-name-input"]' }))).setValue('No Role');
    await (await dialog.getHarness(MatInputHarness.with({ selector: '[data-testid="user-email-input"]' }))).setValue('nr@valeharbor.example');
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Send the invitation' }))).click();
    httpController().expectNone('/api/v1/users');
    expect(document.querySelector('mat-dialog-container')?.textContent).toContain('Choose at least one role.');
  });

  it('deactivates a user after asking, with PATCH { active: false }', async () => {
    const { loader, root } = await setUp();
    const menus = await loader.getAllHarnesses(MatMenuHarness);
    await menus[0].open();
    await menus[0].clickItem({ text: /Deactivate/ });
    await (await root.getHarness(MatButtonHarness.with({ selector: '[data-testid="confirm"]' }))).click();
    const req = httpController().expectOne({ method: 'PATCH', url: '/api/v1/users/1' });
    expect(req.request.body).toEqual({ active: false });
    req.flush({ ...USERS[0], active: false });
    expect((await cells(loader))['state'].text[0]).toBe('Deactivated');
  });

  it('offers to send the invitation again only to an active user without a password', async () => {
    const { loader } = await setUp();
    const menus = await loader.getAllHarnesses(MatMenuHarness);
    await menus[1].open();
    await menus[1].clickItem({ text: /Send the invitation again/ });
    httpController().expectOne({ method: 'POST', url: '/api/v1/users/2/invitation' }).flush(null, { status: 204, statusText: 'No Content' });
    await menus[0].open();
    const items = await Promise.all((await menus[0].getItems()).map((item) => item.getText()));
    expect(items.some((t) => t.includes('Send the invitation again'))).toBe(false);
  });

  it('sends a password link to an active user with a password, and says where it went', async () => {
    const { loader } = await setUp();
    const menus = await loader.getAllHarnesses(MatMenuHarness);
    await menus[0].open();
    await menus[0].clickItem({ text: /Send a password link/ });
    httpController().expectOne({ method: 'POST', url: '/api/v1/users/1/password-link' }).flush(null, { status: 204, statusText: 'No Content' });
    expect(TestBed.inject(Notices).message()).toBe('A password link is on its way to bea@valeharbor.example; it works once, for one hour.');
    for (const menu of [menus[1], menus[2]]) {
      await menu.open();
      const items = await Promise.all((await menu.getItems()).map((item) => item.getText()));
      expect(items.some((t) => t.includes('Send a password link'))).toBe(false);
      await menu.close();
    }
  });

  it('shows the server’s words when a password link is refused', async () => {
    const { loader } = await setUp();
    const [menu] = await loader.getAllHarnesses(MatMenuHarness);
    await menu.open();
    await menu.clickItem({ text: /Send a password link/ });
    httpController().expectOne('/api/v1/users/1/password-link')
      .flush(apiError('Bea Director is deactivated; reactivate the account before sending a password link'), { status: 400, statusText: 'Bad Request' });
    expect(TestBed.inject(Notices).message()).toBe('Bea Director is deactivated; reactivate the account before sending a password link');
  });
});
