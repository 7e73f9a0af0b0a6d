import { Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { noAnimations, provideTestHttp } from '../../testing/http';
import { provideSession, restoreSession, sessionUser } from '../../testing/session-users';
import { DayDateAdapter, DayDates } from './day-dates';

@Component({
  template: `<mat-form-field><input matInput [matDatepicker]="p" [formControl]="day" /><mat-datepicker #p /></mat-form-field>`,
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, DayDates],
})
class DayField {
  readonly day = new FormControl<string | null>('2026-03-29');
}

describe('DayDateAdapter', () => {
  const adapter = () => TestBed.inject(DayDateAdapter);
  beforeEach(() => TestBed.configureTestingModule({ providers: [...provideTestHttp(), DayDateAdapter] }));

  it('reads and writes a day as yyyy-mm-dd and refuses look-alikes', () => {
    expect(adapter().parse(' 2026-03-29 ')).toBe('2026-03-29');
    expect(adapter().parse('')).toBeNull();
    expect(adapter().isValid(adapter().parse('03/29/2026')!)).toBe(false);
    expect(adapter().isValid(adapter().parse('2026-02-30')!)).toBe(false);
    expect(adapter().format('2026-03-29', 'yyyy-mm-dd')).toBe('2026-03-29');
    expect(adapter().format('2026-03-29', 'month-year')).toBe('Mar 2026');
    expect(adapter().format('2026-03-29', 'long')).toBe('Sunday, 29 March 2026');
  });

  it('does the calendar arithmetic the picker needs', () => {
    expect(adapter().getDayOfWeek('2026-03-29')).toBe(0);
    expect(adapter().getNumDaysInMonth('2028-02-10')).toBe(29);
    expect(adapter().addCalendarMonths('2026-03-31', 1)).toBe('2026-04-30');
    expect(adapter().addCalendarMonths('2026-01-15', -2)).toBe('2025-11-15');
    expect(adapter().addCalendarYears('2028-02-29', 1)).toBe('2029-02-28');
    expect(adapter().addCalendarDays('2026-12-31', 1)).toBe('2027-01-01');
    expect(adapter().createDate(2026, 0, 5)).toBe('2026-01-05');
    expect(() => adapter().createDate(2026, 1, 30)).toThrow();
    expect(adapter().getDayOfWeekNames('short')).toEqual(['Sun', 'Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat']);
    expect(adapter().getFirstDayOfWeek()).toBe(1);
  });

  it("takes today from the laboratory's zone", async () => {
    TestBed.resetTestingModule();
    TestBed.configureTestingModule({ providers: [...provideTestHttp(), provideSession(sessionUser(['quality'])), DayDateAdapter] });
    await restoreSession();
    jest.useFakeTimers({ now: new Date('2026-07-01T23:30:00Z') });
    try {
      // 23:30 UTC is already 00:30 on the 2nd in Lisbon.
      expect(adapter().today()).toBe('2026-07-02');
    } finally {
      jest.useRealTimers();
    }
  });
});

describe('a date field with DayDates', () => {
  async function render() {
    TestBed.configureTestingModule({ providers: [...provideTestHttp(), provideSession(sessionUser(['quality'])), noAnimations] });
    await restoreSession();
    const fixture = TestBed.createComponent(DayField);
    await fixture.whenStable();
    const input = (fixture.nativeElement as HTMLElement).querySelector('input') as HTMLInputElement;
    return { fixture, input, control: fixture.componentInstance.day };
  }

  it('shows the control’s day as yyyy-mm-dd and hands a typed day on as that same text', async () => {
    const { fixture, input, control } = await render();
    expect(input.value).toBe('2026-03-29');
    input.value = '2026-11-30';
    input.dispatchEvent(new Event('input'));
    await fixture.whenStable();
    expect(control.value).toBe('2026-11-30');
    expect(control.valid).toBe(true);
  });

  it('shows the form a day takes, yyyy-mm-dd, in an empty field', async () => {
    const { fixture, input, control } = await render();
    expect(input.getAttribute('placeholder')).toBe('yyyy-mm-dd');
    control.setValue(null);
    await fixture.whenStable();
    expect(input.value).toBe('');
    expect(input.getAttribute('placeholder')).toBe('yyyy-mm-dd');
  });

  it('marks text that is not a yyyy-mm-dd day as an error and holds no day', async () => {
    const { fixture, input, control } = await render();
    input.value = '11/30/2026';
    input.dispatchEvent(new Event('input'));
    await fixture.whenStable();
    expect(control.value).toBeNull();
    expect(control.hasError('matDatepickerParse')).toBe(true);
  });
});
