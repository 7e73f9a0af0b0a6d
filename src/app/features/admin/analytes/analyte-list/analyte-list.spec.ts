import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import type { Analyte } from '@shared/schemas';
import { httpController, noAnimations, provideTestHttp } from '../../../../../testing/http';
import { AnalyteList } from './analyte-list';

const GLUCOSE: Analyte = {
  id: 4, name: 'Glucose', unit: 'mmol/L', decimals: 1, decisionLevels: [3.9, 7, 11.1],
  allowableBiasAbsolute: 0.3, allowableBiasPercent: 5, allowableBiasSource: 'Our regulator’s acceptance limit',
  canBeNegative: false, active: true,
};

async function setUp() {
  TestBed.configureTestingModule({ providers: [...provideTestHttp(), noAnimations] });
  const fixture = TestBed.createComponent(AnalyteList);
  await fixture.whenStable();
  httpController().expectOne({ method: 'GET', url: '/api/v1/analytes' }).flush([GLUCOSE]);
  await fixture.whenStable();
  return { loader: TestbedHarnessEnvironment.loader(fixture), root: TestbedHarnessEnvironment.documentRootLoader(fixture) };
}

const field = (testId: string) => MatInputHarness.with({ selector: `[data-testid="${testId}"]` });

describe('AnalyteList', () => {
  afterEach(() => httpController().verify());

  it('shows decision levels, the allowable bias and its source', async () => {
    const { loader } = await setUp();
    const [row] = await (await loader.getHarness(MatTableHarness)).getRows();
    const cells = await row.getCellTextByColumnName();
    expect(cells['levels']).toBe('3.9, 7, 11.1');
    expect(cells['bias']).toBe('± 0.3 mmol/L or ± 5 %');
    expect(cells['source']).toBe('Our regulator’s acceptance limit');
  });

  it('refuses a new analyte without an allowable bias before sending anything', async () => {
    const { loader, root } = await setUp();
    await (await loader.getHarness(MatButtonHarness.with({ text: /Add an analyte/ }))).click();
    const dialog = await root.getHarness(MatDialogHarness);
    await (await dialog.getHarness(field('analyte-name'))).setValue('Urea');
    await (await dialog.getHarness(field('analyte-unit'))).setValue('mmol/L');
    await (await dialog.getHarness(field('analyte-source'))).setValue('Biological variation, desirable');
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Save' }))).click();
    httpController().expectNone('/api/v1/analytes');
    expect(document.querySelector('mat-dialog-container')?.textContent).toContain('Give an allowable bias (absolute, percent or both)');
  });

  it('creates an analyte with its decision levels read from the list', async () => {
    const { loader, root } = await setUp();
    await (await loader.getHarness(MatButtonHarness.with({ text: /Add an analyte/ }))).click();
    const dialog = await root.getHarness(MatDialogHarness);
    await (await dialog.getHarness(field('analyte-name'))).setValue('Urea');
    await (await dialog.getHarness(field('analyte-unit'))).setValue('mmol/L');
    await (await dialog.getHarness(field('analyte-levels'))).setValue('2.5; 7.1, 20');
    await (await dialog.getHarness(field('analyte-bias-pct'))).setValue('8');
    await (await dialog.getHarness(field('analyte-source'))).setValue('Biological variation, desirable');
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Save' }))).click();
    const req = httpController().expectOne({ method: 'POST', url: '/api/v1/analytes' });
    expect(req.request.body).toEqual({
      name: 'Urea', unit: 'mmol/L', decimals: 2, decisionLevels: [2.5, 7.1, 20], allowableBiasAbsolute: null,
      allowableBiasPercent: 8, allowableBiasSource: 'Biological variation, desirable', canBeNegative: false, active: true,
    });
    req.flush({ ...req.request.body, id: 5 }, { status: 201, statusText: 'Created' });
    const names = (await (await loader.getHarness(MatTableHarness)).getCellTextByColumnName())['name'].text;
    expect(names).toEqual(['Glucose', 'Urea']);
  });

  it('edits an analyte with PUT and says which entry of the list is wrong', async () => {
    const { loader, root } = await setUp();
    await (await loader.getHarness(MatButtonHarness.with({ selector: '[data-testid="edit"]' }))).click();
    const dialog = await root.getHarness(MatDialogHarness);
    const levels = await dialog.getHarness(field('analyte-levels'));
    expect(await levels.getValue()).toBe('3.9, 7, 11.1');
    await levels.setValue('3.9, seven');
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Save' }))).click();
    httpController().expectNone('/api/v1/analytes/4');
    expect(document.querySelector('mat-dialog-container')?.textContent).toContain('Write numbers separated by commas');
    await levels.setValue('4.0');
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Save' }))).click();
    const req = httpController().expectOne({ method: 'PUT', url: '/api/v1/analytes/4' });
    expect(req.request.body.decisionLevels).toEqual([4]);
    req.flush({ ...GLUCOSE, decisionLevels: [4] });
    const [row] = await (await loader.getHarness(MatTableHarness)).getRows();
    expect((await row.getCellTextByColumnName())['levels']).toBe('4');
  });
});
