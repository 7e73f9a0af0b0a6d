import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import { MatSelectHarness } from '@angular/material/select/testing';
import type { UploadPreview } from '@shared/schemas';
import { apiError, httpController, noAnimations, provideTestHttp } from '../../../../../testing/http';
import { glucoseRows, specimensAnswer } from '../../../../../testing/engine-findings';
import { COMPARISON_LAYOUT } from '../specimen-layout';
import { UploadDialog, UploadDialogData } from './upload-dialog';

/** POST /studies/12/uploads's answer for a four-column CSV of three pairs, as the server's reading worker makes it. */
function preview(patch: Partial<UploadPreview> = {}): UploadPreview {
  return {
    uploadId: 31, fileName: 'glucose-pairs.csv', sha256: 'c'.repeat(64), columns: ['Specimen', 'Current analyzer', 'New analyzer', 'Comment'],
    preview: [['G01', '3.0', '3.1', ''], ['G02', '3.5', '3.6', 'lipaemic'], ['G03', '4.0', '4.2', '']], rowCount: 3,
    suggestedMapping: { label: 'Specimen', comparative: 'Current analyzer', candidate: 'New analyzer', note: 'Comment' },
    warnings: [], labelChecks: {}, suggestedMode: 'replace', ...patch,
  };
}

async function open(rowCount = 0) {
  const close = jest.fn();
  const data: UploadDialogData = { studyId: 12, version: 4, layout: COMPARISON_LAYOUT, rowCount };
  TestBed.configureTestingModule({
    providers: [...provideTestHttp(), noAnimations, { provide: MAT_DIALOG_DATA, useValue: data }, { provide: MatDialogRef, useValue: { close } }],
  });
  const fixture = TestBed.createComponent(UploadDialog);
  await fixture.whenStable();
  const loader = TestbedHarnessEnvironment.loader(fixture);
  const el = fixture.nativeElement as HTMLElement;
  const text = (id: string) => el.querySelector(`[data-testid="${id}"]`)?.textContent?.replace(/\s+/g, ' ').trim() ?? null;
  const importButton = () => el.querySelector('[data-testid="upload-import"]') as HTMLButtonElement;
  const errors = () => Array.from(el.querySelectorAll('p.field-error')).map((p) => p.textContent!.trim());
  /** The preview's warnings, one a line, without their icons. */
  const warnings = () => Array.from(el.querySelectorAll('[data-testid="upload-warnings"] li')).map((li) => li.textContent!.replace('warning_amber', '').trim());
  const banner = () => el.querySelector('[data-testid="banner"] span')?.textContent?.trim() ?? null;
  /** Chooses a file in the file input; the dialog sends it at once. */
  const choose = async (answer: UploadPreview | { status: number; body: ReturnType<typeof apiError> }) => {
    const input = el.querySelector('[data-testid="upload-file"]') as HTMLInputElement;
    const file = new File(['Specimen,Current analyzer,New analyzer,Comment\n'], 'glucose-pairs.csv', { type: 'text/csv' });
    Object.defineProperty(input, 'files', { value: [file], configurable: true });
    input.dispatchEvent(new Event('change'));
    const req = httpController().expectOne({ method: 'POST', url: '/api/v1/studies/12/uploads' });
    expect(((req.request.body as FormData).get('file') as File).name).toBe('glucose-pairs.csv');
    if ('status' in answer) req.flush(answer.body, { status: answer.status, statusText: 'Error' });
    else req.flush(answer);
    await fixture.whenStable();
  };
  const select = (field: string) => loader.getHarness(MatSelectHarness.with({ selector: `[data-testid="map-${field}"]` }));
  return { fixture, el, close, text, importButton, errors, warnings, banner, choose, select };
}

