import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import type { Role } from '@shared/schemas';
import { apiError, httpController, noAnimations, provideTestHttp } from '../../../../testing/http';
import { provideSession, restoreSession, sessionUser } from '../../../../testing/session-users';
import { release, templates } from '../release-fixtures.testing';
import { CreateReleaseData, CreateReleaseDialog } from './create-release-dialog';

async function open(roles: Role[], data: CreateReleaseData = {}) {
  const close = jest.fn();
  TestBed.configureTestingModule({
    providers: [
      ...provideTestHttp(), noAnimations, ...provideSession(sessionUser(roles)),
      { provide: MAT_DIALOG_DATA, useValue: data },
      { provide: MatDialogRef, useValue: { close } },
    ],
  });
  await restoreSession();
  const fixture = TestBed.createComponent(CreateReleaseDialog);
  await fixture.whenStable();
  httpController().expectOne('/api/v1/analytes').flush([
    { id: 3, name: 'Glucose', unit: 'mmol/L', active: true }, { id: 4, name: 'Urea', unit: 'mmol/L', active: false },
  ]);
  httpController().expectOne('/api/v1/instruments').flush([{ id: 5, name: 'Chemistry line 2', active: true }, { id: 6, name: 'Chemistry line 1', active: true }]);
  httpController().expectOne('/api/v1/release-templates').flush(templates());
  await fixture.whenStable();
  const loader = TestbedHarnessEnvironment.loader(fixture);
  const el = fixture.nativeElement as HTMLElement;
  const q = (id: string) => el.querySelector(`[data-testid="${id}"]`) as HTMLElement | null;
  const select = async (id: string, text: string | RegExp) => {
    const s = await loader.getHarness(MatSelectHarness.with({ selector: `[data-testid="${id}"]` }));
    await s.open();
    await s.clickOptions({ text });
    await fixture.whenStable();
  };
  const write = async (id: string, value: string) => (await loader.getHarness(MatInputHarness.with({ selector: `[data-testid="${id}"]` }))).setValue(value);
  const create = async () => {
    (document.querySelector('[data-testid="create-release"]') as HTMLButtonElement).click();
    await fixture.whenStable();
  };
  return { fixture, el, q, select, write, create, close };
}

