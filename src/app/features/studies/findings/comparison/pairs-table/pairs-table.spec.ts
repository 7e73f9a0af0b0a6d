import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { Component, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatSortHarness } from '@angular/material/sort/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { noAnimations } from '../../../../../../testing/http';
import { type PairRow, pairFormat } from './pair-rows';
import { PairsTable, pairSortValue } from './pairs-table';

const pair = (position: number, label: string, difference: number, over: Partial<PairRow> = {}): PairRow => ({
  position, label, comparative: 5, candidate: 5 + difference, difference, percent: 20 * difference, standardized: difference * 2,
  excluded: false, reason: '', outlier: false, beyondLimits: false, ...over,
});
const PAIRS = [
  pair(1, 'VH-001', 0.2),
  pair(2, 'VH-002', -0.4, { outlier: true, beyondLimits: true }),
  pair(3, 'VH-003', 0.9, { excluded: true, reason: 'clotted' }),
  pair(4, 'VH-004', 0, { percent: null, standardized: null }),
];

@Component({
  imports: [PairsTable],
  template: `<app-pairs-table [rows]="rows()" [format]="format" [(selected)]="selected" />`,
})
class Host {
  readonly rows = signal<PairRow[] | null>(PAIRS);
  readonly format = pairFormat({ decimals: 1 }, 'mmol/L', 'absolute');
  readonly selected = signal<number | null>(null);
}

async function setUp() {
  TestBed.configureTestingModule({ providers: [noAnimations] });
  const fixture = TestBed.createComponent(Host);
  await fixture.whenStable();
  const loader = TestbedHarnessEnvironment.loader(fixture);
  const el = fixture.nativeElement as HTMLElement;
  const column = async (name: string): Promise<string[]> => (await (await loader.getHarness(MatTableHarness)).getCellTextByColumnName())[name].text;
  return { fixture, loader, el, column };
}

describe('PairsTable', () => {
  it('lists every pair with both results, the differences and its flags in words', async () => {
    const { column, el } = await setUp();
    expect(await column('label')).toEqual(['VH-001', 'VH-002', 'VH-003', 'VH-004']);
    expect(await column('candidate')).toEqual(['5.2', '4.6', '5.9', '5.0']);
    expect(await column('difference')).toEqual(['0.2', '−0.4', '0.9', '0.0']);
    expect(await column('percent')).toEqual(['4.0', '−8.0', '18.0', '—']);
    expect(await column('standardized')).toEqual(['0.40', '−0.80', '1.80', '—']);
    expect(await column('flags')).toEqual(['', 'Possible outlier Beyond the limits of agreement', 'Excluded: clotted', '']);
    expect(el.querySelector('th.mat-column-difference')!.textContent).toContain('Difference y − x (mmol/L)');
    expect(el.querySelector('[data-testid="pairs"]')!.textContent).toContain('4 pairs; 1 possible outlier, 1 beyond the limits of agreement, 1 excluded.');
  });

  it('sorts by the signed difference both ways, and by flags', async () => {
    const { loader, column } = await setUp();
    const [header] = await (await loader.getHarness(MatSortHarness)).getSortHeaders({ label: /Difference y − x/ });
    await header.click();
    expect(await column('label')).toEqual(['VH-002', 'VH-004', 'VH-001', 'VH-003']);
    await header.click();
    expect(await column('label')).toEqual(['VH-003', 'VH-001', 'VH-004', 'VH-002']);
    expect(pairSortValue(PAIRS[1], 'flags')).toBe(2);
    expect(pairSortValue(PAIRS[3], 'percent')).toBeNull();
    expect(pairSortValue(PAIRS[0], 'anything else')).toBe(1);
  });

  it('selects the row of a point chosen on a plot, and scrolls it into view', async () => {
    const { fixture, el } = await setUp();
    const scrolled: string[] = [];
    Element.prototype.scrollIntoView = function (this: Element) {
      scrolled.push(this.getAttribute('data-testid') ?? '');
    };
    fixture.componentInstance.selected.set(3);
    await fixture.whenStable();
    const row = el.querySelector('[data-testid="pair-3"]')!;
    expect(row.classList).toContain('selected');
    expect(row.getAttribute('aria-current')).toBe('true');
    expect(el.querySelectorAll('tr.selected')).toHaveLength(1);
    expect(scrolled).toContain('pair-3');
  });

  it('hands a clicked or Entered row to the plots as the selection, and a second click clears it', async () => {
    const { fixture, el } = await setUp();
    (el.querySelector('[data-testid="pair-2"]') as HTMLElement).click();
    await fixture.whenStable();
    expect(fixture.componentInstance.selected()).toBe(2);
    (el.querySelector('[data-testid="pair-2"]') as HTMLElement).click();
    await fixture.whenStable();
    expect(fixture.componentInstance.selected()).toBeNull();
    el.querySelector('[data-testid="pair-4"]')!.dispatchEvent(new KeyboardEvent('keydown', { key: 'Enter' }));
    await fixture.whenStable();
    expect(fixture.componentInstance.selected()).toBe(4);
  });

  it('says why there are no pairs when the rows changed after the analysis', async () => {
    const { fixture, el } = await setUp();
    fixture.componentInstance.rows.set(null);
    await fixture.whenStable();
    expect(el.querySelector('[data-testid="pairs-stale"]')).not.toBeNull();
    expect(el.querySelector('table')).toBeNull();
  });
});
