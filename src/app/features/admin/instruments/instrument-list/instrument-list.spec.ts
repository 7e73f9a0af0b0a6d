import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import type { Instrument } from '@shared/schemas';
import { apiError, httpController, noAnimations, provideTestHttp } from '../../../../../testing/http';
import { InstrumentList } from './instrument-list';

const LINE_2: Instrument = { id: 2, name: 'Chemistry line 2', model: 'Model X', serial: 'SN-42', location: 'Core lab', active: true };

async function setUp() {
  TestBed.configureTestingModule({ providers: [...provideTestHttp(), noAnimations] });
  const fixture = TestBed.createComponent(InstrumentList);
  await fixture.whenStable();
  httpController().expectOne({ method: 'GET', url: '/api/v1/instruments' }).flush([LINE_2]);
  await fixture.whenStable();
  return { fixture, loader: TestbedHarnessEnvironment.loader(fixture), root: TestbedHarnessEnvironment.documentRootLoader(fixture) };
}

describe('InstrumentList', () => {
  afterEach(() => httpController().verify());

  it('lists instruments with model, serial number and location', async () => {
    const { loader } = await setUp();
    const [row] = await (await loader.getHarness(MatTableHarness)).getRows();
    expect(await row.getCellTextByIndex()).toEqual(['Chemistry line 2', 'Model X', 'SN-42', 'Core lab', 'Yes', 'edit']);
  });

  it('moves an instrument with PUT and shows the new location', async () => {
    const { loader, root } = await setUp();
    await (await loader.getHarness(MatButtonHarness.with({ selector: '[data-testid="edit"]' }))).click();
    const dialog = await root.getHarness(MatDialogHarness);
    await (await dialog.getHarness(MatInputHarness.with({ selector: '[data-testid="instrument-location"]' }))).setValue(' Stat lab ');
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Save' }))).click();
    const req = httpController().expectOne({ method: 'PUT', url: '/api/v1/instruments/2' });
    expect(req.request.body).toEqual({ ...LINE_2, id: undefined, location: 'Stat lab' });
    req.flush({ ...LINE_2, location: 'Stat lab' });
    const [row] = await (await loader.getHarness(MatTableHarness)).getRows();
    expect((await row.getCellTextByColumnName())['location']).toBe('Stat lab');
  });

  it('shows a server refusal on the name field and keeps the dialog open', async () => {
    const { fixture, loader, root } = await setUp();
    await (await loader.getHarness(MatButtonHarness.with({ text: /Add an instrument/ }))).click();
    const dialog = await root.getHarness(MatDialogHarness);
    await (await dialog.getHarness(MatInputHarness.with({ selector: '[data-testid="instrument-name"]' }))).setValue('Chemistry line 2');
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Save' }))).click();
    httpController()
      .expectOne({ method: 'POST', url: '/api/v1/instruments' })
      .flush(apiError('Check the fields', [{ path: 'name', message: 'An instrument with this name exists' }]), { status: 409, statusText: 'Conflict' });
    await fixture.whenStable();
    expect(document.querySelector('mat-dialog-container mat-error')?.textContent).toContain('An instrument with this name exists');
  });
});