describe('CreateReleaseDialog', () => {
  afterEach(() => httpController().verify());

  it('shows what the chosen change needs from the laboratory’s template, read-only', async () => {
    const { q, select } = await open(['technologist']);
    expect(q('create-template')).toBeNull();
    await select('create-change-type', 'New measuring system');
    expect(q('template-requirement-comparison')?.textContent).toBe('Comparison with the current method: Method comparison — At least 40 specimens');
    expect(q('template-requirement-precision')?.textContent).toContain('Precision: Precision verification');
    expect(q('create-template')?.textContent).toContain('Yearly comparison after 12 months');
    expect(q('create-template')?.querySelector('input')).toBeNull();
    await select('create-change-type', 'New reagent lot');
    expect(q('template-requirement-lot-comparison')).not.toBeNull();
    expect(q('template-requirement-comparison')).toBeNull();
  });

  it('offers only analytes in use and refuses to create without a title, analyte and instrument', async () => {
    const { fixture, el, q, select, create, close } = await open(['technologist']);
    const analytes = await TestbedHarnessEnvironment.loader(fixture).getHarness(MatSelectHarness.with({ selector: '[data-testid="create-analyte"]' }));
    await analytes.open();
    expect(await Promise.all((await analytes.getOptions()).map((o) => o.getText()))).toEqual(['Glucose (mmol/L)']);
    await analytes.close();
    await select('create-change-type', 'Relocated instrument');
    await create();
    httpController().expectNone('/api/v1/releases');
    expect(q('create-title-error')?.textContent).toBe('Give the release a title');
    expect(el.textContent).toContain('The analyte is required.');
    expect(el.textContent).toContain('The instrument is required.');
    expect(close).not.toHaveBeenCalled();
  });

  it('creates a release with what was filled in and closes with it', async () => {
    const { select, write, create, close } = await open(['technologist']);
    await select('create-change-type', 'New measuring system');
    await write('create-title', '  Glucose on chemistry line 2 ');
    await select('create-analyte', 'Glucose (mmol/L)');
    await select('create-instrument', 'Chemistry line 2');
    await select('create-comparative', 'Chemistry line 1');
    await write('create-lot', 'LOT-24117');
    await create();
    const req = httpController().expectOne({ method: 'POST', url: '/api/v1/releases' });
    expect(req.request.body).toEqual({
      changeType: 'new-system', title: 'Glucose on chemistry line 2', analyteId: 3, instrumentId: 5, comparativeInstrumentId: 6,
      reagentLot: 'LOT-24117', note: '',
    });
    req.flush(release(), { status: 201, statusText: 'Created' });
    expect(close).toHaveBeenCalledWith(expect.objectContaining({ id: 7 }));
  });

  it('lets a director pick the requirements of an other change, and needs at least one', async () => {
    const { q, select, write, create, fixture } = await open(['director']);
    await select('create-change-type', /Other change/);
    await write('create-title', 'Glucose: new sample tubes');
    await select('create-analyte', 'Glucose (mmol/L)');
    await select('create-instrument', 'Chemistry line 2');
    await create();
    httpController().expectNone('/api/v1/releases');
    expect(q('banner')?.textContent).toContain('Name at least one requirement');
    (q('requirement-add') as HTMLButtonElement).click();
    await fixture.whenStable();
    await write('requirement-label-0', 'Tube comparison');
    await select('requirement-kinds-0', 'Method comparison');
    await create();
    const req = httpController().expectOne('/api/v1/releases');
    expect(req.request.body.requirements).toEqual([{ key: 'tube-comparison', label: 'Tube comparison', kinds: ['method-comparison'], rule: '' }]);
    req.flush(release({ changeType: 'custom' }));
  });

  it('leaves the requirements of a technologist’s other change to a director', async () => {
    const { q, select, write, create } = await open(['technologist']);
    await select('create-change-type', /Other change/);
    expect(q('create-custom-note')?.textContent).toContain('A director picks the requirements');
    expect(q('requirement-add')).toBeNull();
    await write('create-title', 'Glucose: new sample tubes');
    await select('create-analyte', 'Glucose (mmol/L)');
    await select('create-instrument', 'Chemistry line 2');
    await create();
    const req = httpController().expectOne('/api/v1/releases');
    expect(req.request.body.requirements).toBeUndefined();
    req.flush(release({ changeType: 'custom' }));
  });

  it('starts from a due item: filled in, and the item sent with the release', async () => {
    const { q, select, create } = await open(['director'], { dueItemId: 12, dueLabel: 'Yearly comparison', analyteId: 3, instrumentId: 5, title: 'Yearly comparison: Glucose' });
    expect(q('create-from-due')?.textContent).toContain('Yearly comparison');
    await select('create-change-type', 'New reagent lot');
    await create();
    const req = httpController().expectOne('/api/v1/releases');
    expect(req.request.body).toEqual(expect.objectContaining({ dueItemId: 12, analyteId: 3, instrumentId: 5, title: 'Yearly comparison: Glucose', changeType: 'reagent-lot' }));
    req.flush(release());
  });

  it('shows the server’s issue on its field', async () => {
    const { fixture, q, select, write, create, close } = await open(['technologist']);
    await select('create-change-type', 'New measuring system');
    await write('create-title', 'Glucose on line 2');
    await select('create-analyte', 'Glucose (mmol/L)');
    await select('create-instrument', 'Chemistry line 2');
    await create();
    httpController().expectOne('/api/v1/releases').flush(
      apiError('The release was not created', [{ path: 'title', message: 'An open release of this analyte and instrument has that title' }]),
      { status: 400, statusText: 'Bad Request' },
    );
    await fixture.whenStable();
    expect(q('create-title-error')?.textContent).toBe('An open release of this analyte and instrument has that title');
    expect(close).not.toHaveBeenCalled();
  });
});
