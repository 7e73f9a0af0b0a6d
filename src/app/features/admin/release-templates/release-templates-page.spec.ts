import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { apiError, httpController, noAnimations, provideTestHttp } from '../../../../testing/http';
import { provideSession, restoreSession, sessionUser } from '../../../../testing/session-users';
import { templates } from '../../releases/release-fixtures.testing';
import { ReleaseTemplatesPage } from './release-templates-page';

async function open() {
  TestBed.configureTestingModule({ providers: [...provideTestHttp(), noAnimations, ...provideSession(sessionUser(['admin']))] });
  await restoreSession();
  const fixture = TestBed.createComponent(ReleaseTemplatesPage);
  await fixture.whenStable();
  httpController().expectOne({ method: 'GET', url: '/api/v1/release-templates' }).flush(templates());
  await fixture.whenStable();
  const loader = TestbedHarnessEnvironment.loader(fixture);
  const el = fixture.nativeElement as HTMLElement;
  const q = (id: string) => el.querySelector(`[data-testid="${id}"]`) as HTMLElement | null;
  const click = async (id: string) => {
    (q(id) as HTMLElement).click();
    await fixture.whenStable();
  };
  const write = async (id: string, value: string) => (await loader.getHarness(MatInputHarness.with({ selector: `[data-testid="${id}"]` }))).setValue(value);
  return { fixture, el, q, click, write, loader };
}

describe('ReleaseTemplatesPage', () => {
  afterEach(() => httpController().verify());

  it('lists the four change types with the studies each needs and the re-verifications it sets due', async () => {
    const { el, q } = await open();
    expect([...el.querySelectorAll('[data-testid^="template-"] h2')].map((h) => h.textContent)).toEqual([
      'New measuring system', 'New reagent lot', 'Relocated instrument', 'Other change (the director picks the requirements)',
    ]);
    expect(q('template-new-system')?.textContent).toContain('Comparison with the current method: Method comparison');
    expect(q('template-new-system')?.textContent).toContain('Yearly comparison: 12 months after go-live');
    expect(q('template-relocation')?.textContent).toContain('None.');
  });

  it('saves an edited template with the version it read', async () => {
    const { fixture, q, click, write, loader } = await open();
    await click('edit-template-new-system');
    expect(q('template-editor')).not.toBeNull();
    await write('requirement-rule-1', '5 days × 5 replicates');
    await click('requirement-add');
    await write('requirement-label-2', 'Reportable range');
    const kinds = await loader.getHarness(MatSelectHarness.with({ selector: '[data-testid="requirement-kinds-2"]' }));
    await kinds.open();
    await kinds.clickOptions({ text: 'Reportable range' });
    await click('due-rule-add');
    await write('due-rule-label-1', 'Half-yearly precision');
    await write('due-rule-months-1', '6');
    await click('template-save');
    const req = httpController().expectOne({ method: 'PUT', url: '/api/v1/release-templates/new-system' });
    expect(req.request.body).toEqual({
      version: 2,
      requirements: [
        { key: 'comparison', label: 'Comparison with the current method', kinds: ['method-comparison'], rule: 'At least 40 specimens' },
        { key: 'precision', label: 'Precision', kinds: ['precision'], rule: '5 days × 5 replicates' },
        { key: 'reportable-range', label: 'Reportable range', kinds: ['reportable-range'], rule: '' },
      ],
      dueRules: [
        { key: 'yearly-comparison', label: 'Yearly comparison', months: 12, rule: '', kinds: ['method-comparison'] },
        { key: 'half-yearly-precision', label: 'Half-yearly precision', months: 6, rule: '', kinds: [] },
      ],
    });
    req.flush({ ...templates()[0], version: 3, requirements: req.request.body.requirements, dueRules: req.request.body.dueRules });
    await fixture.whenStable();
    expect(q('template-editor')).toBeNull();
    expect(q('template-new-system')?.textContent).toContain('Half-yearly precision: 6 months after go-live');
  });

  it('checks the fields before sending: a nameless requirement and months out of range', async () => {
    const { q, click, write } = await open();
    await click('edit-template-reagent-lot');
    await write('requirement-label-0', '  ');
    await click('due-rule-add');
    await write('due-rule-label-0', 'Lot re-check');
    await write('due-rule-months-0', '0');
    await click('template-save');
    httpController().expectNone('/api/v1/release-templates/reagent-lot');
    expect(q('requirement-label-error-0')?.textContent).toBe('Give the requirement a name');
    expect(q('due-rule-months-error-0')?.textContent).toBe('At least 1 month');
  });

  it('shows the server’s field errors next to their fields, and a stale version in words', async () => {
    const { fixture, q, click } = await open();
    await click('edit-template-new-system');
    await click('template-save');
    httpController().expectOne('/api/v1/release-templates/new-system').flush(
      apiError('The template was not saved', [
        { path: 'requirements.1.label', message: 'Another requirement has this name' },
        { path: 'requirements.0.key', message: 'The key "comparison" is used twice' },
        { path: 'dueRules.0.months', message: 'At most 60 months' },
      ]),
      { status: 400, statusText: 'Bad Request' },
    );
    await fixture.whenStable();
    expect(q('requirement-label-error-1')?.textContent).toBe('Another requirement has this name');
    expect(q('requirement-key-error-0')?.textContent).toBe('The key "comparison" is used twice');
    expect(q('due-rule-months-error-0')?.textContent).toBe('At most 60 months');
    expect(q('banner')?.textContent).toContain('The template was not saved');
    await click('template-save');
    httpController().expectNone('/api/v1/release-templates/new-system');
  });

  it('says so when someone else saved the template meanwhile', async () => {
    const { fixture, q, click } = await open();
    await click('edit-template-relocation');
    await click('template-save');
    httpController().expectOne('/api/v1/release-templates/relocation').flush(
      apiError('Someone else changed this template since you opened it; reload the page'), { status: 409, statusText: 'Conflict' },
    );
    await fixture.whenStable();
    expect(q('banner')?.textContent).toContain('Someone else changed this template');
    expect(q('template-editor')).not.toBeNull();
  });
});