describe('UploadDialog', () => {
  afterEach(() => httpController().verify());

  it('shows the file’s first rows and the suggested mapping, and imports into an empty grid by replacing it', async () => {
    const { fixture, el, close, text, importButton, choose, select } = await open(0);
    expect(importButton().disabled).toBe(true);
    await choose(preview());
    expect(text('upload-summary')).toBe('glucose-pairs.csv: 3 rows, 4 columns.');
    expect(Array.from(el.querySelectorAll('[data-testid="upload-preview"] tbody tr')).map((tr) => Array.from(tr.children).map((c) => c.textContent!.trim()))).toEqual([
      ['G01', '3.0', '3.1', ''], ['G02', '3.5', '3.6', 'lipaemic'], ['G03', '4.0', '4.2', ''],
    ]);
    expect(await (await select('comparative')).getValueText()).toBe('Current analyzer');
    expect(await (await select('candidate')).getValueText()).toBe('New analyzer');
    expect(text('upload-warnings')).toBeNull();
    expect(text('replace-warning')).toBeNull();
    expect(importButton().disabled).toBe(false);
    importButton().click();
    const req = httpController().expectOne({ method: 'POST', url: '/api/v1/studies/12/uploads/31/import' });
    expect(req.request.body).toEqual({
      version: 4, mode: 'replace', mapping: { label: 'Specimen', comparative: 'Current analyzer', candidate: 'New analyzer', note: 'Comment' },
    });
    const rows = specimensAnswer(glucoseRows(3), 5);
    req.flush(rows);
    await fixture.whenStable();
    expect(close).toHaveBeenCalledWith(rows);
  });

  it('asks for the result columns the mapping lacks, and for a column not used twice, before it imports', async () => {
    const { fixture, text, importButton, errors, warnings, choose, select } = await open(0);
    await choose(preview({ suggestedMapping: { comparative: 'Current analyzer' }, warnings: [] }));
    expect(errors()).toEqual(['Choose the column for candidate result.']);
    expect(warnings()).toEqual([
      'Not mapped: specimen label — no column of the file is chosen for it; the rows come in unlabelled',
      'Not mapped: note — no column of the file is chosen for it; the rows come in without it',
    ]);
    expect(importButton().disabled).toBe(true);
    await (await select('candidate')).clickOptions({ text: 'Current analyzer' });
    await fixture.whenStable();
    expect(errors()).toEqual(['The column "Current analyzer" is mapped to more than one field.']);
    expect(importButton().disabled).toBe(true);
    await (await select('candidate')).clickOptions({ text: 'New analyzer' });
    await fixture.whenStable();
    expect(errors()).toEqual([]);
    expect(importButton().disabled).toBe(false);
    importButton().click();
    expect(httpController().expectOne('/api/v1/studies/12/uploads/31/import').request.body.mapping).toEqual({ comparative: 'Current analyzer', candidate: 'New analyzer' });
  });

  it('adds after the rows in the grid unless the file repeats most of the study’s labels; then it suggests replacing them', async () => {
    const adding = await open(40);
    await adding.choose(preview());
    expect(adding.text('replace-warning')).toBeNull();
    adding.importButton().click();
    expect(httpController().expectOne('/api/v1/studies/12/uploads/31/import').request.body.mode).toBe('append');
    TestBed.resetTestingModule();

    const again = await open(40);
    const repeats = { warnings: ['3 rows repeat labels already in the study (G01, G02, G03)'], repeatsMostOfStudy: true };
    await again.choose(preview({ labelChecks: { Specimen: repeats }, warnings: repeats.warnings }));
    expect(again.warnings()).toEqual(['3 rows repeat labels already in the study (G01, G02, G03)']);
    expect(again.text('repeat-advice')).toMatch(/^The file repeats most of the study's labels/);
    expect(again.text('replace-warning')).toBe('This replaces the 40 rows now in the grid (the change is kept in the study\'s history).');
    (again.el.querySelector('[data-testid="mode-append"] input') as HTMLInputElement).click();
    await again.fixture.whenStable();
    expect(again.text('replace-warning')).toBeNull();
    again.importButton().click();
    expect(httpController().expectOne('/api/v1/studies/12/uploads/31/import').request.body.mode).toBe('append');
  });

  it('shows a refused import with the rows and fields the server names, and stays open', async () => {
    const { fixture, close, banner, importButton, choose } = await open(0);
    await choose(preview());
    importButton().click();
    const issues = Array.from({ length: 7 }, (_, i) => ({ path: `rows.${i}.candidate`, message: `file row ${i + 2}: candidate result "n/a" is not a number` }));
    httpController().expectOne('/api/v1/studies/12/uploads/31/import').flush(
      apiError('file row 2: candidate result "n/a" is not a number (and 6 more problems)', issues), { status: 400, statusText: 'Bad Request' },
    );
    await fixture.whenStable();
    expect(banner()).toBe(
      'file row 2: candidate result "n/a" is not a number (and 6 more problems) · file row 2: candidate result "n/a" is not a number · ' +
        'file row 3: candidate result "n/a" is not a number · file row 4: candidate result "n/a" is not a number · ' +
        'file row 5: candidate result "n/a" is not a number · file row 6: candidate result "n/a" is not a number · and 2 more',
    );
    expect(close).not.toHaveBeenCalled();
    expect(importButton().disabled).toBe(false);
  });

  it('shows why a file was refused, and offers no import', async () => {
    const { banner, importButton, choose, text } = await open(0);
    const message = 'The file is larger than 5 MB, the most one file may be; split it or remove columns you do not need';
    await choose({ status: 413, body: apiError(message, [{ path: 'file', message }]) });
    expect(banner()).toBe(message);
    expect(text('upload-summary')).toBeNull();
    expect(importButton().disabled).toBe(true);
  });
});
